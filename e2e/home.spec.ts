import { expect, test } from "@playwright/test";
import { saveScreenshot } from "./screenshots";

test("the landing page explains the product and links to sign-in", async ({ page }) => {
  await page.goto("/");
  await expect(page.getByRole("heading", { level: 1 })).toHaveText(
    "Every stress pulse, checked against the limits the datasheet draws.",
  );
  await expect(page.getByRole("link", { name: "Sign in" })).toHaveAttribute("href", "/sign-in");
  const sketch = page.getByRole("img", { name: /log-log SOA chart/ });
  await expect(sketch).toBeVisible();
  // Drawn through the one chart frame: decades labelled in engineering notation (DESIGN.md, charts), three pulses.
  await expect(sketch.locator("[data-tick=x]")).toHaveText(["1", "10", "100"]);
  await expect(sketch.locator("[data-tick=y]")).toHaveText(["0.1", "1", "10", "100", "1k"]);
  await expect(page.getByText(/aid to engineering judgement/)).toBeVisible();
  await saveScreenshot(page, "home");
});

test("the health endpoint reports every service ok", async ({ request }) => {
  const res = await request.get("/api/health");
  expect(res.status()).toBe(200);
  expect(await res.json()).toEqual({ db: "ok", storage: "ok", mail: "ok" });
});
