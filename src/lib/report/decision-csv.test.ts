import { describe, expect, it } from "vitest";
import type { DecisionSnapshot } from "@/lib/projects/decisions";
import { decisionCsv, sensible } from "./decision-csv";

// A hand-made snapshot: two candidates stored in the order they were added (B first), ranked A first.
const snapshot = {
  takenAt: "2026-01-01T00:00:00.000Z",
  project: { id: "p", name: "P", description: null, caseTemp: 85 },
  policy: { caseTemp: 85, utilisationLimit: 0.8, tjGuard: 25, betweenCurves: "loglog" },
  candidates: [
    { partId: "b", partNumber: "B-1", maker: "Maker B", status: "draft", unitCost: null, currency: null },
    {
      partId: "a",
      partNumber: "A-1",
      maker: "Maker A",
      status: "verified",
      verifiedByName: "Lead Person",
      unitCost: 1.5,
      currency: "EUR",
    },
  ],
  pulses: [{ id: "x", name: "Inrush", source: "fault-case", v: 48, i: 1.5, duration: 0.048, caseTemp: 85 }],
  results: {
    a: {
      x: {
        verdict: "pass",
        utilisation: 0.123456789012345,
        allowedCurrent: 12.3456789,
        tjPeak: 101.23456,
        flags: [],
      },
    },
    b: {
      x: {
        verdict: "fail",
        utilisation: 1.98765432109876,
        allowedCurrent: 0.754321,
        tjPeak: null,
        flags: [],
      },
    },
  },
  worstByPulse: {},
  ranking: [
    { partId: "a", rank: 1, worstVerdict: "pass", worstUtilisation: 0.123456789012345, passesAll: true },
    { partId: "b", rank: 2, worstVerdict: "fail", worstUtilisation: 1.98765432109876, passesAll: false },
  ],
} as unknown as DecisionSnapshot;

describe("decisionCsv", () => {
  it("lists candidates in rank order, not in the order they were added", () => {
    const lines = decisionCsv(snapshot).split("\r\n");
    expect(lines[1].startsWith("1,A-1,")).toBe(true);
    expect(lines[2].startsWith("2,B-1,")).toBe(true);
  });

  it("rounds numbers to four significant figures", () => {
    const csv = decisionCsv(snapshot);
    expect(csv).toContain(",0.1235,");
    expect(csv).toContain(",1.988,");
    expect(csv).not.toMatch(/\d{9,}/);
  });

  it("carries each candidate's library status and verifier as frozen", () => {
    const [header, a, b] = decisionCsv(snapshot).split("\r\n");
    expect(header).toContain("library_status,verified_by");
    expect(a).toContain(",verified,Lead Person,");
    expect(b).toContain(",draft,,");
  });

  // CSV injection: a spreadsheet runs a cell starting with =, +, - or @ as a formula (OWASP, "CSV Injection").
  it("quotes a typed name a spreadsheet would run as a formula, and leaves numbers alone", () => {
    const hostile = structuredClone(snapshot);
    hostile.candidates[1].partNumber = '=HYPERLINK("x")';
    hostile.candidates[1].maker = "@SUM(A1)";
    hostile.pulses[0].name = "-2+3";
    hostile.pulses[0].v = -48;
    const a = decisionCsv(hostile).split("\r\n")[1];
    expect(a).toContain(`"'=HYPERLINK(""x"")"`);
    expect(a).toContain(`"'@SUM(A1)"`);
    expect(a).toContain(`"'-2+3"`);
    expect(a).toContain(",-48,");
  });

  it("sensible() leaves missing and non-finite values empty", () => {
    expect(sensible(null)).toBe("");
    expect(sensible(Number.NaN)).toBe("");
    expect(sensible(0.000123456)).toBe(0.0001235);
  });
});
