import { expect, test } from "@playwright/test";
import { insidePulse, overVoltagePulse, smallCheckRequest } from "../src/test/check-request";

// The check API through the app's one port, as a bench script reaches it: nginx sends bearer-token calls to the
// lean API servers and session calls to the app (scripts/services.sh); both must answer the same.

// The seeded demo engineer (README.md, "Demo sign-in").
const engineer = { email: "engineer@tidewater.example", password: "tidewater-engineer-demo" };

const body = smallCheckRequest([insidePulse, overVoltagePulse]);

test("a token's check and a session's check answer the same through the app's port", async ({
  request,
  baseURL,
}) => {
  const origin = new URL(baseURL!).origin;
  const signIn = await request.post("/api/auth/sign-in", { headers: { origin }, data: engineer });
  expect(signIn.status()).toBe(200);
  const made = await request.post("/api/account/tokens", {
    headers: { origin },
    data: { name: "e2e bench" },
  });
  expect(made.status()).toBe(201);
  const { token } = await made.json();

  const byToken = await request.post("/api/v1/check", {
    headers: { authorization: `Bearer ${token.secret}` },
    data: body,
  });
  expect(byToken.status()).toBe(200);
  expect(byToken.headers()["x-content-type-options"]).toBe("nosniff");
  const results = (await byToken.json()).results;
  expect(results.map((r: { id: string; verdict: string }) => [r.id, r.verdict])).toEqual([
    ["p1", "pass"],
    ["over-voltage", "fail"],
  ]);

  const bySession = await request.post("/api/v1/check", { headers: { origin }, data: body });
  expect(bySession.status()).toBe(200);
  expect((await bySession.json()).results).toEqual(results);

  const badToken = await request.post("/api/v1/check", {
    headers: { authorization: "Bearer pf_not-a-token" },
    data: body,
  });
  expect(badToken.status()).toBe(401);
  expect((await badToken.json()).error.code).toBe("unauthenticated:token");

  const invalid = await request.post("/api/v1/check", {
    headers: { authorization: `Bearer ${token.secret}` },
    data: { ...body, caseTemp: "hot" },
  });
  expect(invalid.status()).toBe(400);
  expect((await invalid.json()).error.path).toBe("caseTemp");

  const revoked = await request.delete(`/api/account/tokens/${token.id}`, { headers: { origin } });
  expect(revoked.ok()).toBe(true);
  await expect
    .poll(async () => {
      const res = await request.post("/api/v1/check", {
        headers: { authorization: `Bearer ${token.secret}` },
        data: body,
      });
      return res.status();
    })
    .toBe(401);
});
