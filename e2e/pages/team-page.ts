import { expect, type Locator, type Page } from "@playwright/test";

export class TeamPage {
  readonly members: Locator;
  readonly invitations: Locator;

  constructor(readonly page: Page) {
    this.members = page.getByRole("table", { name: "Members" });
    this.invitations = page.getByRole("table", { name: "Pending invitations" });
  }

  async invite(email: string, role: string): Promise<void> {
    const form = this.page.getByRole("region", { name: "Invite someone" });
    await form.getByLabel("E-mail").fill(email);
    await form.getByLabel("Role").selectOption({ label: role });
    await form.getByRole("button", { name: "Send invitation" }).click();
    await expect(form.getByRole("status")).toHaveText(`Invitation sent to ${email}.`);
  }

  memberRow(name: string): Locator {
    return this.members.getByRole("row").filter({ hasText: name });
  }

  invitationRow(email: string): Locator {
    return this.invitations.getByRole("row").filter({ hasText: email });
  }
}
