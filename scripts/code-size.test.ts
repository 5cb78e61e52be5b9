// The house rule on size (DEVELOPERS.md, Conventions): no function over 150 lines, and no file over 300 lines
// without a reason stated at its top ("Long file: …" in its first 30 lines). The file rule holds for tests and specs
// too; the function rule does not (a test file's describe callbacks group its tests and grow with them).
// Every TypeScript and .mjs file git would commit is read, tracked or new, so a file not yet added is held too.
import { execFileSync } from "node:child_process";
import { existsSync, readFileSync } from "node:fs";
import path from "node:path";
import ts from "typescript";
import { describe, expect, it } from "vitest";

const root = path.resolve(import.meta.dirname, "..");
const MAX_FUNCTION_LINES = 150;
const MAX_FILE_LINES = 300;

const files = execFileSync("git", ["ls-files", "--cached", "--others", "--exclude-standard"], { cwd: root })
  .toString()
  .split("\n")
  .filter((f) => /\.(tsx?|mjs)$/.test(f) && !f.endsWith(".d.ts") && existsSync(path.join(root, f)));
const isTest = (f: string) => /\.(test|spec)\.tsx?$/.test(f);
const sources = files.filter((f) => !isTest(f));

/** Functions longer than the limit in one file: "name (N lines, from line L)". */
function longFunctions(file: string, text: string): string[] {
  const source = ts.createSourceFile(file, text, ts.ScriptTarget.Latest, true);
  const found: string[] = [];
  const visit = (node: ts.Node) => {
    if (ts.isFunctionLike(node) && "body" in node && node.body) {
      const start = source.getLineAndCharacterOfPosition(node.getStart()).line;
      const end = source.getLineAndCharacterOfPosition(node.getEnd()).line;
      const lines = end - start + 1;
      if (lines > MAX_FUNCTION_LINES) {
        const name =
          node.name?.getText(source) ??
          (ts.isVariableDeclaration(node.parent) ? node.parent.name.getText(source) : "a function");
        found.push(`${name} (${lines} lines, from line ${start + 1})`);
      }
    }
    ts.forEachChild(node, visit);
  };
  visit(source);
  return found;
}

describe("code size", () => {
  it("reads the tree (the rule is not vacuous)", () => {
    expect(sources.length).toBeGreaterThan(100);
    expect(longFunctions("x.ts", `function f() {\n${"  f();\n".repeat(160)}}\n`)).toEqual([
      "f (162 lines, from line 1)",
    ]);
  });

  it("reads new files and .mjs files too", () => {
    expect(files.some((f) => f.endsWith(".mjs"))).toBe(true);
    expect(files.some(isTest)).toBe(true);
  });

  it.each(files)(
    "%s: no function over 150 lines (tests aside), and a reason at the top of a file over 300",
    (file) => {
      const text = readFileSync(path.join(root, file), "utf8");
      if (!isTest(file)) expect(longFunctions(file, text)).toEqual([]);
      const lines = text.split("\n").length;
      if (lines > MAX_FILE_LINES) {
        const head = text.split("\n").slice(0, 30).join("\n");
        expect(head, `${file} has ${lines} lines and states no reason ("Long file: …")`).toMatch(
          /Long file: \S/,
        );
      }
    },
  );
});
