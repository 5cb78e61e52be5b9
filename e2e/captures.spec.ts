import { expect, test } from "@playwright/test";
import { signIn } from "./pages/auth-pages";
import { ProjectsPage } from "./pages/projects-page";
import { saveScreenshot } from "./screenshots";

// METHODS.md §6 (revision 2): every sample of a capture is read at its own width, and the sample that decided a
// failing verdict is shown: marked on the time charts, drawn on the SOA chart and named in the result's details.

const engineer = {
  name: "Imke Osei",
  email: "engineer@tidewater.example",
  password: "tidewater-engineer-demo",
};
const demoProject = "48 V battery disconnect, cargo bike";
const demoCapture = "Pre-charge ramp with controller idle load, board TW-03";

test("a failing capture shows the sample that decided it", async ({ page }) => {
  const projects = new ProjectsPage(page);
  await signIn(page, engineer);
  await page.goto("/projects");
  await page.getByRole("link", { name: demoProject }).first().click();
  await expect(page.getByRole("heading", { level: 1, name: demoProject })).toBeVisible();

  await test.step("the capture's verdicts and the binding sample on its traces", async () => {
    await projects.openTab("Captures");
    const view = page.getByTestId("capture-view");
    const verdicts = view.getByRole("table", { name: `Verdicts for ${demoCapture}` });
    const failing = verdicts.getByRole("row").filter({ hasText: "QM-80T16" });
    await expect(failing.locator('[data-verdict="fail"]')).toBeVisible();
    const marks = view.getByTestId("binding-mark");
    await expect(marks.first()).toBeVisible();
    await expect(view.getByTestId("capture-traces")).toContainText("QM-80T16: binding sample");
    await expect(failing.getByTestId("binding-cell")).toContainText("48");
    await saveScreenshot(page, "capture-binding-sample");
  });

  await test.step("the result's details name the binding sample and the view that decided", async () => {
    await projects.openTab("Results");
    const row = projects.results.getByRole("row").filter({
      has: page.getByRole("rowheader", { name: new RegExp(demoCapture) }),
    });
    await row.getByRole("button").first().click();
    const details = page.getByTestId("result-details");
    await expect(details.getByTestId("binding-sample").first()).toContainText("read at");
    // The demo parts carry transfer characteristics (issue 11): the pre-charge capture fails the trench part on its
    // stability factor, whatever its curves say.
    await expect(details.getByTestId("decided-by").first()).toContainText("stability factor");
    await saveScreenshot(page, "capture-result-details");
  });
});
