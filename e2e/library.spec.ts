import { expect, test } from "@playwright/test";
import { shortStamp } from "./fixtures/stamp";
import { AppShell } from "./pages/app-shell";
import { signIn } from "./pages/auth-pages";
import { engineer, technician } from "./pages/demo-people";
import { createPart, fixture, LibraryList, PartPage, plain } from "./pages/library-page";
import { saveScreenshot } from "./screenshots";

const demoParts = ["QM-80T16", "QM-100G28", "BFL-100L55"];
const stamp = shortStamp();

test("an engineer adds a part, drops its SOA curves and reads them derated and between widths", async ({
  page,
}) => {
  const shell = new AppShell(page);
  const list = new LibraryList(page);
  const part = new PartPage(page);
  const partNumber = `LX60-${stamp}`;

  await test.step("the engineer opens the library and sees the demo parts", async () => {
    await signIn(page, engineer);
    await shell.open("Library");
    for (const demo of demoParts) await expect(list.row(demo)).toHaveCount(1);
    await expect(list.row("QM-80T16")).toContainText("Quillmere Semiconductor");
    await saveScreenshot(page, "library-list");
  });

  await test.step("the search and the sort live in the URL", async () => {
    await page.getByRole("searchbox", { name: "Search" }).fill("BFL");
    await expect(page).toHaveURL(/q=BFL/);
    await expect(list.row("BFL-100L55")).toHaveCount(1);
    await expect(list.row("QM-80T16")).toHaveCount(0);
    await page.getByRole("searchbox", { name: "Search" }).fill("");
    await expect(list.row("QM-80T16")).toHaveCount(1);
  });

  await test.step("the engineer creates a new part", async () => {
    await list.newPart.first().click();
    await expect(page.getByRole("heading", { level: 1, name: "New part" })).toBeVisible();
    await page.getByRole("button", { name: "Create part" }).click();
    await expect(page.getByText("Required").first()).toBeVisible();
    await createPart(page, {
      partNumber,
      maker: "Lindqvarn Devices",
      technology: "Si MOSFET",
      package: "TO-220",
      vdss: "60",
      id: "100",
      idm: "250 A",
      rdsOn: "3m",
      tjMax: "175",
      rth: "0.9",
    });
    await expect(page.getByText("No SOA curves yet")).toBeVisible();
  });

  await test.step("the upload panel links the example CSV files, served as static files", async () => {
    for (const [name, href] of [
      ["Example: table form (CSV)", "/examples/soa-curves-table.csv"],
      ["Example: paired columns (CSV)", "/examples/soa-curves-paired.csv"],
    ]) {
      await expect(page.getByRole("link", { name })).toHaveAttribute("href", href);
      const res = await page.request.get(href);
      expect(res.status()).toBe(200);
      expect(res.headers()["content-type"]).toContain("text/csv");
      expect(await res.text()).toContain("V_DS [V]");
    }
  });

  await test.step("dropping a CSV shows the progress, then the chart with every curve", async () => {
    // Hold the check's request at the network layer until its progress words have been seen, then let it go.
    let release = () => {};
    const held = new Promise<void>((resolve) => {
      release = resolve;
    });
    await page.route("**/curve-sets", async (route) => {
      await held;
      await route.continue();
    });
    await part.dropCsv("soa-curves.csv");
    await expect(page.getByText("Checking the curves…")).toBeVisible();
    await expect(page.getByRole("progressbar", { name: "Checking the curves…" })).toBeVisible();
    await expect(page.getByText("soa-curves.csv accepted: 5 curves")).toHaveCount(0);
    release();
    await expect(page.getByText("soa-curves.csv accepted: 5 curves")).toBeVisible();
    await page.unroute("**/curve-sets");
    await expect(part.series("curve")).toHaveCount(5);
    expect(await part.curveLabels()).toEqual(["10 µs", "100 µs", "1 ms", "10 ms", "DC"]);
    const xTicks = (await part.chart.locator('svg text[data-tick="x"]').allTextContents()).map(plain);
    expect(xTicks).toEqual(["0.1", "1", "10", "100"]);
    const yTicks = (await part.chart.locator('svg text[data-tick="y"]').allTextContents()).map(plain);
    expect(yTicks).toEqual(["1", "10", "100", "1k"]);
    await expect(page.getByRole("list", { name: "Findings" })).toContainText("Steeper than a resistor line");
    await expect(part.chart.locator('[data-finding="1"]')).toHaveCount(1);
    await expect(page.getByRole("table", { name: "Curve-set revisions" })).toContainText("soa-curves.csv");
  });

  await test.step("a higher case temperature draws the derated curves dashed", async () => {
    await expect(part.series("derated")).toHaveCount(0);
    await part.setCaseTemperature(100);
    await expect(part.series("derated")).toHaveCount(5);
    await expect(part.series("derated").first()).toHaveAttribute("stroke-dasharray", /\d/);
    await expect(page.getByText(/Dashed: the curves derated ×0\.5 for 100/)).toBeVisible();
  });

  await test.step("a typed pulse width draws its interpolated line, with the caveat in words", async () => {
    await part.setPulseWidth("2 ms");
    await expect(part.series("interpolated")).toHaveCount(1);
    await expect(part.series("interpolated")).toHaveAttribute("stroke-dasharray", /\d/);
    expect(await part.curveLabels("interpolated")).toEqual(["2 ms interp."]);
    await expect(page.getByTestId("width-explanation")).toContainText("bends toward");
    await part.chart.scrollIntoViewIfNeeded();
    await saveScreenshot(page, "part-chart");
  });

  await test.step("a malformed CSV is refused with its rows, columns and reasons", async () => {
    await part.chooseCsv("soa-malformed.csv");
    await expect(part.rejected).toContainText("nothing was stored");
    const issues = page.getByRole("table", { name: "Problems in soa-malformed.csv" });
    await expect(issues.getByRole("row").nth(1)).toContainText("3");
    await expect(issues.getByRole("row").nth(1)).toContainText("I_D [A]");
    await expect(issues.getByRole("row").nth(1)).toContainText("must be greater than 0");
    await expect(issues.getByRole("row").filter({ hasText: "'abc' is not a number" })).toContainText(
      "V_DS [V]",
    );
    await expect(part.series("curve")).toHaveCount(5);
    await part.rejected.scrollIntoViewIfNeeded();
    await saveScreenshot(page, "part-upload-errors");
  });

  await test.step("a Z_th curve is fitted to a thermal model and drawn over its points", async () => {
    await page
      .getByTestId("zth-dropzone")
      .locator("input[type=file]")
      .setInputFiles(fixture("zth-curve.csv"));
    await expect(page.getByText("Fitted 4 terms to zth-curve.csv and saved them.")).toBeVisible();
    await expect(page.getByRole("table", { name: "Foster terms" }).getByRole("row")).toHaveCount(5);
    await expect(page.getByTestId("zth-chart").locator('path[data-series="foster"]')).toHaveCount(1);
    await expect(page.getByText(/Fitted to zth-curve\.csv \(rings\): RMS error/)).toBeVisible();
  });
});

