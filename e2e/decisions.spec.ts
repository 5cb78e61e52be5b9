import { execFileSync } from "node:child_process";
import { readFileSync } from "node:fs";
import path from "node:path";
import { expect, type Page, test } from "@playwright/test";
import { signIn } from "./pages/auth-pages";
import { ComparePage, createComparedProject, signDecisionThroughApi } from "./pages/decisions-page";
import { engineer, lead } from "./pages/demo-people";
import { saveScreenshot, screenshotDir } from "./screenshots";

// The lead's job on the demo scenario: compare the three demo parts on the pre-charge inrush, see the
// low-R_DS(on) part fail it and the linear-mode part pass, sign the decision, and take the PDF away.

const inrush = { name: "Pre-charge inrush", kind: "triangle" as const, v: 48, i: 1.5, duration: 0.048 };
const demoParts = ["QM-80T16", "QM-100G28", "BFL-100L55"];

/** Each test sets up its own project, compared on the inrush through the API as the signed-in user. */
async function newComparedProject(page: Page, baseURL: string) {
  const projectName = `Cargo bike disconnect ${Date.now().toString(36)}${Math.random().toString(36).slice(2, 6)}`;
  const projectId = await createComparedProject(
    page.request,
    baseURL,
    { name: projectName, caseTemp: 85 },
    inrush,
    demoParts,
  );
  return { projectId, projectName };
}

