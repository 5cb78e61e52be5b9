import { expect, type Locator, type Page } from "@playwright/test";

/** The projects list, the new-project form and a project's page with its tabs. */
export class ProjectsPage {
  constructor(readonly page: Page) {}

  async create(name: string, caseTemp: string): Promise<string> {
    await this.page.goto("/projects");
    await this.page.getByRole("link", { name: "New project" }).first().click();
    await expect(this.page.getByRole("heading", { level: 1, name: "New project" })).toBeVisible();
    await this.page.getByLabel("Name").fill(name);
    await this.page.getByLabel(/Case temperature/).fill(caseTemp);
    await this.page.getByRole("button", { name: "Create project" }).click();
    await expect(this.page.getByRole("heading", { level: 1, name })).toBeVisible();
    return this.page.url().replace(/\?.*$/, "");
  }

  tab(name: "Results" | "Fault cases" | "Bench" | "Captures"): Locator {
    return this.page.getByRole("tab", { name, exact: true });
  }

  async openTab(name: "Results" | "Fault cases" | "Bench" | "Captures"): Promise<void> {
    await this.tab(name).click();
    await expect(this.tab(name)).toHaveAttribute("aria-selected", "true");
  }

  get candidates(): Locator {
    return this.page.getByRole("table", { name: "Candidates" });
  }

  async addCandidate(partNumber: string): Promise<void> {
    await this.page.getByLabel("Add a candidate").fill(partNumber);
    await this.page.getByRole("button", { name: `Add ${partNumber}` }).click();
    await expect(this.candidates.getByRole("row").filter({ hasText: partNumber })).toBeVisible();
  }

  get results(): Locator {
    return this.page.getByRole("table", { name: /^Results/ });
  }

  /** The verdict cell of a pulse's row for one candidate, by its data attributes. */
  verdictCell(pulseName: string, partNumber: string): Locator {
    return this.results
      .getByRole("row")
      .filter({ has: this.page.getByRole("rowheader", { name: new RegExp(pulseName) }) })
      .locator(`td[data-part="${partNumber}"]`);
  }

  builder(title: string): Locator {
    return this.page.getByRole("form", { name: `${title} builder` });
  }

  chart(partNumber: string): Locator {
    return this.page.getByRole("region", { name: new RegExp(`^${partNumber}`) });
  }
}
