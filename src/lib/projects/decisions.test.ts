// A decision freezes its evidence: later library and project edits change neither the record nor its report.
import { execFileSync } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { GET as reportGet } from "@/app/api/projects/[id]/decisions/[decisionId]/report/route";
import { GET as decisionGet } from "@/app/api/projects/[id]/decisions/[decisionId]/route";
import { GET as listGet, POST as signPost } from "@/app/api/projects/[id]/decisions/route";
import { GET as matrixGet } from "@/app/api/projects/[id]/matrix/route";
import { curves, faultCases, measuredPulses, projects } from "@/db/schema";
import { DEMO_PARTS } from "@/lib/demo/parts";
import { addDemoCandidate, addProject, call, sessionCookie, testDb, workspaceForFile } from "@/test/fixtures";

const ws = workspaceForFile("Decide");
let projectId: string;
const partIds: Record<string, string> = {};
const setIds: Record<string, string> = {};

/** The text of a PDF, read with poppler's pdftotext (Debian's poppler-utils). */
function pdfText(bytes: Buffer): string {
  const dir = mkdtempSync(path.join(tmpdir(), "pf-report-"));
  const file = path.join(dir, "report.pdf");
  writeFileSync(file, bytes);
  return execFileSync("pdftotext", ["-layout", file, "-"], { encoding: "utf8" });
}

beforeAll(async () => {
  const { db } = testDb;
  const project = await addProject(ws.id, { name: "Cargo bike disconnect", caseTemp: 85 });
  projectId = project.id;
  for (const demo of DEMO_PARTS) {
    const added = await addDemoCandidate(ws.id, projectId, demo);
    partIds[demo.partNumber] = added.partId;
    setIds[demo.partNumber] = added.setId;
  }
  await db.insert(faultCases).values([
    { projectId, name: "Pre-charge inrush", kind: "triangle", v: 48, i: 1.5, duration: 0.048 },
    { projectId, name: "Output short", kind: "rect", v: 52, i: 40, duration: 100e-6 },
  ]);
  await db
    .insert(measuredPulses)
    .values({ projectId, label: "Bench M1", kind: "rect", v: 47, i: 1.2, duration: 2e-3 });
});

describe("decisions", () => {
  it("freezes the evaluation: edits to curves and temperature change neither the snapshot nor the report", async () => {
    const lead = await sessionCookie(ws.members.lead.id, ws.id);
    const signed = await call(signPost, "POST", {
      cookie: lead,
      params: { id: projectId },
      body: {
        partId: partIds["BFL-100L55"],
        rationale: "Rated for linear mode; passes the inrush with margin.",
      },
    });
    expect(signed.status).toBe(201);
    const { decision } = await signed.json();
    const params = { id: projectId, decisionId: decision.id };

    const before = await (await call(decisionGet, "GET", { cookie: lead, params })).json();
    expect(before.drift.results).toEqual([]);
    const reportBefore = pdfText(
      Buffer.from(await (await call(reportGet, "GET", { cookie: lead, params })).arrayBuffer()),
    );

    // Edit the library and the project after the decision.
    await testDb.db
      .update(curves)
      .set({
        points: [
          [1, 2],
          [100, 0.02],
        ],
      })
      .where(eq(curves.curveSetId, setIds["BFL-100L55"]));
    await testDb.db.update(projects).set({ caseTemp: 120 }).where(eq(projects.id, projectId));

    const after = await (await call(decisionGet, "GET", { cookie: lead, params })).json();
    expect(after.decision.snapshot).toEqual(before.decision.snapshot);
    const reportAfter = pdfText(
      Buffer.from(await (await call(reportGet, "GET", { cookie: lead, params })).arrayBuffer()),
    );
    expect(reportAfter).toBe(reportBefore);

    expect(after.drift.caseTempChanged).toEqual({ frozen: 85, now: 120 });
    expect(after.drift.curveSetsChanged.map((c: { label: string }) => c.label)).toEqual([
      "Brackenford Devices BFL-100L55",
    ]);
    const inrushNow = after.drift.results.find(
      (d: { label: string }) => d.label === "BFL-100L55 × Pre-charge inrush",
    );
    expect(inrushNow.frozen.verdict).toBe("pass");
    expect(inrushNow.now.verdict).not.toBe("pass");
  });

  it("writes a PDF whose text holds the project, each candidate, each verdict and the caution", async () => {
    const lead = await sessionCookie(ws.members.lead.id, ws.id);
    const { decisions } = await (
      await call(listGet, "GET", { cookie: lead, params: { id: projectId } })
    ).json();
    const res = await call(reportGet, "GET", {
      cookie: lead,
      params: { id: projectId, decisionId: decisions[0].id },
    });
    expect(res.headers.get("content-type")).toBe("application/pdf");
    expect(res.headers.get("content-disposition")).toMatch(
      /filename="Cargo-bike-disconnect-\d{4}-\d{2}-\d{2}\.pdf"/,
    );
    const text = pdfText(Buffer.from(await res.arrayBuffer()));
    expect(text).toContain("Cargo bike disconnect");
    for (const n of ["QM-80T16", "QM-100G28", "BFL-100L55"]) expect(text).toContain(n);
    for (const word of ["pass", "fail"]) expect(text).toContain(word);
    expect(text).toMatch(/check\s+is\s+an\s+aid/);
    expect(text).toContain("Rated for linear mode");
    // The caution and the candidates' library status stand on the first page (pdftotext ends pages with \f).
    const firstPage = text.split("\f")[0];
    expect(firstPage).toMatch(/check\s+is\s+an\s+aid/);
    expect(firstPage).toMatch(/Library status|unverified\s+library\s+draft/);
    for (const n of ["QM-80T16", "QM-100G28", "BFL-100L55"]) expect(firstPage).toContain(`${n}:`);
  });

  it("supersedes, never edits: a second decision leaves the first in the history", async () => {
    const lead = await sessionCookie(ws.members.lead.id, ws.id);
    await call(signPost, "POST", {
      cookie: lead,
      params: { id: projectId },
      body: { partId: partIds["QM-100G28"], rationale: "Second opinion after the curve change." },
    });
    const { decisions } = await (
      await call(listGet, "GET", { cookie: lead, params: { id: projectId } })
    ).json();
    expect(decisions).toHaveLength(2);
    expect(decisions[0].supersededBy).toBeNull();
    expect(decisions[1].supersededBy).toBe(decisions[0].id);
  });

  it("refuses a decision from an engineer or a technician", async () => {
    for (const role of ["engineer", "technician"] as const) {
      const cookie = await sessionCookie(ws.members[role].id, ws.id);
      const res = await call(signPost, "POST", {
        cookie,
        params: { id: projectId },
        body: { partId: partIds["QM-100G28"], rationale: "Not mine to decide, but trying." },
      });
      expect(res.status).toBe(403);
    }
  });

  it("exports the matrix as CSV named after the project and the date", async () => {
    const cookie = await sessionCookie(ws.members.engineer.id, ws.id);
    const res = await call(matrixGet, "GET", { cookie, params: { id: projectId } });
    expect(res.headers.get("content-disposition")).toMatch(/Cargo-bike-disconnect-\d{4}-\d{2}-\d{2}\.csv/);
    const lines = (await res.text()).trim().split("\r\n");
    expect(lines[0]).toMatch(/^rank,part,maker,/);
    expect(lines).toHaveLength(1 + 3 * 3);
  });
});
