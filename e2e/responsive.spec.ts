import AxeBuilder from "@axe-core/playwright";
import { expect, type Page, test } from "@playwright/test";
import { signIn } from "./pages/auth-pages";
import { lead } from "./pages/demo-people";
import { saveScreenshot } from "./screenshots";

// Every main page at a phone's, a tablet's and a desktop's size: no horizontal page overflow (wide tables scroll
// inside their cards), the narrow-screen menu reaches the navigation, workspace and sign-out, and axe-core finds
// no serious or critical accessibility violation (WCAG 2 A and AA rules).

const sizes = [
  { name: "phone", width: 390, height: 844 },
  { name: "tablet", width: 820, height: 1180 },
  { name: "desktop", width: 1440, height: 900 },
] as const;

/** The page's width must fit the window: nothing spills sideways (1 px for rounding). */
async function expectNoHorizontalOverflow(page: Page, label: string): Promise<void> {
  const { scroll, inner } = await page.evaluate(() => ({
    scroll: document.documentElement.scrollWidth,
    inner: window.innerWidth,
  }));
  expect
    .soft(scroll, `${label}: page ${scroll} px wide in a ${inner} px window`)
    .toBeLessThanOrEqual(inner + 1);
}

async function expectNoSeriousAxeViolations(page: Page, label: string): Promise<void> {
  const result = await new AxeBuilder({ page }).withTags(["wcag2a", "wcag2aa"]).analyze();
  const serious = result.violations
    .filter((v) => v.impact === "serious" || v.impact === "critical")
    .map((v) => `${v.id} (${v.impact}): ${v.nodes.map((n) => n.target.join(" ")).join(", ")}`);
  expect.soft(serious, `${label}: axe-core violations`).toEqual([]);
}

/** Waits until the page has its title and its data requests are done. */
async function settled(page: Page): Promise<void> {
  await expect(page.getByRole("heading", { level: 1 })).toBeVisible();
  await page.waitForLoadState("networkidle");
}

/** The main pages, found from the seeded demo workspace (a project and a part of it). */
async function mainPages(page: Page): Promise<{ name: string; url: string }[]> {
  await page.goto("/projects");
  const project = await page.getByRole("table").getByRole("link").first().getAttribute("href");
  await page.goto("/library");
  const part = await page.getByRole("table").getByRole("link").first().getAttribute("href");
  expect(project && part).toBeTruthy();
  return [
    { name: "overview", url: "/app" },
    { name: "library", url: "/library" },
    { name: "part", url: part! },
    { name: "projects", url: "/projects" },
    { name: "project-results", url: project! },
    { name: "project-fault-cases", url: `${project}?tab=fault-cases` },
    { name: "project-bench", url: `${project}?tab=bench` },
    { name: "project-captures", url: `${project}?tab=captures` },
    { name: "compare", url: `${project}/compare` },
    { name: "decisions", url: `${project}/decisions` },
    { name: "team", url: "/team" },
    { name: "account", url: "/account" },
  ];
}

for (const size of sizes) {
  // axe-core runs once per page, at the desktop size (it takes seconds a page); the phone menu is checked below.
  const withAxe = size.name === "desktop";
  test(`every main page fits a ${size.name} (${size.width} px)${withAxe ? ", with no serious accessibility violations" : ""}`, async ({
    page,
  }) => {
    test.setTimeout(withAxe ? 300_000 : 180_000);
    await page.setViewportSize({ width: size.width, height: size.height });
    await signIn(page, lead);
    for (const p of await mainPages(page)) {
      const label = `${p.name} at ${size.name}`;
      await page.goto(p.url);
      await settled(page);
      await expectNoHorizontalOverflow(page, label);
      if (withAxe) await expectNoSeriousAxeViolations(page, label);
      await saveScreenshot(page, `responsive-${size.name}-${p.name}`);
    }
  });
}

test("on a phone the menu opens the navigation, the workspace and sign-out; tabs are thumb-sized", async ({
  page,
}) => {
  await page.setViewportSize({ width: 390, height: 844 });
  await signIn(page, lead);
  await expect(page.getByRole("navigation", { name: "Main" })).toHaveCount(0);
  const menu = page.getByRole("button", { name: "Menu" });
  const box = await menu.boundingBox();
  expect(box!.height).toBeGreaterThanOrEqual(44);
  await menu.click();
  await expect(menu).toHaveAttribute("aria-expanded", "true");
  const nav = page.getByRole("navigation", { name: "Main" });
  await expect(nav.getByRole("link", { name: "Projects", exact: true })).toBeVisible();
  await expect(page.getByRole("button", { name: "Sign out" })).toBeVisible();
  await expect(page.getByText("Tidewater Power Lab").last()).toBeVisible();
  await expectNoSeriousAxeViolations(page, "the open menu on a phone");
  await saveScreenshot(page, "responsive-phone-menu-open");
  await nav.getByRole("link", { name: "Projects", exact: true }).click();
  await expect(page.getByRole("heading", { level: 1, name: "Projects" })).toBeVisible();
  await expect(page.getByRole("navigation", { name: "Main" })).toHaveCount(0);

  await page.getByRole("table").getByRole("link").first().click();
  const tabs = page.getByRole("tab");
  await expect(tabs.first()).toBeVisible();
  for (const tab of await tabs.all()) {
    const b = await tab.boundingBox();
    expect(b!.height, (await tab.textContent()) ?? "").toBeGreaterThanOrEqual(44);
  }
  await page.getByRole("tab", { name: "Bench" }).click();
  await expect(page.getByRole("tab", { name: "Bench" })).toHaveAttribute("aria-selected", "true");
  await saveScreenshot(page, "responsive-phone-project-bench-tab");
});

test("the skip link is the first stop of the keyboard and leads to the page; sign-in goes e-mail, password, button", async ({
  page,
}) => {
  await page.goto("/sign-in");
  await page.getByLabel("E-mail").focus();
  await page.keyboard.press("Tab");
  await expect(page.getByLabel("Password", { exact: true })).toBeFocused();
  await page.keyboard.press("Tab");
  await expect(page.getByRole("button", { name: "Sign in" })).toBeFocused();
  await signIn(page, lead);
  await page.goto("/app");
  await page.keyboard.press("Tab");
  const skip = page.getByRole("link", { name: "Skip to content" });
  await expect(skip).toBeFocused();
  await expect(skip).toBeVisible();
  await saveScreenshot(page, "skip-link-focused");
  await page.keyboard.press("Enter");
  await expect(page.locator("main#main")).toBeFocused();
});
