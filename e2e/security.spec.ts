import { expect, test } from "@playwright/test";
import { signIn } from "./pages/auth-pages";

// The seeded demo engineer (README.md, "Demo sign-in").
const engineer = { name: "", email: "engineer@tidewater.example", password: "tidewater-engineer-demo" };

test("pages carry a nonce-based content security policy and still work under it", async ({ page }) => {
  const violations: string[] = [];
  page.on("console", (message) => {
    if (/content security policy|Refused to/i.test(message.text())) violations.push(message.text());
  });

  const landing = await page.goto("/");
  const headers = landing?.headers() ?? {};
  expect(headers["content-security-policy"]).toMatch(/script-src 'self' 'nonce-[^']+' 'strict-dynamic'/);
  expect(headers["content-security-policy"]).toContain("frame-ancestors 'none'");
  expect(headers["x-frame-options"]).toBe("DENY");
  expect(headers["referrer-policy"]).toBe("same-origin");
  expect(headers["x-content-type-options"]).toBe("nosniff");

  // Signing in needs the client-side form: it proves the app's scripts run under the policy.
  await signIn(page, engineer);
  await page.goto("/library");
  await expect(page.getByRole("heading", { level: 1 })).toBeVisible();
  await page.goto("/projects");
  await expect(page.getByRole("heading", { level: 1 })).toBeVisible();
  expect(violations).toEqual([]);
});

test("a record that is not in the workspace answers HTTP 404, not a 200 with the not-found screen", async ({
  page,
}) => {
  await signIn(page, engineer);
  // An id of no record of this workspace (another workspace's record is the same to this member).
  const elsewhere = "00000000-0000-4000-8000-000000000000";
  for (const path of [`/projects/${elsewhere}`, `/library/${elsewhere}`, `/projects/${elsewhere}/compare`]) {
    const res = await page.goto(path);
    expect(res?.status()).toBe(404);
  }
});

test("a cross-origin sign-in is refused without a session", async ({ request }) => {
  const res = await request.post("/api/auth/sign-in", {
    headers: { origin: "https://evil.example", "content-type": "text/plain" },
    data: JSON.stringify({ email: engineer.email, password: engineer.password }),
  });
  expect(res.status()).toBe(403);
  expect(res.headers()["set-cookie"]).toBeUndefined();
});
