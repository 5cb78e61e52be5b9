// Findings found again when the part changes, verification over open findings, and its lapse with a notice:
// against the real database, storage fake and mail fake (issue 12).
import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { PATCH as partPatch } from "@/app/api/parts/[id]/route";
import { PUT as thermalPut } from "@/app/api/parts/[id]/thermal/route";
import { POST as verifyPost } from "@/app/api/parts/[id]/verify/route";
import { curveSets, parts } from "@/db/schema";
import type { Finding } from "@/lib/soa/findings";
import { browserUpload, registerUpload } from "@/test/curve-upload";
import { addPart, call, sessionCookie, testDb, workspaceForFile } from "@/test/fixtures";
import { waitForMails } from "@/test/services";

// Curves under a 1 Ω R_DS(on) line, each bending to a constant-power line (I = P/V): no shape findings.
const csv = [
  "width,V_DS [V],I_D [A]",
  "1 ms,1,1",
  "1 ms,7,7",
  "1 ms,40,1.5",
  "10 ms,1,1",
  "10 ms,4,4",
  "10 ms,40,0.4",
  "DC,1,1",
  "DC,3,3",
  "DC,40,0.2",
].join("\n");

const ws = workspaceForFile("Findings");
let engineer: string;
let lead: string;

const newPart = () => addPart(ws.id, { maker: "Findings Test Devices", rthJc: 0.5 });

async function upload(partId: string, text: string) {
  const ticket = await browserUpload(engineer, partId, text);
  return registerUpload(engineer, partId, ticket.uploadId);
}

async function storedFindings(partId: string): Promise<Finding[]> {
  const [set] = await testDb.db.select().from(curveSets).where(eq(curveSets.partId, partId));
  return set.findings as Finding[];
}

beforeAll(async () => {
  engineer = await sessionCookie(ws.members.engineer.id, ws.id);
  lead = await sessionCookie(ws.members.lead.id, ws.id);
});

describe("findings that follow the part", () => {
  it("finds a thermal model added later, and ΣR_i against R_th(j-c), without a re-upload", async () => {
    const part = await newPart();
    expect((await upload(part.id, csv)).status).toBe(201);
    expect(await storedFindings(part.id)).toEqual([]);
    // ΣR_i = 1 K/W against the rated 0.5 K/W: +100 %; the DC level (175 − 25)/1 = 150 W against 12.5 W.
    const res = await call(thermalPut, "PUT", {
      cookie: engineer,
      params: { id: part.id },
      body: {
        terms: [
          { r: "0.5", tau: "1 ms" },
          { r: "0,5", tau: "100 ms" },
        ],
      },
    });
    expect(res.status).toBe(200);
    const kinds = (await storedFindings(part.id)).map((f) => f.kind);
    expect(kinds).toContain("rating-mismatch");
    expect(kinds).toContain("thermal-mismatch");
    // Fixing the rating to the model's sum removes the rating finding, again without a re-upload.
    const patch = await call(partPatch, "PATCH", {
      cookie: engineer,
      params: { id: part.id },
      body: {
        partNumber: part.partNumber,
        maker: part.maker,
        technology: "si-mosfet",
        package: "TO-220",
        vdsMax: 60,
        tjMax: 175,
        rthJc: 1,
      },
    });
    expect(patch.status).toBe(200);
    expect((await storedFindings(part.id)).map((f) => f.kind)).not.toContain("rating-mismatch");
  });

  it("says an identical re-upload matches an existing revision instead of adding a duplicate", async () => {
    const part = await newPart();
    expect((await upload(part.id, csv)).status).toBe(201);
    const again = await upload(part.id, csv);
    expect(again.status).toBe(409);
    expect((await again.json()).error.message).toMatch(
      /^This file matches the revision figure-9\.csv uploaded on/,
    );
    expect(await testDb.db.select().from(curveSets).where(eq(curveSets.partId, part.id))).toHaveLength(1);
  });
});

describe("verification over open findings", () => {
  it("needs every open finding accepted with a reason, keeps the reasons, and lapses with a notice", async () => {
    const part = await newPart();
    await upload(part.id, csv);
    await call(thermalPut, "PUT", {
      cookie: engineer,
      params: { id: part.id },
      body: { terms: [{ r: 1, tau: 0.01 }] },
    });
    const open = await storedFindings(part.id);
    expect(open.length).toBeGreaterThan(1);

    const bare = await call(verifyPost, "POST", { cookie: lead, params: { id: part.id }, body: {} });
    expect(bare.status).toBe(409);
    expect((await bare.json()).error.message).toBe(
      `${open.length} open findings need a reason to be accepted before the part can be verified.`,
    );
    const blank = open.map((f, k) => ({ key: f.key, reason: k === 0 ? "  " : "as drawn in the datasheet" }));
    const oneBlank = await call(verifyPost, "POST", {
      cookie: lead,
      params: { id: part.id },
      body: { acceptances: blank },
    });
    expect((await oneBlank.json()).error.message).toMatch(/^1 open finding needs a reason/);

    const acceptances = open.map((f) => ({ key: f.key, reason: "model from the datasheet's Z_th figure" }));
    const ok = await call(verifyPost, "POST", {
      cookie: lead,
      params: { id: part.id },
      body: { acceptances },
    });
    expect(ok.status).toBe(200);
    const [verified] = await testDb.db.select().from(parts).where(eq(parts.id, part.id));
    expect(verified.status).toBe("verified");
    expect(verified.acceptedFindings.map((a) => a.reason)).toEqual(
      open.map(() => "model from the datasheet's Z_th figure"),
    );

    // The data change: back to draft, the acceptances gone, and the lead who verified is told.
    await call(thermalPut, "PUT", {
      cookie: engineer,
      params: { id: part.id },
      body: { terms: [{ r: 0.5, tau: 0.01 }] },
    });
    const [lapsed] = await testDb.db.select().from(parts).where(eq(parts.id, part.id));
    expect(lapsed).toMatchObject({ status: "draft", verifiedBy: null, acceptedFindings: [] });
    const back = new RegExp(`${part.partNumber.replace(/[.*+?^${}()|[\]\\]/g, "\\$&")} is back in draft`);
    const [mail] = await waitForMails(ws.members.lead.email, 1, { subject: back });
    expect(mail.subject).toBe(`Findings Test Devices ${part.partNumber} is back in draft: its data changed`);
    expect(mail.text).toContain("thermal model changed");
  });
});
