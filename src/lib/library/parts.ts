import "server-only";
import { and, eq } from "drizzle-orm";
import { db } from "@/db";
import { recordAudit } from "@/db/queries/audit";
import { findPartId, getPart } from "@/db/queries/parts";
import { curveSets, type FosterTermRow, type Part, parts, type ThermalSource } from "@/db/schema";
import type { MemberCaller } from "@/lib/auth/guard";
import { AppError } from "@/lib/errors";
import { isUuid } from "@/lib/uuid";
import { noticePartChange } from "./part-changed";
import { draftFields, refreshFindings } from "./part-findings";
import type { PartValues } from "./part-schema";

/** The caller's workspace's part, or 404 (a part of another workspace does not exist for the caller). */
export async function loadPart(caller: MemberCaller, partId: string) {
  const part = await getPart({ workspaceId: caller.workspaceId, partId });
  if (!part) throw new AppError("not_found:part", "No such part in this workspace.");
  return part;
}

/** A curve set of the part, or 404; pass the transaction when the change runs in one. */
export async function loadCurveSet(
  part: Pick<Part, "id">,
  setId: string,
  executor: Pick<typeof db, "select"> = db,
) {
  const [set] = isUuid(setId)
    ? await executor
        .select({ id: curveSets.id, objectKey: curveSets.objectKey, fileName: curveSets.fileName })
        .from(curveSets)
        .where(and(eq(curveSets.id, setId), eq(curveSets.partId, part.id)))
    : [];
  if (!set) throw new AppError("not_found:curve-set", "No such curve set.");
  return set;
}

// Ratings a check depends on: changing one returns a verified part to draft, like new curves or a new model.
const limitFields = [
  "vdsMax",
  "idPulseMax",
  "rdsOn",
  "tjMax",
  "rthJc",
  "avalancheEnergy",
  "avalancheCurrent",
  "avalancheBreakdown",
] as const;

function normalised(values: PartValues) {
  return {
    ...values,
    idMax: values.idMax ?? null,
    idPulseMax: values.idPulseMax ?? null,
    rdsOn: values.rdsOn ?? null,
    rthJc: values.rthJc ?? null,
    avalancheEnergy: values.avalancheEnergy ?? null,
    avalancheCurrent: values.avalancheCurrent ?? null,
    avalancheBreakdown: values.avalancheBreakdown ?? null,
    unitCost: values.unitCost ?? null,
    currency: values.currency?.toUpperCase() ?? null,
    datasheetRevision: values.datasheetRevision ?? null,
    notes: values.notes ?? null,
  };
}

/** The 409 for a maker and part number already in the workspace's library. */
function duplicatePart(values: PartValues, cause?: unknown): AppError {
  return new AppError("conflict:part", `${values.maker} ${values.partNumber} is already in the library.`, {
    cause,
    details: { fieldErrors: { partNumber: ["Already in the library for this maker"] } },
  });
}

/** PostgreSQL's unique_violation (SQLSTATE 23505), found on the error or its cause. */
export function isUniqueViolation(error: unknown): boolean {
  const e = error as { code?: unknown; cause?: { code?: unknown } };
  return e?.code === "23505" || e?.cause?.code === "23505";
}

/**
 * Adds a part. The unique index on (workspace, maker, part number) decides between parallel identical requests:
 * the loser answers 409, as does a request that finds the part already there.
 */
export async function createPart(caller: MemberCaller, values: PartValues): Promise<Part> {
  return insertPart(caller, values).catch((error: unknown) => {
    throw isUniqueViolation(error) ? duplicatePart(values, error) : error;
  });
}

function insertPart(caller: MemberCaller, values: PartValues): Promise<Part> {
  return db.transaction(async (tx) => {
    const where = { workspaceId: caller.workspaceId, maker: values.maker, partNumber: values.partNumber };
    if (await findPartId(where, tx)) throw duplicatePart(values);
    const [part] = await tx
      .insert(parts)
      .values({ ...normalised(values), workspaceId: caller.workspaceId, createdBy: caller.user.id })
      .returning();
    await recordAudit(
      {
        workspaceId: caller.workspaceId,
        actorId: caller.user.id,
        action: "part.created",
        subjectType: "part",
        subjectId: part.id,
        details: { partNumber: part.partNumber, maker: part.maker },
      },
      tx,
    );
    return part;
  });
}

/** Changes a part; renaming it to a maker and number already in the library answers 409. */
export async function updatePart(caller: MemberCaller, part: Part, values: PartValues): Promise<Part> {
  return writePart(caller, part, values).catch((error: unknown) => {
    throw isUniqueViolation(error) ? duplicatePart(values, error) : error;
  });
}

async function writePart(caller: MemberCaller, part: Part, values: PartValues): Promise<Part> {
  const next = normalised(values);
  const changed = limitFields.filter((f) => (next[f] ?? null) !== (part[f] ?? null));
  const limitsChanged = changed.length > 0;
  const updated = await db.transaction(async (tx) => {
    const [updated] = await tx
      .update(parts)
      .set({ ...next, updatedAt: new Date(), ...(limitsChanged ? draftFields : {}) })
      .where(eq(parts.id, part.id))
      .returning();
    if (limitsChanged) await refreshFindings(tx, updated);
    await recordAudit(
      {
        workspaceId: caller.workspaceId,
        actorId: caller.user.id,
        action: "part.updated",
        subjectType: "part",
        subjectId: part.id,
        details: { limitsChanged },
      },
      tx,
    );
    return updated;
  });
  if (limitsChanged) {
    await noticePartChange(part, `ratings changed: ${changed.join(", ")}`, caller.user.name);
  }
  return updated;
}

/**
 * Replaces the Foster network; the curve sets' findings are found again against it and the part returns to draft
 * (its verifier is told). An empty list removes the thermal model.
 */
export async function setThermalModel(
  caller: MemberCaller,
  part: Part,
  terms: FosterTermRow[],
  source: ThermalSource,
): Promise<Part> {
  const updated = await db.transaction(async (tx) => {
    const [updated] = await tx
      .update(parts)
      .set({
        foster: terms.length ? terms : null,
        thermalSource: terms.length ? source : null,
        ...draftFields,
        updatedAt: new Date(),
      })
      .where(eq(parts.id, part.id))
      .returning();
    await refreshFindings(tx, updated);
    await recordAudit(
      {
        workspaceId: caller.workspaceId,
        actorId: caller.user.id,
        action: "part.thermal-model-changed",
        subjectType: "part",
        subjectId: part.id,
        details: { terms: terms.length, source: source.kind },
      },
      tx,
    );
    return updated;
  });
  await noticePartChange(part, "thermal model changed", caller.user.name);
  return updated;
}
