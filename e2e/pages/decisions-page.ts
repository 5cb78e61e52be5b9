import { type APIRequestContext, expect, type Locator, type Page } from "@playwright/test";

/** Creates a project with the three demo parts as candidates and one fault case, through the API. */
export async function createComparedProject(
  request: APIRequestContext,
  origin: string,
  project: { name: string; caseTemp: number },
  faultCase: { name: string; kind: "rect" | "triangle"; v: number; i: number; duration: number },
  partNumbers: string[],
): Promise<string> {
  const headers = { origin };
  const created = await request.post("/api/projects", { headers, data: project });
  expect(created.status(), await created.text()).toBe(201);
  const projectId: string = (await created.json()).project.id;
  for (const partNumber of partNumbers) {
    const added = await request.post(`/api/projects/${projectId}/candidates`, {
      headers,
      data: { partId: await demoPartId(request, partNumber) },
    });
    expect(added.ok(), await added.text()).toBe(true);
  }
  const fault = await request.post(`/api/projects/${projectId}/fault-cases`, { headers, data: faultCase });
  expect(fault.ok(), await fault.text()).toBe(true);
  return projectId;
}

/** The library id of a demo part, found by its part number. */
async function demoPartId(request: APIRequestContext, partNumber: string): Promise<string> {
  const found = await request.get(`/api/parts?q=${encodeURIComponent(partNumber)}`);
  expect(found.ok()).toBe(true);
  const rows: { id: string; partNumber: string }[] = (await found.json()).rows;
  const part = rows.find((r) => r.partNumber === partNumber);
  expect(part, `demo part ${partNumber}`).toBeDefined();
  return part!.id;
}

/** Signs a decision for a candidate through the API (the caller must be a lead); returns the decision's page. */
export async function signDecisionThroughApi(
  request: APIRequestContext,
  origin: string,
  projectId: string,
  partNumber: string,
  rationale: string,
): Promise<string> {
  const signed = await request.post(`/api/projects/${projectId}/decisions`, {
    headers: { origin },
    data: { partId: await demoPartId(request, partNumber), rationale },
  });
  expect(signed.status(), await signed.text()).toBe(201);
  return `/projects/${projectId}/decisions/${(await signed.json()).decision.id}`;
}

/** The comparison page: the matrix, its filters, the decision form and the overlay chart. */
export class ComparePage {
  readonly matrix: Locator;
  readonly recordDecision: Locator;
  readonly downloadCsv: Locator;
  readonly overlay: Locator;

  constructor(readonly page: Page) {
    this.matrix = page.getByRole("table", { name: "Comparison matrix" });
    this.recordDecision = page.getByRole("button", { name: "Record decision" });
    this.downloadCsv = page.getByRole("link", { name: "Download CSV" });
    this.overlay = page.getByTestId("overlay-chart");
  }

  async open(projectId: string): Promise<void> {
    await this.page.goto(`/projects/${projectId}/compare`);
    await expect(this.page.getByRole("heading", { level: 1, name: "Compare and decide" })).toBeVisible();
    await expect(this.matrix).toBeVisible();
  }

  row(partNumber: string): Locator {
    return this.matrix
      .getByRole("row")
      .filter({ has: this.page.getByRole("rowheader", { name: partNumber }) });
  }

  /** The cell of a candidate for a pulse: the button whose hover text names both. */
  cell(partNumber: string, pulseName: string): Locator {
    return this.row(partNumber).locator(`button[title^="${partNumber} × ${pulseName}:"]`);
  }

  /** Opens the decision form and fills it; `sign()` sends it. */
  async fillDecision(partNumber: string, rationale: string): Promise<Locator> {
    await this.recordDecision.click();
    const form = this.page.getByRole("form", { name: "Record decision" });
    await expect(form).toBeVisible();
    const select = form.getByLabel("Chosen candidate");
    const option = select.locator("option", { hasText: partNumber });
    await select.selectOption({ value: (await option.getAttribute("value")) ?? "" });
    await form.getByLabel("Rationale").fill(rationale);
    return form;
  }

  /** Signs; on an unverified draft the lead first says they sign knowingly. */
  async sign(form: Locator): Promise<void> {
    const knowingly = form.getByLabel("I sign on an unverified part knowingly");
    if (await knowingly.count()) {
      await expect(form.getByRole("button", { name: "Sign decision" })).toBeDisabled();
      await knowingly.check();
    }
    await form.getByRole("button", { name: "Sign decision" }).click();
    await expect(this.page).toHaveURL(/\/decisions\/[0-9a-f-]{36}$/);
  }
}
