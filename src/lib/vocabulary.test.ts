import { readdirSync, readFileSync, statSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { readExample } from "@/test/examples";
import { REPLACED_WORDS } from "./vocabulary";

const root = path.join(import.meta.dirname, "..");

function files(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const full = path.join(dir, name);
    if (statSync(full).isDirectory()) return files(full);
    return /\.tsx?$/.test(name) && !/\.test\.tsx?$/.test(name) ? [full] : [];
  });
}

describe("the product's vocabulary", () => {
  it("no component, page or demo text uses a word we replaced by our own", () => {
    const sources = [
      ...files(path.join(root, "components")),
      ...files(path.join(root, "app")),
      ...files(path.join(root, "lib", "demo")),
    ];
    expect(sources.length).toBeGreaterThan(50);
    const found: string[] = [];
    for (const file of sources) {
      const text = readFileSync(file, "utf8").toLowerCase();
      for (const word of Object.keys(REPLACED_WORDS)) {
        if (text.includes(word))
          found.push(`${path.relative(root, file)}: "${word}" (say "${REPLACED_WORDS[word]}")`);
      }
    }
    expect(found).toEqual([]);
  });

  it("the paired-columns example names its quantities, not a digitiser's axis letters", () => {
    expect(readExample("soa-curves-paired.csv").split("\n")[1]).toMatch(/^V_DS \[V\],I_D \[A\]/);
  });
});
