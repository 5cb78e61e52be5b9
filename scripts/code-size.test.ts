// The house rule on size (DEVELOPERS.md, Conventions): no function over 150 lines, and no file over 300 lines
// without a reason stated at its top (a comment "Long file: …" in its first 30 lines, whose reason is a sentence). The file rule holds for tests and specs
// too; the function rule does not (a test file's describe callbacks group its tests and grow with them).
// Every TypeScript and JavaScript file git would commit is read, tracked or new, so a file not yet added is held too.
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
  .filter((f) => /\.([cm]?[jt]sx?)$/.test(f) && !f.endsWith(".d.ts") && existsSync(path.join(root, f)));
const isTest = (f: string) => /\.(test|spec)\.[cm]?[jt]sx?$/.test(f);

/**
 * The reason a long file states: a comment line (// or within a block comment) in its first 30 lines that says
 * "Long file:" and then at least 20 characters of reason, so a bare "Long file: x" or the words in code do not pass.
 */
function statedReason(text: string): string | null {
  for (const line of text.split("\n").slice(0, 30)) {
    const match = /^\s*(?:\/\/|\/?\*+)\s*Long file:\s*(.+)$/.exec(line);
    if (match && match[1].replace(/\*\/\s*$/, "").trim().length >= 20) return match[1].trim();
  }
  return null;
}
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

  it("takes a reason only from a comment, and only a sentence", () => {
    expect(statedReason("// Long file: the table of every route, pinned in one place.\n")).not.toBeNull();
    expect(
      statedReason("/**\n * Long file: one parser for every column kind, kept together.\n */\n"),
    ).not.toBeNull();
    expect(statedReason("// Long file: x\n")).toBeNull();
    expect(statedReason('const s = "Long file: a reason that is long enough";\n')).toBeNull();
    expect(
      statedReason(`${"// filler\n".repeat(30)}// Long file: stated too late to be seen at the top.\n`),
    ).toBeNull();
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
        expect(
          statedReason(text),
          `${file} has ${lines} lines and states no reason (a comment "Long file: …" in its first 30 lines)`,
        ).not.toBeNull();
      }
    },
  );
});
