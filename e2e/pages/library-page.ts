import { readFileSync } from "node:fs";
import path from "node:path";
import { expect, type Locator, type Page } from "@playwright/test";

export const fixture = (name: string) => path.join(path.dirname(import.meta.dirname), "fixtures", name);

/** Text as the chart writes it, with its thin spaces made plain. */
export const plain = (text: string) => text.replace(/[\u2009\u202f\u00a0]/g, " ").trim();

export class LibraryList {
  readonly table: Locator;
  readonly newPart: Locator;

  constructor(readonly page: Page) {
    this.table = page.getByRole("table", { name: "Parts" });
    this.newPart = page.getByRole("link", { name: "New part" });
  }

  row(partNumber: string): Locator {
    return this.table.getByRole("row").filter({ hasText: partNumber });
  }
}

export interface NewPart {
  partNumber: string;
  maker: string;
  technology: string;
  package: string;
  vdss: string;
  id: string;
  idm: string;
  rdsOn: string;
  tjMax: string;
  rth: string;
}

export async function createPart(page: Page, part: NewPart): Promise<void> {
  await page.getByLabel("Part number").fill(part.partNumber);
  await page.getByLabel("Maker").fill(part.maker);
  await page.getByLabel("Technology").selectOption({ label: part.technology });
  await page.getByLabel("Package").fill(part.package);
  await page.getByLabel("VDSS").fill(part.vdss);
  await page.getByLabel("ID", { exact: true }).fill(part.id);
  await page.getByLabel("IDM").fill(part.idm);
  await page.getByLabel("RDS(on)").fill(part.rdsOn);
  await page.getByLabel("Tj,max").fill(part.tjMax);
  await page.getByLabel("Rth(j-c)").fill(part.rth);
  await page.getByRole("button", { name: "Create part" }).click();
  await expect(page).toHaveURL(/\/library\/[0-9a-f-]{36}$/);
  await expect(page.getByRole("heading", { level: 1 })).toContainText(part.partNumber);
}

export class PartPage {
  readonly chart: Locator;
  readonly dropzone: Locator;
  readonly rejected: Locator;

  constructor(readonly page: Page) {
    this.chart = page.getByTestId("soa-chart");
    this.dropzone = page.getByTestId("curve-dropzone");
    this.rejected = page.getByTestId("upload-rejected");
  }

  /** Drags a file onto the upload zone: a drop event carrying it in a DataTransfer, as a browser sends it. */
  async dropCsv(name: string): Promise<void> {
    const text = readFileSync(fixture(name), "utf8");
    const dataTransfer = await this.page.evaluateHandle(
      ({ text, name }) => {
        const transfer = new DataTransfer();
        transfer.items.add(new File([text], name, { type: "text/csv" }));
        return transfer;
      },
      { text, name },
    );
    await this.dropzone.dispatchEvent("dragenter", { dataTransfer });
    await this.dropzone.dispatchEvent("dragover", { dataTransfer });
    await this.dropzone.dispatchEvent("drop", { dataTransfer });
  }

  /** Picks a file with the upload zone's file input. */
  async chooseCsv(name: string): Promise<void> {
    await this.dropzone.locator("input[type=file]").setInputFiles(fixture(name));
  }

  async curveLabels(kind = "curve"): Promise<string[]> {
    const texts = await this.chart.locator(`svg text[data-curve-label="${kind}"]`).allTextContents();
    return texts.map(plain);
  }

  series(kind: "curve" | "derated" | "interpolated"): Locator {
    return this.chart.locator(`svg path[data-series="${kind}"]`);
  }

  async setCaseTemperature(celsius: number): Promise<void> {
    await this.page.getByRole("slider", { name: "Case temperature slider" }).fill(String(celsius));
  }

  async setPulseWidth(text: string): Promise<void> {
    await this.page.getByLabel("Pulse width").fill(text);
  }
}
