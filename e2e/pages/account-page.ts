import { expect, type Locator, type Page } from "@playwright/test";

export class AccountPage {
  readonly tokens: Locator;

  constructor(readonly page: Page) {
    this.tokens = page.getByRole("table", { name: "API tokens" });
  }

  /** Creates a token and returns its secret, read from the box that shows it once. */
  async createToken(name: string): Promise<string> {
    await this.page.getByLabel("New token").fill(name);
    await this.page.getByRole("button", { name: "Create token" }).click();
    const secret = this.page.getByTestId("token-secret");
    await expect(secret).toHaveValue(/^pf_/);
    await expect(this.tokens.getByRole("row").filter({ hasText: name })).toContainText("Active");
    return secret.inputValue();
  }
}
