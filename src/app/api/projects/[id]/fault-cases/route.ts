import { db } from "@/db";
import { recordAudit } from "@/db/queries/audit";
import { faultCases } from "@/db/schema";
import { route } from "@/lib/auth/guard";
import { json, parseBody } from "@/lib/http";
import { loadWritableProject } from "@/lib/projects/projects";
import { anyFaultCaseSchema } from "@/lib/projects/schema";
import { faultCaseColumns } from "@/lib/projects/write";

/** POST /api/projects/:id/fault-cases: a named pulse the design must survive (typed, or from a pulse builder). */
export const POST = route<{ id: string }>({ action: "project.write" }, async (req, caller, { id }) => {
  const project = await loadWritableProject(caller, id);
  const values = await parseBody(req, anyFaultCaseSchema);
  const faultCase = await db.transaction(async (tx) => {
    const [row] = await tx
      .insert(faultCases)
      .values({ ...faultCaseColumns(values), projectId: project.id, createdBy: caller.user.id })
      .returning();
    await recordAudit(
      {
        workspaceId: caller.workspaceId,
        actorId: caller.user.id,
        action: "fault-case.created",
        subjectType: "project",
        subjectId: project.id,
        details: { faultCaseId: row.id, name: row.name, builder: values.origin?.builder ?? null },
      },
      tx,
    );
    return row;
  });
  return json({ faultCase }, { status: 201 });
});
