import path from "node:path";
import { fileURLToPath } from "node:url";
import type { Page } from "@playwright/test";

/** Screenshots for people to look at land in e2e/screenshots/ (git-ignored). */
export const screenshotDir = path.join(path.dirname(fileURLToPath(import.meta.url)), "screenshots");

export function saveScreenshot(page: Page, name: string): Promise<Buffer> {
  return page.screenshot({ path: path.join(screenshotDir, `${name}.png`), fullPage: true });
}
