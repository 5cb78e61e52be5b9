// Our choice, after issue 16: every engine test says where its expected answer comes from (DEVELOPERS.md,
// conventions). A test passes this check when the comment lines right above it, its own text, or its describe
// block's title and comment name a source (METHODS.md §N, PRODUCT.md, a standard or a paper, a named reference) or
// mark it "derived from §N", "common practice, no source" or "our choice".
import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";

const marker =
  /METHODS\.md|§\s?\d+|derived from|common practice, no source|our choice|PRODUCT\.md|JESD|IEC 60747|Stout|Spirito|d3-scale|Lawson|Marquardt|Reference:/i;
const testStart = /^\s*(it|test)(\.each\(.*\))?\(/;
const comment = (line: string) => /^\s*(\/\/|\/\*|\*)/.test(line);

/** The comment lines directly above line k. */
function commentAbove(lines: string[], k: number): string[] {
  const above: string[] = [];
  for (let j = k - 1; j >= 0 && comment(lines[j]); j--) above.push(lines[j]);
  return above;
}

/** Titles of the tests in `text` that name no source, with their line numbers. */
function unsourced(text: string): string[] {
  const lines = text.split("\n");
  const starts = lines.flatMap((line, k) => (testStart.test(line) ? [k] : []));
  return starts.flatMap((k, n) => {
    const end = starts[n + 1] ?? lines.length;
    let d = k;
    while (d >= 0 && !/^\s*describe\(/.test(lines[d])) d--;
    const own = [...commentAbove(lines, k), ...lines.slice(k, end)].join("\n");
    const block = d >= 0 ? [lines[d], ...commentAbove(lines, d)].join("\n") : "";
    return marker.test(own) || marker.test(block) ? [] : [`${k + 1}: ${lines[k].trim()}`];
  });
}

// Our choice (see the top of this file).
describe("engine tests name their sources", () => {
  const dir = import.meta.dirname;
  const files = readdirSync(dir).filter((name) => name.endsWith(".test.ts"));

  it("finds the engine's test files", () => {
    expect(files.length).toBeGreaterThan(20);
  });

  it("flags a test without a source and accepts each kind of marking", () => {
    expect(
      unsourced('describe("x", () => {\n  it("adds", () => {\n    expect(1 + 1).toBe(2);\n  });\n});'),
    ).toEqual(['2: it("adds", () => {']);
    for (const mark of [
      "// Derived from §4.",
      "// Common practice, no source.",
      "// Our choice.",
      "// METHODS.md §2",
    ])
      expect(unsourced(`describe("x", () => {\n  ${mark}\n  it("adds", () => {});\n});`)).toEqual([]);
  });

  for (const name of files)
    it(`every test in ${name} names its source or its marking`, () => {
      expect(unsourced(readFileSync(path.join(dir, name), "utf8"))).toEqual([]);
    });
});
