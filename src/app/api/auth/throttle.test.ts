// Sign-in throttling under parallel requests and forged client addresses, through the real route handlers.
import { describe, expect, it, vi } from "vitest";
import { clientIp } from "@/lib/auth/throttle";
import { addMember, call, testPassword, workspaceForFile } from "@/test/fixtures";
import { waitForMail } from "@/test/services";
import { POST as forgotPassword } from "./forgot-password/route";
import { POST as resetPassword } from "./reset-password/route";
import { POST as signIn } from "./sign-in/route";

// These requests arrive through one trusted proxy, which appends the address it received from to X-Forwarded-For.
vi.hoisted(() => {
  process.env.TRUSTED_PROXY_HOPS = "1";
});
const viaProxy = (clientWrote: string, proxySaw: string) => ({
  "x-forwarded-for": clientWrote ? `${clientWrote}, ${proxySaw}` : proxySaw,
});

// Attempts persist in the database between runs: each test uses addresses of its own.
const octet = () => Math.floor(Math.random() * 250) + 1;
const randomAddress = () => `10.${octet()}.${octet()}.${octet()}`;

const ws = workspaceForFile("Throttle");

const tryPassword = (email: string, password: string, headers: Record<string, string> = {}) =>
  call(signIn, "POST", { body: { email, password }, headers });

describe("sign-in throttling", () => {
  it("40 parallel wrong passwords for one account: at most 5 are checked, the rest answer 429", async () => {
    const user = await addMember(ws.id, "engineer");
    const statuses = (
      await Promise.all(
        Array.from({ length: 40 }, () =>
          tryPassword(user.email, "wrong guess", viaProxy("", randomAddress())),
        ),
      )
    ).map((r) => r.status);
    expect(statuses.filter((s) => s === 401).length).toBeLessThanOrEqual(5);
    expect(statuses.filter((s) => s === 429).length).toBeGreaterThanOrEqual(35);
    expect(statuses.filter((s) => s !== 401 && s !== 429)).toEqual([]);
  });

  it("rotating the client-written X-Forwarded-For does not escape the per-address limit", async () => {
    const proxySaw = randomAddress();
    const statuses: number[] = [];
    for (let k = 0; k < 8; k++) {
      const email = `sprayed-${k}-${crypto.randomUUID().slice(0, 6)}@example.test`;
      const res = await tryPassword(email, "guess", viaProxy(`198.51.100.${k + 1}`, proxySaw));
      statuses.push(res.status);
    }
    expect(statuses.slice(0, 5)).toEqual([401, 401, 401, 401, 401]);
    expect(statuses.slice(5)).toEqual([429, 429, 429]);
  });

  it("a stranger's failures 'from' a spoofed address do not lock out a person at that address", async () => {
    const spoofed = randomAddress();
    const stranger = randomAddress();
    for (let k = 0; k < 7; k++) {
      const email = `stranger-${k}-${crypto.randomUUID().slice(0, 6)}@example.test`;
      await tryPassword(email, "guess", viaProxy(spoofed, stranger));
    }
    const victim = await addMember(ws.id, "lead");
    expect((await tryPassword(victim.email, testPassword, viaProxy("", spoofed))).status).toBe(200);
  });

  it("an account locked by someone else's guesses is unlocked by its owner through the reset link", async () => {
    const victim = await addMember(ws.id, "engineer");
    for (let k = 0; k < 5; k++) await tryPassword(victim.email, "attacker guess");
    const locked = await tryPassword(victim.email, testPassword);
    expect(locked.status).toBe(429);
    expect((await locked.json()).error.code).toBe("rate_limited:account");
    expect((await call(forgotPassword, "POST", { body: { email: victim.email } })).status).toBe(200);
    const token = /\/reset-password\/([A-Za-z0-9_-]+)/.exec((await waitForMail(victim.email)).text)?.[1];
    const fresh = "a fresh long passphrase";
    expect((await call(resetPassword, "POST", { body: { token, password: fresh } })).status).toBe(200);
    expect((await tryPassword(victim.email, fresh)).status).toBe(200);
  });
});

describe("the client address", () => {
  const req = (xff: string) => new Request("http://127.0.0.1/", { headers: { "x-forwarded-for": xff } });

  it("is never taken from X-Forwarded-For when no proxy is configured", () => {
    expect(clientIp(req("198.51.100.9"), 0)).toBeNull();
  });

  it("behind one trusted proxy, is the entry that proxy appended, whatever the client wrote before it", () => {
    expect(clientIp(req("10.9.9.9, 198.51.100.9"), 1)).toBe("198.51.100.9");
    expect(clientIp(req("198.51.100.9"), 1)).toBe("198.51.100.9");
    expect(clientIp(req("1.1.1.1, 2.2.2.2, 198.51.100.9, 10.0.0.2"), 2)).toBe("198.51.100.9");
    expect(clientIp(req(""), 1)).toBeNull();
  });
});
