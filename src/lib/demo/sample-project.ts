import { inArray } from "drizzle-orm";
import { db } from "@/db";
import { findPartId } from "@/db/queries/parts";
import { faultCases, measuredPulses, parts, pendingUploads, projectCandidates, projects } from "@/db/schema";
import { registerCurveSet } from "@/lib/library/curve-upload";
import type { Storage } from "@/lib/storage";
import { DEMO_PARTS, DEMO_SCENARIO, demoCurveSetCsv, demoCurveSetFileName } from "./parts";
import { demoFaultCases, demoMeasuredPulses, demoProjectName } from "./project";

interface Who {
  workspaceId: string;
  userId: string;
  userName: string;
}

/** Marks what the one-click sample adds: its project's name and every note say the data is invented. */
export const sampleProjectName = `Sample: ${demoProjectName}`;
const sampleNote = "Sample data: invented, for trying Pulsefence out. Not a real part.";

/**
 * The demo parts in a workspace, through the same path as an engineer's upload (CSV → object storage → parse →
 * rows); parts already there (same maker and part number) are kept as they are. Answers every demo part's id.
 */
export async function ensureDemoParts(store: Storage, who: Who, notes?: string): Promise<string[]> {
  const ids: string[] = [];
  for (const demo of DEMO_PARTS) {
    const existing = await findPartId({
      workspaceId: who.workspaceId,
      maker: demo.maker,
      partNumber: demo.partNumber,
    });
    if (existing) {
      ids.push(existing);
      continue;
    }
    const [part] = await db
      .insert(parts)
      .values({
        workspaceId: who.workspaceId,
        partNumber: demo.partNumber,
        maker: demo.maker,
        technology: "si-mosfet",
        package: demo.package,
        vdsMax: demo.vdsMax,
        idMax: demo.idContinuous,
        idPulseMax: demo.idPulseMax,
        rdsOn: demo.rdsOn,
        tjMax: demo.tjMax,
        rthJc: demo.rthJc,
        foster: demo.foster,
        thermalSource: { kind: "typed" },
        transfer: { ...demo.transfer, source: { kind: "typed" } },
        avalancheEnergy: demo.avalanche.energy,
        avalancheCurrent: demo.avalanche.current ?? null,
        avalancheBreakdown: demo.avalanche.breakdown ?? null,
        unitCost: demo.unitCost,
        currency: demo.currency,
        datasheetRevision: demo.datasheetRevision,
        notes: notes ?? demo.notes,
        createdBy: who.userId,
      })
      .returning();
    const objectKey = `${who.workspaceId}/parts/${part.id}/curve-set/${crypto.randomUUID()}.csv`;
    const [upload] = await db
      .insert(pendingUploads)
      .values({
        workspaceId: who.workspaceId,
        userId: who.userId,
        objectKey,
        fileName: demoCurveSetFileName(demo),
        purpose: "curve-set",
      })
      .returning();
    await store.put(objectKey, demoCurveSetCsv(demo), { contentType: "text/csv" });
    await registerCurveSet(store, { part, userId: who.userId, userName: who.userName, upload });
    ids.push(part.id);
  }
  return ids;
}

type Tx = Parameters<Parameters<typeof db.transaction>[0]>[0];

/**
 * What the demo project holds, in the transaction that adds it: the parts as candidates, the fault cases (by the
 * engineer) and the measured pulses (by the technician). The seed and the one-click sample both add it.
 */
export async function insertDemoPulses(
  tx: Tx,
  projectId: string,
  candidates: { id: string }[],
  by: { engineer: string; technician: string },
): Promise<void> {
  await tx.insert(projectCandidates).values(candidates.map((p) => ({ projectId, partId: p.id })));
  await tx
    .insert(faultCases)
    .values(demoFaultCases().map((c) => ({ ...c, projectId, createdBy: by.engineer })));
  await tx
    .insert(measuredPulses)
    .values(demoMeasuredPulses().map((m) => ({ ...m, projectId, createdBy: by.technician })));
}

/**
 * The demo scenario as a sample project in any workspace, in one click: the invented parts (unverified drafts),
 * a project marked as a sample with its candidates, fault cases and measured pulses. A newcomer reaches a first
 * verdict without entering data.
 */
export async function addSampleProject(store: Storage, who: Who): Promise<{ id: string }> {
  const partIds = await ensureDemoParts(store, who, sampleNote);
  return db.transaction(async (tx) => {
    const [project] = await tx
      .insert(projects)
      .values({
        workspaceId: who.workspaceId,
        name: sampleProjectName,
        description:
          "Sample project with invented data: a battery disconnect unit between a 13-cell pack and the motor " +
          "controller of an electric cargo bike. Try a check, compare the candidates, then archive it.",
        caseTemp: DEMO_SCENARIO.caseTemp,
        ownerId: who.userId,
      })
      .returning({ id: projects.id });
    const present = await tx.select({ id: parts.id }).from(parts).where(inArray(parts.id, partIds));
    await insertDemoPulses(tx, project.id, present, { engineer: who.userId, technician: who.userId });
    return project;
  });
}
