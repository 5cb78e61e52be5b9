import { afterAll } from "vitest";
import { stopJobQueue } from "@/lib/jobs/boss";

// A test that queued a job started this process's job queue client: stop it, so the worker exits cleanly.
afterAll(async () => {
  await stopJobQueue(1000);
});
