import "server-only";
import { and, asc, count, desc, eq, gte, ilike, isNotNull, isNull, lte, or, type SQL } from "drizzle-orm";
import { db } from "@/db";
import { curveSets, curves, parts, type Technology, users } from "@/db/schema";
import { type PartSortKey, partSortKeys } from "@/lib/library/part-sort";
import { isUuid } from "@/lib/uuid";

export { type PartSortKey, partSortKeys };

export interface PartListQuery {
  workspaceId: string;
  q?: string;
  technology?: Technology[];
  package?: string;
  maker?: string;
  vdsMin?: number;
  vdsMax?: number;
  status?: "draft" | "verified";
  archived?: boolean;
  sort?: PartSortKey;
  dir?: "asc" | "desc";
  page?: number;
  pageSize?: number;
}

/** The id of the workspace's part with this maker and part number (the library's unique key), or null. */
export async function findPartId(
  { workspaceId, maker, partNumber }: { workspaceId: string; maker: string; partNumber: string },
  executor: Pick<typeof db, "select"> = db,
): Promise<string | null> {
  const [row] = await executor
    .select({ id: parts.id })
    .from(parts)
    .where(and(eq(parts.workspaceId, workspaceId), eq(parts.maker, maker), eq(parts.partNumber, partNumber)));
  return row?.id ?? null;
}

/** One page of the library, filtered and sorted in the database (thousands of parts stay fast). */
export async function listParts(query: PartListQuery) {
  const where: SQL[] = [eq(parts.workspaceId, query.workspaceId)];
  where.push(query.archived ? isNotNull(parts.archivedAt) : isNull(parts.archivedAt));
  if (query.q) {
    const pattern = `%${query.q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
    where.push(
      or(ilike(parts.partNumber, pattern), ilike(parts.maker, pattern), ilike(parts.package, pattern))!,
    );
  }
  if (query.technology?.length) where.push(or(...query.technology.map((t) => eq(parts.technology, t)))!);
  if (query.package) where.push(eq(parts.package, query.package));
  if (query.maker) where.push(eq(parts.maker, query.maker));
  if (query.vdsMin !== undefined) where.push(gte(parts.vdsMax, query.vdsMin));
  if (query.vdsMax !== undefined) where.push(lte(parts.vdsMax, query.vdsMax));
  if (query.status) where.push(eq(parts.status, query.status));
  const pageSize = Math.min(200, Math.max(1, query.pageSize ?? 50));
  const page = Math.max(1, query.page ?? 1);
  const column = parts[query.sort ?? "partNumber"];
  const order = query.dir === "desc" ? desc(column) : asc(column);
  const [rows, [{ total }]] = await Promise.all([
    db
      .select({
        id: parts.id,
        partNumber: parts.partNumber,
        maker: parts.maker,
        technology: parts.technology,
        package: parts.package,
        vdsMax: parts.vdsMax,
        idMax: parts.idMax,
        rdsOn: parts.rdsOn,
        tjMax: parts.tjMax,
        status: parts.status,
        unitCost: parts.unitCost,
        currency: parts.currency,
        hasThermalModel: isNotNull(parts.foster),
        updatedAt: parts.updatedAt,
        archivedAt: parts.archivedAt,
      })
      .from(parts)
      .where(and(...where))
      .orderBy(order, asc(parts.id))
      .limit(pageSize)
      .offset((page - 1) * pageSize),
    db
      .select({ total: count() })
      .from(parts)
      .where(and(...where)),
  ]);
  return { rows, total, page, pageSize };
}

/** Distinct makers and packages of the workspace, for the filter menus. */
export async function partFacets({ workspaceId }: { workspaceId: string }) {
  const [makers, packages] = await Promise.all([
    db
      .selectDistinct({ v: parts.maker })
      .from(parts)
      .where(eq(parts.workspaceId, workspaceId))
      .orderBy(parts.maker),
    db
      .selectDistinct({ v: parts.package })
      .from(parts)
      .where(eq(parts.workspaceId, workspaceId))
      .orderBy(parts.package),
  ]);
  return { makers: makers.map((r) => r.v), packages: packages.map((r) => r.v) };
}

/** A part of the workspace (null when it belongs to another or does not exist). */
export async function getPart({ workspaceId, partId }: { workspaceId: string; partId: string }) {
  if (!isUuid(partId)) return null;
  const [row] = await db
    .select()
    .from(parts)
    .where(and(eq(parts.workspaceId, workspaceId), eq(parts.id, partId)));
  if (!row) return null;
  const verifier = row.verifiedBy
    ? await db.query.users.findFirst({ where: eq(users.id, row.verifiedBy), columns: { name: true } })
    : undefined;
  return { ...row, verifiedByName: verifier?.name ?? null };
}

export function listCurveSets({ partId }: { partId: string }) {
  return db
    .select({
      id: curveSets.id,
      fileName: curveSets.fileName,
      size: curveSets.size,
      sha256: curveSets.sha256,
      shape: curveSets.shape,
      active: curveSets.active,
      refCaseTemp: curveSets.refCaseTemp,
      createdAt: curveSets.createdAt,
      uploadedBy: users.name,
    })
    .from(curveSets)
    .leftJoin(users, eq(users.id, curveSets.uploadedBy))
    .where(eq(curveSets.partId, partId))
    .orderBy(desc(curveSets.createdAt));
}

/** The active curve set of a part with its curves in engine form, or null. */
export async function getActiveCurveSet({ partId }: { partId: string }) {
  const [set] = await db
    .select()
    .from(curveSets)
    .where(and(eq(curveSets.partId, partId), eq(curveSets.active, true)));
  if (!set) return null;
  const rows = await db
    .select()
    .from(curves)
    .where(eq(curves.curveSetId, set.id))
    .orderBy(asc(curves.position));
  return {
    ...set,
    curves: rows.map((c) => ({ duration: c.duration ?? ("DC" as const), points: c.points })),
  };
}
