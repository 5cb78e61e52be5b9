import { expect, test } from "@playwright/test";
import { shortStamp } from "./fixtures/stamp";
import { signIn } from "./pages/auth-pages";
import { createComparedProject } from "./pages/decisions-page";
import { engineer } from "./pages/demo-people";
import { ProjectsPage } from "./pages/projects-page";
import { saveScreenshot } from "./screenshots";

// Issue 11, the builders: an engineer builds an unclamped turn-off (an avalanche pulse) and a fault sequence (hold in
// current limit, clamped turn-off, pause, restarts) on the demo candidates, sees the sequence's power and each
// candidate's Tj over the whole of it, and finds both in the results.

const stamp = shortStamp();
const typed = { name: "Typed short", kind: "rect" as const, v: 48, i: 10, duration: 1e-3 };

test("the turn-off builder's unclamped case and the fault-sequence builder make checked fault cases", async ({
  page,
  baseURL,
}) => {
  test.setTimeout(150_000);
  const projects = new ProjectsPage(page);
  await signIn(page, engineer);
  const projectId = await createComparedProject(
    page.request,
    baseURL!,
    { name: `Sequences ${stamp}`, caseTemp: 40 },
    typed,
    ["QM-80T16", "BFL-100L55"],
  );
  await page.goto(`/projects/${projectId}`);
  await projects.openTab("Fault cases");

  await test.step("an unclamped turn-off becomes an avalanche pulse", async () => {
    await page.getByRole("radio", { name: "Turn-off", exact: true }).check({ force: true });
    const builder = projects.builder("Turn-off");
    await builder.getByRole("radio", { name: "with no clamp (avalanche)" }).check();
    await expect(builder.getByLabel(/Clamp/)).toHaveCount(0);
    await builder.getByLabel("Loop inductance L").fill("10u");
    await builder.getByLabel(/trip,max/).fill("20");
    await builder.getByLabel(/bus/).fill("48");
    await expect(builder.getByTestId("built-pulse")).toContainText("unclamped turn-off (avalanche)");
    await expect(builder.getByTestId("built-pulse")).toContainText("20 A cut through 10 µH from 48 V");
    await expect(builder.getByTestId("builder-figures")).toContainText("2 mJ");
    await builder.getByLabel("Fault case name").fill("Short, no clamp");
    await saveScreenshot(page, "builder-unclamped-turn-off");
    await builder.getByRole("button", { name: "Create fault case" }).click();
    const table = page.getByRole("table", { name: "Fault cases" });
    await expect(table).toContainText("from the unclamped turn-off builder");
    await expect(table.getByRole("row").filter({ hasText: "Short, no clamp" })).toContainText("L 10");
  });

  await test.step("a fault sequence shows its power and each candidate's Tj over the whole sequence", async () => {
    await page.getByRole("radio", { name: "Fault sequence", exact: true }).check({ force: true });
    const builder = projects.builder("Fault sequence");
    await builder.getByLabel(/Highest supply/).fill("54.6");
    await builder.getByLabel(/Limit current/).fill("8");
    await builder.getByLabel("Fault timer").fill("2m");
    await builder.getByLabel("Loop inductance L").fill("1u");
    await builder.getByLabel(/Clamp/).fill("75");
    await builder.getByLabel("Restarts").fill("3");
    await builder.getByLabel("Pause before each restart").fill("5m");
    const figures = builder.getByTestId("builder-figures");
    // Worked by hand: 54.6 V × 8 A × 2 ms = 873.6 mJ per hold; 4 attempts.
    await expect(figures).toContainText("873.6 mJ");
    await expect(figures).toContainText("Attempts");
    const traces = builder.getByTestId("sequence-traces");
    await expect(traces).toBeVisible();
    // One T_j line per candidate with a thermal model, named in the chart's legend.
    await expect(traces).toContainText("QM-80T16");
    await expect(traces).toContainText("BFL-100L55");
    await traces.scrollIntoViewIfNeeded();
    await saveScreenshot(page, "builder-fault-sequence");
    await builder.getByLabel("Fault case name").fill("Short with three restarts");
    await builder.getByRole("button", { name: "Create fault case" }).click();
    const table = page.getByRole("table", { name: "Fault cases" });
    await expect(table.getByRole("row").filter({ hasText: "Short with three restarts" })).toContainText(
      "fault sequence",
    );
  });

  await test.step("the results check both: the sequence sample by sample, the turn-off on its energy", async () => {
    await projects.openTab("Results");
    for (const name of ["Short with three restarts", "Short, no clamp"]) {
      for (const part of ["QM-80T16", "BFL-100L55"]) {
        await expect(projects.verdictCell(name, part)).toContainText(/pass|marginal|fail|no data/);
      }
    }
    await projects.results.getByRole("button", { name: /Short with three restarts/ }).click();
    await expect(page.getByTestId("result-details").first()).toContainText("fault sequence");
    await saveScreenshot(page, "results-fault-sequence");
  });
});
