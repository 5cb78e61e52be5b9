// Our choice, after issue 16: every engine test says where its expected answer comes from (DEVELOPERS.md,
// conventions). A test passes this check when the comment lines right above it, its own text, or its describe
// block's title and comment name a source (METHODS.md §N, PRODUCT.md, a standard or a paper, a named reference) or
// mark it "derived from §N", "common practice, no source", "our choice" or "from memory". DESIGN.md counts as a
// source for how values are shown (units, prefixes, significant figures): it is the product's rule for output text,
// as PRODUCT.md is for behaviour, so a formatting test's expected string comes from it, not from the code.
import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";

const marker =
  /METHODS\.md|§\s?\d+|derived from|common practice, no source|our choice|PRODUCT\.md|JESD|IEC 60747|Stout|Spirito|d3-scale|Lawson|Marquardt|Reference:|DESIGN\.md|from memory/i;
// A test's first line: `it(`, `test(`, and the table forms `it.each([` / `test.each(` whose rows follow.
const testStart = /^\s*(it|test)(\.each)?\(/;
const describeStart = /^\s*describe(\.each)?\(/;
const indent = (line: string) => /^\s*/.exec(line)?.[0].length ?? 0;
const comment = (line: string) => /^\s*(\/\/|\/\*|\*)/.test(line);

/** The comment lines directly above line k. */
function commentAbove(lines: string[], k: number): string[] {
  const above: string[] = [];
  for (let j = k - 1; j >= 0 && comment(lines[j]); j--) above.push(lines[j]);
  return above;
}

/** The first lines and comments of the describe blocks around line k (each less indented than the last). */
function enclosingDescribes(lines: string[], k: number): string[] {
  const found: string[] = [];
  let depth = indent(lines[k]);
  for (let d = k - 1; d >= 0 && depth > 0; d--) {
    if (!describeStart.test(lines[d]) || indent(lines[d]) >= depth) continue;
    found.push(lines[d], ...commentAbove(lines, d));
    depth = indent(lines[d]);
  }
  return found;
}

/**
 * Titles of the tests in `text` that name no source, with their line numbers. A test's own text runs from its
 * first line to the next test or describe, less the comment lines that belong to that next one.
 */
function unsourced(text: string): string[] {
  const lines = text.split("\n");
  const bounds = lines.flatMap((line, k) => (testStart.test(line) || describeStart.test(line) ? [k] : []));
  return bounds.flatMap((k, n) => {
    if (!testStart.test(lines[k])) return [];
    const next = bounds[n + 1] ?? lines.length;
    const end = next - (next < lines.length ? commentAbove(lines, next).length : 0);
    const own = [...commentAbove(lines, k), ...lines.slice(k, end)].join("\n");
    const block = enclosingDescribes(lines, k).join("\n");
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

  it("checks a table test written over several lines, and gives a test no credit for the next one's comment", () => {
    const table =
      'describe("x", () => {\n  it.each([\n    [1, 2],\n  ])("adds %d", (a, b) => {\n    expect(a).toBe(b);\n  });\n';
    expect(unsourced(`${table}});`)).toEqual(["2: it.each(["]);
    expect(
      unsourced(`${table}  // Our choice.\n  test.each([\n    [1],\n  ])("one %d", () => {});\n});`),
    ).toEqual(["2: it.each(["]);
    expect(
      unsourced(
        `describe("x", () => {\n  // Our choice.\n  test.each([\n    [1],\n  ])("one %d", () => {});\n});`,
      ),
    ).toEqual([]);
  });

  it("takes a describe's marking only for the tests inside it", () => {
    const text =
      'describe("a", () => {\n  // Our choice.\n  describe("inner", () => {\n    it("in", () => {});\n  });\n  it("after", () => {});\n});\nit("outside", () => {});';
    expect(unsourced(text)).toEqual(['6: it("after", () => {});', '8: it("outside", () => {});']);
  });

  for (const name of files)
    it(`every test in ${name} names its source or its marking`, () => {
      expect(unsourced(readFileSync(path.join(dir, name), "utf8"))).toEqual([]);
    });
});
