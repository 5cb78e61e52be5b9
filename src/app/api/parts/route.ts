import { z } from "zod";
import { listParts, partFacets, partSortKeys } from "@/db/queries/parts";
import { route } from "@/lib/auth/guard";
import { AppError } from "@/lib/errors";
import { fieldErrorsOf, json, parseBody } from "@/lib/http";
import { partSchema, technologies } from "@/lib/library/part-schema";
import { createPart } from "@/lib/library/parts";

const listQuery = z.object({
  q: z.string().trim().max(100).optional(),
  technology: z
    .string()
    .optional()
    .transform((s) => (s ? s.split(",") : undefined))
    .pipe(z.array(z.enum(technologies)).optional()),
  package: z.string().max(40).optional(),
  maker: z.string().max(80).optional(),
  vdsMin: z.coerce.number().finite().optional(),
  vdsMax: z.coerce.number().finite().optional(),
  status: z.enum(["draft", "verified"]).optional(),
  archived: z
    .enum(["true", "false"])
    .optional()
    .transform((v) => v === "true"),
  sort: z.enum(partSortKeys).optional(),
  dir: z.enum(["asc", "desc"]).optional(),
  page: z.coerce.number().int().min(1).optional(),
  pageSize: z.coerce.number().int().min(1).max(200).optional(),
});

/** GET /api/parts: one page of the library with filters and sorting (all from the query string). */
export const GET = route({ action: "workspace.read" }, async (req, caller) => {
  const params = Object.fromEntries(new URL(req.url).searchParams);
  const parsed = listQuery.safeParse(params);
  if (!parsed.success) {
    throw new AppError("invalid:query", "Invalid filter.", {
      details: { fieldErrors: fieldErrorsOf(parsed.error) },
    });
  }
  const [page, facets] = await Promise.all([
    listParts({ ...parsed.data, workspaceId: caller.workspaceId }),
    partFacets(caller),
  ]);
  return json({ ...page, facets });
});

/** POST /api/parts: a new part, in draft. */
export const POST = route({ action: "part.write" }, async (req, caller) => {
  const values = await parseBody(req, partSchema);
  return json({ part: await createPart(caller, values) }, { status: 201 });
});
