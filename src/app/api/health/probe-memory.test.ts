// Health probes storage and mail at most once per 2 s in a process, and the calls meanwhile share that answer;
// the database is probed on every call. Our choice (issue: fast under load): a load balancer probes every second
// or so, and storage and mail probes cost more than the rest of an answer together.
import { afterEach, expect, it, vi } from "vitest";
import { mailer } from "@/lib/mail";
import { storage } from "@/lib/storage";
import { call } from "@/test/fixtures";
import { GET } from "./route";

afterEach(() => {
  vi.useRealTimers();
  vi.restoreAllMocks();
});

it("probes storage and mail once per 2 s, and the database every time", async () => {
  vi.useFakeTimers({ toFake: ["Date"], now: new Date("2026-12-02T12:00:00Z") });
  const storagePing = vi.spyOn(storage(), "ping");
  const mailPing = vi.spyOn(mailer(), "ping");
  const answers = await Promise.all([call(GET, "GET"), call(GET, "GET"), call(GET, "GET")]);
  for (const res of answers) expect(await res.json()).toEqual({ db: "ok", storage: "ok", mail: "ok" });
  vi.setSystemTime(new Date("2026-12-02T12:00:01.999Z"));
  expect((await call(GET, "GET")).status).toBe(200);
  expect(storagePing).toHaveBeenCalledTimes(1);
  expect(mailPing).toHaveBeenCalledTimes(1);

  vi.setSystemTime(new Date("2026-12-02T12:00:02Z"));
  storagePing.mockRejectedValueOnce(new Error("storage gone"));
  const afterMemory = await call(GET, "GET");
  expect(afterMemory.status).toBe(503);
  expect(await afterMemory.json()).toEqual({ db: "ok", storage: "unavailable", mail: "ok" });
  expect(storagePing).toHaveBeenCalledTimes(2);
  expect(mailPing).toHaveBeenCalledTimes(2);
});
