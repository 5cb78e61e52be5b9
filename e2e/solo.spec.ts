import { expect, test } from "@playwright/test";
import { runStamp } from "./fixtures/stamp";
import { signUp } from "./pages/auth-pages";
import { ComparePage } from "./pages/decisions-page";
import { saveScreenshot } from "./screenshots";

// A one-person team: whoever signs up founds the workspace as admin with lead rights, adds the invented sample
// project in one click, and signs a decision alone. Role changes confirm, say they saved and can be undone.

const stamp = runStamp();
const solo = {
  name: "Wren Okafor",
  email: `wren.${stamp}@pulsefence.test`,
  password: "long-enough-solo-pass",
  workspaceName: `Solo Bench ${stamp}`,
};

test("a single user signs up, adds the sample project and signs a decision alone", async ({ page }) => {
  test.setTimeout(120_000);
  await signUp(page, solo);
  await expect(page.getByRole("region", { name: "Next step" })).toContainText("sample project");
  await saveScreenshot(page, "solo-overview-empty");
  await page.getByRole("button", { name: "Add a sample project" }).click();
  await expect(page).toHaveURL(/\/projects\/[0-9a-f-]{36}$/);
  await expect(page.getByRole("heading", { level: 1 })).toContainText("Sample:");
  const projectUrl = page.url();

  await page.goto("/app");
  await expect(page.getByRole("region", { name: "Recent projects" })).toContainText("Sample:");
  await expect(page.getByRole("region", { name: "Parts awaiting verification" })).toContainText("QM-80T16");
  await expect(page.getByRole("region", { name: "Next step" })).toContainText("unverified draft");
  await saveScreenshot(page, "solo-overview-with-sample");

  const compare = new ComparePage(page);
  await page.goto(`${projectUrl}/compare`);
  const form = await compare.fillDecision(
    "BFL-100L55",
    "Sample run: the linear-mode part passes every pulse.",
  );
  await compare.sign(form);
  await expect(page.getByRole("heading", { level: 1 })).toContainText("BFL-100L55");
  await expect(page.getByText(solo.name).first()).toBeVisible();
  await saveScreenshot(page, "solo-decision");
});

test("a role change asks first, says it saved, and can be undone", async ({ page }) => {
  await signUp(page, {
    ...solo,
    email: `wren2.${stamp}@pulsefence.test`,
    workspaceName: `Solo Two ${stamp}`,
  });
  await page.goto("/team");
  const role = page.getByLabel(`Role of ${solo.name}`);
  await role.selectOption({ label: "Engineer" });
  await expect(page.getByText(`Change ${solo.name} from admin to engineer?`)).toBeVisible();
  await saveScreenshot(page, "team-role-confirm");
  await page.getByRole("button", { name: "Cancel" }).click();
  await expect(role).toHaveValue("admin");

  const leadRights = page.getByRole("checkbox", { name: "Lead rights" });
  await expect(leadRights).toBeChecked();
  await leadRights.click(); // a controlled box: it shows the saved value once the server answers
  await expect(page.getByRole("status").filter({ hasText: "no longer holds lead rights" })).toBeVisible();
  await expect(leadRights).not.toBeChecked();
  await saveScreenshot(page, "team-role-saved");
  await page.getByRole("button", { name: "Undo" }).click();
  await expect(leadRights).toBeChecked();
});
