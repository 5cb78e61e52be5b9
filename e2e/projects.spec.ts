import { expect, test } from "@playwright/test";
import { runStamp } from "./fixtures/stamp";
import { AppShell } from "./pages/app-shell";
import { signIn } from "./pages/auth-pages";
import { engineer, technician } from "./pages/demo-people";
import { ProjectsPage } from "./pages/projects-page";
import { saveScreenshot } from "./screenshots";

const stamp = runStamp();
const projectName = `Cargo bike disconnect ${stamp}`;
const parts = ["QM-80T16", "QM-100G28", "BFL-100L55"];

// Five rows as a scope's measurement table gives them: a header with units, tab-separated.
const benchRows = [
  "Label\tV_DS [V]\tI_D [A]\tWidth\tShape",
  "Pre-charge, board 3\t47.5\t1.45\t46 ms\ttriangle",
  "Short, first try\t48\t22\t90 µs\trect",
  "Short, retry\t48\t22\t90 µs\trect",
  "Load step\t24\t6\t2 ms\trect",
  "Clamp tail\t62\t40\t3 µs\ttriangle",
].join("\n");

test("an engineer builds an inrush fault case; a technician logs bench pulses and sees them checked", async ({
  page,
}) => {
  const projects = new ProjectsPage(page);
  const shell = new AppShell(page);

  const url =
    await test.step("the engineer creates a project at 85 °C with the three demo parts", async () => {
      await signIn(page, engineer);
      await expect(shell.item("Projects")).toBeVisible();
      const projectUrl = await projects.create(projectName, "85");
      await expect(page.getByText("85\u2009°C").first()).toBeVisible();
      for (const part of parts) await projects.addCandidate(part);
      return projectUrl;
    });

  await test.step("the engineer builds the pre-charge inrush from the circuit", async () => {
    await projects.openTab("Fault cases");
    await expect(page).toHaveURL(/\?tab=fault-cases$/);
    const builder = projects.builder("Inrush");
    await builder.getByLabel(/Supply/).fill("48");
    await builder.getByLabel(/Load capacitance/).fill("1.5m");
    await builder.getByLabel("Slew rate dV/dt").fill("1");
    const figures = builder.getByTestId("builder-figures");
    await expect(figures.locator('[data-figure="chargeCurrent"]')).toHaveText("1.5\u2009A");
    await expect(figures.locator('[data-figure="rampTime"]')).toHaveText("48\u2009ms");
    await expect(figures.locator('[data-figure="energy"]')).toHaveText("1.728\u2009J");
    await expect(builder.getByTestId("built-pulse")).toContainText("falling triangle");
    await expect(builder.getByTestId("built-pulse")).toContainText(
      "48\u2009V × 1.5\u2009A peak for 48\u2009ms",
    );
    await saveScreenshot(page, "project-builder");
    await builder.getByRole("button", { name: "Create fault case" }).click();
    await expect(page.getByRole("status").filter({ hasText: "Pre-charge inrush" })).toBeVisible();
    await expect(page.getByRole("table", { name: "Fault cases" })).toContainText("from the inrush builder");
  });

  await test.step("the results: the low-R_DS(on) part fails the inrush, the linear-mode part passes", async () => {
    await projects.openTab("Results");
    await expect(projects.verdictCell("Pre-charge inrush", "QM-80T16")).toHaveAttribute(
      "data-verdict",
      "fail",
    );
    await expect(projects.verdictCell("Pre-charge inrush", "QM-80T16")).toContainText("fail");
    await expect(projects.verdictCell("Pre-charge inrush", "BFL-100L55")).toHaveAttribute(
      "data-verdict",
      "pass",
    );
    await projects.results.getByRole("button", { name: /Pre-charge inrush/ }).click();
    await expect(page.getByTestId("result-details")).toContainText("energy divided by its peak power");
    await shell.signOut();
  });

  await test.step("the technician pastes five rows and previews their verdicts", async () => {
    await signIn(page, technician);
    await page.goto(`${url}?tab=bench`);
    await expect(page.getByRole("link", { name: "Settings" })).toHaveCount(0);
    await page.getByRole("textbox", { name: "Rows from the bench" }).fill(benchRows);
    await page.getByRole("button", { name: "Preview" }).click();
    const preview = page.getByRole("table", { name: "Preview of the pasted rows" });
    await expect(preview.getByRole("row")).toHaveCount(6);
    for (const part of parts) {
      await expect(preview.locator(`td[data-part="${part}"]`)).toHaveCount(5);
    }
    await expect(preview.locator('td[data-part="QM-80T16"][data-verdict="fail"]').first()).toBeVisible();
    await saveScreenshot(page, "project-bench-preview");
  });

  await test.step("the technician saves them and sees them in the results and on the charts", async () => {
    await page.getByLabel("Board serial").fill("BDU-B3-0142");
    await page.getByLabel("Probe").fill("50 A current probe, 10:1 voltage");
    await page.getByRole("button", { name: "Save 5 rows" }).click();
    await expect(page.getByRole("status").filter({ hasText: "Saved 5 measured pulses" })).toBeVisible();
    const measured = page.getByRole("table", { name: "Measured pulses" });
    await expect(measured.getByRole("row")).toHaveCount(6);
    await expect(measured).toContainText("you");

    await projects.openTab("Results");
    await expect(projects.results.getByRole("rowheader", { name: /Clamp tail/ })).toBeVisible();
    for (const part of parts) {
      const chart = projects.chart(part);
      await expect(chart.locator("[data-pulse]")).toHaveCount(6);
    }
    await expect(page.getByText(/check is an aid/).first()).toBeVisible();
    await saveScreenshot(page, "project-results");
  });
});

test("the projects list switches to the archived projects and back, in the URL", async ({ page }) => {
  const projects = new ProjectsPage(page);
  const name = `Archived board ${stamp}`;
  await signIn(page, engineer);
  const url = await projects.create(name, "25");
  await page.goto(`${url}/settings`);
  await page.getByRole("button", { name: "Archive project" }).click();
  await page.getByRole("button", { name: "Archive", exact: true }).click();
  await expect(page.getByRole("button", { name: "Restore project" })).toBeVisible();

  await page.goto("/projects");
  await expect(page.getByRole("table", { name: "Projects" })).not.toContainText(name);
  await page.getByRole("button", { name: /^Show \d+ archived projects?$/ }).click();
  await expect(page).toHaveURL(/\/projects\?archived=true$/);
  await expect(page.getByRole("table", { name: "Archived projects" })).toContainText(name);
  await page.reload();
  await expect(page.getByRole("table", { name: "Archived projects" })).toContainText(name);
  await page.goBack();
  await expect(page).toHaveURL(/\/projects$/);
  await expect(page.getByRole("table", { name: "Projects" })).not.toContainText(name);
  await page.goForward();
  await page.getByRole("button", { name: "Back to the active projects" }).click();
  await expect(page).toHaveURL(/\/projects$/);
  await expect(page.getByRole("table", { name: "Projects" })).toBeVisible();
});
