// The example files users download, served as static files from public/examples.
import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";

export const examplesDir = path.join(import.meta.dirname, "..", "..", "public", "examples");

/** The names of every example file. */
export function exampleFiles(): string[] {
  return readdirSync(examplesDir).sort();
}

/** The text of one example file, as the browser downloads it. */
export function readExample(name: string): string {
  return readFileSync(path.join(examplesDir, name), "utf8");
}
