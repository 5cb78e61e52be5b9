import { type ChildProcess, spawn } from "node:child_process";
import { openSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { type APIRequestContext, expect, request, test } from "@playwright/test";
import { benchCaptureCsv } from "./fixtures/capture-csv";
import { linkIn, waitForMail } from "./pages/mail-inbox";

// Scale-out, shown: two app instances of the same build against one database and one store, as behind a load
// balancer. B is the suite's app (its capture workers on); A is another app process (src/server/app-main.ts) on
// the next free port of this checkout's range, started here with JOB_WORKERS=0, so it only queues jobs. Both serve the same public origin
// (APP_URL), which the load balancer would carry: requests to A say B's origin, as a browser would.

const appB = process.env.APP_URL ?? "http://127.0.0.1:3100";
const portA = Number(new URL(appB).port) + 7;
const appA = `http://127.0.0.1:${portA}`;
const origin = new URL(appB).origin;

// Instance A is shared infrastructure, started once; every test signs up its own person and holds its own clients.
let instanceA: ChildProcess;
const contexts: APIRequestContext[] = [];

test.beforeAll(async () => {
  test.setTimeout(120_000);
  const log = openSync(path.join(tmpdir(), `pulsefence-instance-a-${portA}.log`), "w");
  instanceA = spawn(process.execPath, ["--import", "tsx", "src/server/app-main.ts"], {
    env: {
      ...process.env,
      JOB_WORKERS: "0",
      PORT: String(portA),
      HOST: "127.0.0.1",
      PF_COMPRESS_AT_PROXY: "1",
    },
    stdio: ["ignore", log, log],
  });
  await expect
    .poll(async () => (await fetch(`${appA}/api/health`).catch(() => null))?.status ?? 0, {
      timeout: 90_000,
      intervals: [250],
    })
    .toBe(200);
});

/** A new person signed up on instance A, with a client on each instance carrying the session A set. */
async function newPersonOnBothInstances() {
  const stamp = `${Date.now().toString(36)}${Math.random().toString(36).slice(2, 6)}`;
  const person = {
    name: "Noor Lindqvist",
    email: `noor.${stamp}@pulsefence.test`,
    password: "scale-out-demo-password",
    workspaceName: `Scale-out lab ${stamp}`,
  };
  const onA = await request.newContext({ baseURL: appA, extraHTTPHeaders: { origin } });
  contexts.push(onA);
  // Sign-up answers 202 and e-mails a link; using it on instance A creates the account and signs in there.
  const signedUp = await onA.post("/api/auth/sign-up", { data: person });
  expect(signedUp.status(), await signedUp.text()).toBe(202);
  const link = linkIn(await waitForMail(person.email, /Finish creating/), "/sign-up/confirm/");
  const token = new URL(link).pathname.split("/").pop();
  const confirmed = await onA.post("/api/auth/sign-up/confirm", { data: { token } });
  expect(confirmed.status(), await confirmed.text()).toBe(201);
  // The session cookie instance A set, carried to instance B.
  const onB = await request.newContext({
    baseURL: appB,
    extraHTTPHeaders: { origin },
    storageState: await onA.storageState(),
  });
  contexts.push(onB);
  return { person, onA, onB };
}

test.afterAll(async () => {
  for (const context of contexts) await context.dispose();
  if (instanceA && instanceA.exitCode === null) {
    const exited = new Promise((resolve) => instanceA.once("exit", resolve));
    instanceA.kill("SIGTERM");
    await exited;
  }
});

test("a session made on one instance works on the other", async () => {
  const { onA, onB } = await newPersonOnBothInstances();
  const projects = await onB.get("/api/projects");
  expect(projects.status()).toBe(200);
  const created = await onB.post("/api/projects", { data: { name: "Two instances", caseTemp: 25 } });
  expect(created.status(), await created.text()).toBe(201);
  // What B wrote, A reads: one database.
  const listed: { projects: { name: string }[] } = await (await onA.get("/api/projects")).json();
  expect(listed.projects.map((p) => p.name)).toContain("Two instances");
});

test("a page kept in one instance's memory shows a change made on the other at its next load", async () => {
  const { onA, onB } = await newPersonOnBothInstances();
  const projectsPage = async () => {
    const res = await onA.get("/projects");
    expect(res.status()).toBe(200);
    return { served: res.headers()["x-page-memory"], html: await res.text() };
  };
  // Asked again with nothing committed in between, A sends what it kept (background work, such as mail being
  // sent, may commit in between: then it is asked once more).
  await expect.poll(async () => (await projectsPage()).served, { intervals: [100] }).toBe("hit");
  const created = await onB.post("/api/projects", { data: { name: "Made on B", caseTemp: 25 } });
  expect(created.status(), await created.text()).toBe(201);
  // The database's state moved with B's commit, so A renders the page again, with the new project.
  const after = await projectsPage();
  expect(after.served).toBe("miss");
  expect(after.html).toContain("Made on B");
});

test("a capture job queued by instance A is finished by a worker of instance B", async () => {
  const { onA, onB } = await newPersonOnBothInstances();
  const created = await onA.post("/api/projects", { data: { name: "Queued on A", caseTemp: 25 } });
  expect(created.status(), await created.text()).toBe(201);
  const projectId: string = (await created.json()).project.id;
  const csv = benchCaptureCsv(5_000);
  const ticket = await onA.post(`/api/projects/${projectId}/uploads`, {
    data: { fileName: "two-instances.csv", size: Buffer.byteLength(csv), purpose: "capture" },
  });
  expect(ticket.status(), await ticket.text()).toBe(201);
  const { uploadId, url } = await ticket.json();
  const put = await fetch(url, { method: "PUT", body: csv, headers: { "content-type": "text/csv" } });
  expect(put.status).toBe(200);
  const registered = await onA.post(`/api/projects/${projectId}/captures`, {
    data: { uploadId, name: "Queued on A", mapping: { time: 0, voltage: 1, current: 2, header: true } },
  });
  expect(registered.status(), await registered.text()).toBe(202);
  const { capture, jobId } = await registered.json();
  expect(capture.status).toBe("queued");
  expect(jobId).toBeTruthy();
  // A has no workers: only B's can take the job. A answers the outcome from the shared database.
  await expect
    .poll(
      async () =>
        (await (await onA.get(`/api/projects/${projectId}/captures/${capture.id}`)).json()).capture.status,
      {
        timeout: 30_000,
        intervals: [250],
      },
    )
    .toBe("done");
  const detail = await (await onB.get(`/api/projects/${projectId}/captures/${capture.id}`)).json();
  expect(detail.capture.summary.samples).toBe(5_000);
});

test("a sign-in throttle counts failures on both instances together", async () => {
  const { person, onA, onB } = await newPersonOnBothInstances();
  const attempt = (ctx: APIRequestContext, password: string) =>
    ctx.post("/api/auth/sign-in", { data: { email: person.email, password } });
  const statuses: number[] = [];
  for (const ctx of [onA, onB, onA, onB, onA])
    statuses.push((await attempt(ctx, "not the password")).status());
  expect(statuses.every((s) => s === 401 || s === 400)).toBe(true);
  // The sixth attempt is refused on either instance, even with the right password.
  const refused = await attempt(onB, person.password);
  expect(refused.status()).toBe(429);
  expect(refused.headers()["retry-after"]).toBeTruthy();
  expect((await attempt(onA, person.password)).status()).toBe(429);
});