test.describe("compare and decide", () => {
  test("the engineer sets up the comparison and sees no decision control", async ({ page, baseURL }) => {
    await signIn(page, engineer);
    const { projectId } = await newComparedProject(page, baseURL!);
    const compare = new ComparePage(page);
    await compare.open(projectId);
    await expect(compare.downloadCsv).toBeVisible();
    await expect(compare.recordDecision).toHaveCount(0);
    await expect(page.getByRole("form", { name: "Record decision" })).toHaveCount(0);
    const refused = await page.request.post(`/api/projects/${projectId}/decisions`, {
      headers: { origin: baseURL! },
      data: { partId: "any", rationale: "An engineer must not sign this." },
    });
    expect(refused.status()).toBe(403);

    await page.goto(`/projects/${projectId}/decisions`);
    await expect(page.getByText("A lead records it from the comparison of the candidates.")).toBeVisible();
    await expect(page.getByRole("table", { name: "Project history" })).toHaveCount(0);
  });

  test("the lead sees the inrush verdicts, signs for BFL-100L55 and downloads the PDF", async ({
    page,
    baseURL,
  }) => {
    // The longest journey of the suite, with its own project set up first: three times the usual time limit.
    test.slow();
    await signIn(page, lead);
    const { projectId, projectName } = await newComparedProject(page, baseURL!);
    const compare = new ComparePage(page);
    await compare.open(projectId);

    await expect(compare.cell("QM-80T16", inrush.name)).toContainText("fail");
    await expect(compare.cell("BFL-100L55", inrush.name)).toContainText("pass");
    await expect(compare.row("BFL-100L55").getByRole("cell").first()).toHaveText("1");

    await page.getByLabel("Failures only").check();
    await expect(page).toHaveURL(/failures=1/);
    await expect(compare.cell("QM-80T16", inrush.name)).toBeVisible();
    await page.getByLabel("Failures only").uncheck();

    await compare.cell("QM-80T16", inrush.name).click();
    await expect(page.getByTestId("cell-details")).toContainText("Outside the safe operating area");

    await expect(compare.overlay.locator("path[data-candidate]")).toHaveCount(3);
    await expect(compare.overlay).toContainText("BFL-100L55");
    await compare.cell("QM-80T16", inrush.name).scrollIntoViewIfNeeded();
    await saveScreenshot(page, "compare-matrix");

    const form = await compare.fillDecision(
      "BFL-100L55",
      "Rated for linear mode: passes the pre-charge inrush with margin where the trench part fails it.",
    );
    await expect(form.getByLabel("Chosen candidate")).toHaveAccessibleDescription(/Passes every pulse/);
    // The demo parts are library drafts: the form says so for each, and warns before signing.
    await expect(form.getByTestId("candidate-library-status")).toContainText("BFL-100L55 draft, unverified");
    await expect(form.getByRole("note")).toContainText(
      "Every candidate is still an unverified library draft",
    );
    await saveScreenshot(page, "decision-form");
    await compare.sign(form);
    await expect(page.getByRole("heading", { level: 1 })).toContainText("BFL-100L55");
    await expect(page.getByText("The standing decision for this project.")).toBeVisible();
    await expect(page.getByTestId("drift")).toContainText("Nothing has changed since the decision");
    await expect(page.getByRole("table", { name: "Frozen matrix" })).toContainText("fail");
    await expect(page.getByTestId("unverified-warning")).toContainText(
      "Every candidate was an unverified library draft",
    );
    await saveScreenshot(page, "decision");

    const [csvDownload] = await Promise.all([
      page.waitForEvent("download"),
      page.getByRole("link", { name: "Download CSV (frozen)" }).click(),
    ]);
    const csvPath = path.join(screenshotDir, "decision.csv");
    await csvDownload.saveAs(csvPath);
    const csvLines = readFileSync(csvPath, "utf8").split("\r\n");
    expect(csvLines[0]).toContain("rank,part,maker,library_status,verified_by");
    expect(csvLines[1]).toMatch(/^1,BFL-100L55,/);
    expect(csvLines.join("\n")).not.toMatch(/\d\.\d{6,}/);

    const [download] = await Promise.all([
      page.waitForEvent("download"),
      page.getByRole("link", { name: "Download PDF" }).click(),
    ]);
    expect(download.suggestedFilename()).toMatch(/^Cargo-bike-disconnect-[a-z0-9]+-\d{4}-\d{2}-\d{2}\.pdf$/);
    const pdf = path.join(screenshotDir, "decision.pdf");
    await download.saveAs(pdf);
    execFileSync("pdftoppm", [
      "-png",
      "-r",
      "80",
      "-f",
      "1",
      "-l",
      "1",
      "-singlefile",
      pdf,
      path.join(screenshotDir, "decision-pdf-page1"),
    ]);
    const text = execFileSync("pdftotext", ["-layout", pdf, "-"], { encoding: "utf8" });
    expect(text).toContain(projectName);
    expect(text).toContain("BFL-100L55");
    // Figures as lib/format.ts writes them on screen, with plain spaces for the PDF's font.
    expect(text).toMatch(/utilisation \d+(\.\d+)? %, allowed/);
    expect(text).toMatch(/derating ×\d(\.\d{1,2})?\b/);
    const firstPage = text.split("\f")[0];
    expect(firstPage).toMatch(/Caution/);
    expect(firstPage).toMatch(/unverified\s+library\s+draft/);

    await page.getByRole("link", { name: "Decisions", exact: true }).click();
    await expect(page.getByRole("list", { name: "Decision history" })).toContainText("Standing");
    await expect(page.getByRole("table", { name: "Project history" })).toContainText(
      "signed the decision for Brackenford Devices BFL-100L55",
    );
    await saveScreenshot(page, "decisions-history");
  });

  test("later edits show as drift while the record stays as signed", async ({ page, baseURL }) => {
    await signIn(page, lead);
    const { projectId, projectName } = await newComparedProject(page, baseURL!);
    const decisionUrl = await signDecisionThroughApi(
      page.request,
      baseURL!,
      projectId,
      "BFL-100L55",
      "Rated for linear mode: passes the pre-charge inrush with margin.",
    );
    const headers = { origin: baseURL! };
    const edited = await page.request.patch(`/api/projects/${projectId}`, {
      headers,
      data: { name: projectName, caseTemp: 110 },
    });
    expect(edited.ok(), await edited.text()).toBe(true);
    const added = await page.request.post(`/api/projects/${projectId}/fault-cases`, {
      headers,
      data: { name: "Output short", kind: "rect", v: 48, i: 30, duration: 0.00002 },
    });
    expect(added.ok(), await added.text()).toBe(true);

    await page.goto(decisionUrl);
    const drift = page.getByTestId("drift");
    await expect(drift).toContainText("85\u2009°C → 110\u2009°C");
    await expect(drift).toContainText("Output short");
    await expect(drift.getByRole("table", { name: "Results that changed" })).toContainText(
      "BFL-100L55 × Output short",
    );
    const frozen = page.getByRole("table", { name: "Frozen matrix" });
    await expect(frozen.getByRole("columnheader", { name: /Output short/ })).toHaveCount(0);
    await expect(frozen.getByRole("columnheader", { name: /Pre-charge inrush/ })).toHaveCount(1);
    await saveScreenshot(page, "decision-drift");
  });
});
