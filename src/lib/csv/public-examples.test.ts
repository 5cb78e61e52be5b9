// The example files users download are static files in public/examples, linked from the curve upload panel. Each
// must read through the same parser as an upload with no error, and pass the engine's quality findings.
import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { findCurveSetIssues } from "@/lib/soa/findings";
import { exampleFiles, readExample } from "@/test/examples";
import { digitisedCurveSet, parseCurveSetCsv } from "./curve-set";

describe("public/examples", () => {
  it("holds the two curve-set examples and nothing unparsed", () => {
    expect(exampleFiles()).toEqual(["soa-curves-paired.csv", "soa-curves-table.csv"]);
  });

  for (const name of exampleFiles())
    it(`${name} parses with no error and no finding`, () => {
      const result = parseCurveSetCsv(readExample(name));
      expect(result.ok ? [] : result.errors.map((e) => e.message)).toEqual([]);
      if (!result.ok) return;
      expect(result.curves.map((c) => c.duration)).toContain("DC");
      expect(findCurveSetIssues(digitisedCurveSet(result.curves))).toEqual([]);
    });

  it("every example is linked from the upload panel", () => {
    const panel = readFileSync(
      path.join(import.meta.dirname, "..", "..", "components", "library", "curve-upload.tsx"),
      "utf8",
    );
    for (const name of exampleFiles()) expect(panel).toContain(`href="/examples/${name}"`);
  });
});
