// Lists what is long in src outside tests: functions over 150 lines and files over 300, each file marked when its
// first lines state why it is that long (a comment with "on purpose" or "long because"). Prints, never fails.
// Run with `npx tsx scripts/sizes.ts [function limit] [file limit]`.
import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import ts from "typescript";

const FUNCTION_LIMIT = Number(process.argv[2] ?? 150);
const FILE_LIMIT = Number(process.argv[3] ?? 300);
const root = path.resolve(import.meta.dirname, "..");

function* sources(dir: string): Generator<string> {
  for (const entry of readdirSync(dir, { withFileTypes: true })) {
    const full = path.join(dir, entry.name);
    if (entry.isDirectory()) yield* sources(full);
    else if (/\.tsx?$/.test(entry.name) && !/\.test\.tsx?$/.test(entry.name)) yield full;
  }
}

function nameOf(node: ts.Node): string {
  if ((ts.isFunctionDeclaration(node) || ts.isMethodDeclaration(node)) && node.name)
    return node.name.getText();
  const parent = node.parent;
  if (parent && ts.isVariableDeclaration(parent)) return parent.name.getText();
  if (parent && ts.isPropertyAssignment(parent)) return parent.name.getText();
  return "(anonymous)";
}

const functions: string[] = [];
const files: string[] = [];
for (const file of sources(path.join(root, "src"))) {
  const text = readFileSync(file, "utf8");
  const relative = path.relative(root, file);
  const lines = text.split("\n").length;
  if (lines > FILE_LIMIT) {
    const head = text.split("\n").slice(0, 40).join("\n");
    const reasoned = /on purpose|long because/i.test(head);
    files.push(`${String(lines).padStart(5)}  ${relative}${reasoned ? "  (reason stated at its top)" : ""}`);
  }
  const source = ts.createSourceFile(file, text, ts.ScriptTarget.Latest, true);
  const visit = (node: ts.Node) => {
    if (
      ts.isFunctionDeclaration(node) ||
      ts.isFunctionExpression(node) ||
      ts.isArrowFunction(node) ||
      ts.isMethodDeclaration(node)
    ) {
      const start = source.getLineAndCharacterOfPosition(node.getStart()).line;
      const end = source.getLineAndCharacterOfPosition(node.getEnd()).line;
      if (end - start + 1 > FUNCTION_LIMIT) {
        functions.push(`${String(end - start + 1).padStart(5)}  ${relative}:${start + 1} ${nameOf(node)}`);
      }
    }
    ts.forEachChild(node, visit);
  };
  visit(source);
}
console.log(`functions over ${FUNCTION_LIMIT} lines (${functions.length}):`);
for (const line of functions.sort().reverse()) console.log(line);
console.log(`files over ${FILE_LIMIT} lines (${files.length}):`);
for (const line of files.sort().reverse()) console.log(line);
