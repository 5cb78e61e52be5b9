// Seeds the demo workspace of PRODUCT.md's scenario, idempotently: running it again changes nothing.
// Demo parts go through the same path as an engineer's upload (CSV → object storage → parse → rows).
// `--print-sign-in` prints the demo sign-in lines for the start command instead.
import { and, eq } from "drizzle-orm";
import { db } from "../src/db";
import { memberships, parts, pendingUploads, projects, users, workspaces } from "../src/db/schema";
import { hashPassword } from "../src/lib/auth/password";
import { processCaptureJob } from "../src/lib/capture/job";
import { registerCapture } from "../src/lib/capture/store";
import {
  demoCaptureCsv,
  demoCaptureFileName,
  demoCaptureMapping,
  demoCaptureName,
} from "../src/lib/demo/capture";
import { DEMO_SCENARIO } from "../src/lib/demo/parts";
import { demoProjectName } from "../src/lib/demo/project";
import { ensureDemoParts, insertDemoPulses } from "../src/lib/demo/sample-project";
import { demoUsers, demoWorkspace } from "../src/lib/demo/users";
import { storage } from "../src/lib/storage";

if (process.argv.includes("--print-sign-in")) {
  console.log(`    demo      workspace "${demoWorkspace.name}", sign in with any of:`);
  for (const u of demoUsers)
    console.log(`              ${u.role.padEnd(10)} ${u.email.padEnd(28)} ${u.password}`);
  process.exit(0);
}

async function seedWorkspace(): Promise<string> {
  await db.insert(workspaces).values(demoWorkspace).onConflictDoNothing({ target: workspaces.slug });
  const [ws] = await db.select().from(workspaces).where(eq(workspaces.slug, demoWorkspace.slug));
  return ws.id;
}

async function seedUsers(workspaceId: string): Promise<Record<string, string>> {
  const ids: Record<string, string> = {};
  for (const u of demoUsers) {
    let user = await db.query.users.findFirst({ where: eq(users.email, u.email), columns: { id: true } });
    if (!user) {
      [user] = await db
        .insert(users)
        .values({ email: u.email, name: u.name, passwordHash: await hashPassword(u.password) })
        .returning({ id: users.id });
    }
    await db.insert(memberships).values({ workspaceId, userId: user.id, role: u.role }).onConflictDoNothing();
    ids[u.role] = user.id;
  }
  return ids;
}

async function seedParts(workspaceId: string, engineerId: string): Promise<void> {
  await ensureDemoParts(storage(), { workspaceId, userId: engineerId, userName: "seed" });
}

/** The scenario's project: candidates, fault cases from the pulse builders, and a few measured pulses. */
async function seedProject(workspaceId: string, ids: Record<string, string>): Promise<void> {
  const existing = await db
    .select({ id: projects.id })
    .from(projects)
    .where(and(eq(projects.workspaceId, workspaceId), eq(projects.name, demoProjectName)));
  if (existing.length) return;
  const demoParts = await db.select({ id: parts.id }).from(parts).where(eq(parts.workspaceId, workspaceId));
  await db.transaction(async (tx) => {
    const [project] = await tx
      .insert(projects)
      .values({
        workspaceId,
        name: demoProjectName,
        description:
          "Battery disconnect unit between the 13-cell pack and the motor controller of an electric cargo bike. " +
          "Invented demo project.",
        caseTemp: DEMO_SCENARIO.caseTemp,
        ownerId: ids.engineer,
      })
      .returning({ id: projects.id });
    await insertDemoPulses(tx, project.id, demoParts, { engineer: ids.engineer, technician: ids.technician });
  });
  await seedCapture(workspaceId, ids.technician);
}

/**
 * One scope capture, through the same path as a technician's upload (CSV in storage → registered → the job's
 * streamed parse, samples, checks and rows), its job run here rather than queued.
 */
async function seedCapture(workspaceId: string, technicianId: string): Promise<void> {
  const [project] = await db
    .select()
    .from(projects)
    .where(and(eq(projects.workspaceId, workspaceId), eq(projects.name, demoProjectName)));
  const objectKey = `${workspaceId}/projects/${project.id}/capture/${crypto.randomUUID()}.csv`;
  const [upload] = await db
    .insert(pendingUploads)
    .values({
      workspaceId,
      userId: technicianId,
      objectKey,
      fileName: demoCaptureFileName,
      purpose: "capture",
    })
    .returning();
  await storage().put(objectKey, demoCaptureCsv(), { contentType: "text/csv" });
  const technician = demoUsers.find((u) => u.role === "technician")!;
  const capture = await registerCapture(storage(), {
    project,
    caller: { workspaceId, user: { id: technicianId, email: technician.email, name: technician.name } },
    upload,
    name: demoCaptureName,
    mapping: demoCaptureMapping,
    boardSerial: "TW-03",
    probe: "100:1 differential, 50 A current probe",
    note: "Invented demo capture.",
  });
  if ((await processCaptureJob(storage(), capture.id, { notify: false })) !== "done")
    throw new Error("the demo capture failed");
}

const workspaceId = await seedWorkspace();
const ids = await seedUsers(workspaceId);
await seedParts(workspaceId, ids.engineer);
await seedProject(workspaceId, ids);
process.exit(0);