test("a technician reads the library but sees no controls to change it", async ({ page }) => {
  const list = new LibraryList(page);
  const part = new PartPage(page);
  await signIn(page, technician);
  await page.goto("/library");
  await expect(list.row("QM-80T16")).toHaveCount(1);
  await expect(list.newPart).toHaveCount(0);
  await list.row("QM-80T16").getByRole("link", { name: "QM-80T16" }).click();
  await expect(page.getByRole("heading", { level: 1 })).toContainText("QM-80T16");
  await expect(part.series("curve").first()).toBeVisible();
  await expect(part.dropzone).toHaveCount(0);
  await expect(page.locator("input[type=file]")).toHaveCount(0);
  for (const name of ["Edit part", "Archive…", "Mark verified", "Save thermal model", "Make active"]) {
    await expect(page.getByRole("button", { name })).toHaveCount(0);
  }
  await expect(page.getByRole("link", { name: "Edit part" })).toHaveCount(0);
  await expect(page.getByRole("table", { name: "Foster terms" }).locator("input")).toHaveCount(0);
  await page.goto("/library/new");
  await expect(page.getByRole("heading", { level: 1, name: "Not for your role" })).toBeVisible();
  await expect(page.getByTestId("not-allowed")).toContainText("admin, lead, engineer");
});
