import { expect, type Locator, type Page } from "@playwright/test";

/** The left rail of every workspace page. */
export class AppShell {
  readonly nav: Locator;

  constructor(readonly page: Page) {
    this.nav = page.getByRole("navigation", { name: "Main" });
  }

  item(name: string): Locator {
    return this.nav.getByRole("link", { name, exact: true });
  }

  async open(name: string): Promise<void> {
    await this.item(name).click();
    await expect(this.page.getByRole("heading", { level: 1, name })).toBeVisible();
  }

  async itemNames(): Promise<string[]> {
    return this.nav.getByRole("link").allInnerTexts();
  }

  async signOut(): Promise<void> {
    await this.page.getByRole("complementary").getByRole("button", { name: "Sign out" }).click();
    await expect(this.page).toHaveURL(/\/sign-in$/);
  }
}
