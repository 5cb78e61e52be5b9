import { expect, test } from "@playwright/test";
import { runStamp } from "./fixtures/stamp";
import { AccountPage } from "./pages/account-page";
import { AppShell } from "./pages/app-shell";
import { acceptInvitation, signIn, signUp } from "./pages/auth-pages";
import { linkIn, waitForMail } from "./pages/mail-inbox";
import { TeamPage } from "./pages/team-page";
import { saveScreenshot } from "./screenshots";

/** A page must never carry a password hash (argon2id) or a stored token hash (64 hex digits). */
function expectNoSecrets(html: string): void {
  expect(html).not.toMatch(/\$argon2id\$/);
  expect(html).not.toMatch(/\b[0-9a-f]{64}\b/);
}

const stamp = runStamp();
const admin = {
  name: "Ines Varga",
  email: `ines.${stamp}@pulsefence.test`,
  password: "long-enough-admin-pass",
  workspaceName: `Harbour Drive Lab ${stamp}`,
};
const technician = {
  name: "Kofi Lindqvist",
  email: `kofi.${stamp}@pulsefence.test`,
  password: "long-enough-bench-pass",
};
const stray = `stray.${stamp}@pulsefence.test`;

test("an admin invites a technician by e-mail, who joins with the technician's reduced menu", async ({
  page,
}) => {
  // Signing up now goes through the e-mailed link, and the invitation through the mail fake too.
  test.setTimeout(120_000);
  const shell = new AppShell(page);

  await test.step("the admin signs up and lands on the overview", async () => {
    await signUp(page, admin);
    await expect(page.getByRole("heading", { level: 1, name: "Overview" })).toBeVisible();
    await expect(page.getByText(admin.workspaceName).filter({ visible: true }).first()).toBeVisible();
    expect(await shell.itemNames()).toEqual(["Overview", "Library", "Projects", "Team", "Account"]);
  });

  await test.step("the admin invites a technician from the Team page", async () => {
    await shell.open("Team");
    const team = new TeamPage(page);
    await expect(team.members.getByRole("row").filter({ hasText: admin.email })).toContainText("Ines Varga");
    await team.invite(technician.email, "Technician");
    await expect(team.invitationRow(technician.email)).toContainText("Technician");
    await saveScreenshot(page, "team");
    expectNoSecrets(await page.content());
  });

  await test.step("the admin resends an invitation, then revokes it", async () => {
    const team = new TeamPage(page);
    await team.invite(stray, "Engineer");
    const outbox = page
      .getByRole("table", { name: "E-mail outbox" })
      .getByRole("row")
      .filter({ hasText: stray });
    await expect(outbox).toHaveCount(1);
    await page.getByRole("button", { name: `Resend the invitation to ${stray}` }).click();
    await expect(outbox).toHaveCount(2);
    await expect(team.invitations.getByRole("alert")).toHaveCount(0);
    await page.getByRole("button", { name: `Revoke the invitation to ${stray}` }).click();
    await expect(team.invitationRow(stray)).toHaveCount(0);
    await expect(team.invitationRow(technician.email)).toContainText("Technician");
  });

  await test.step("the admin creates an API token on the Account page", async () => {
    await shell.open("Account");
    const secret = await new AccountPage(page).createToken("Bench 2 pulse rig");
    expect(secret.length).toBeGreaterThan(40);
    await saveScreenshot(page, "account");
    // The page shows the new secret once, but never a stored hash or the session id behind the cookie.
    const sessionId = (await page.context().cookies()).find((c) => c.name === "pulsefence_session")?.value;
    expect(sessionId).toBeTruthy();
    const html = await page.content();
    expectNoSecrets(html);
    expect(html).not.toContain(sessionId!);
  });

  await test.step("the admin revokes the token after a confirm step", async () => {
    const account = new AccountPage(page);
    const row = account.tokens.getByRole("row").filter({ hasText: "Bench 2 pulse rig" });
    await row.getByRole("button", { name: "Revoke the token Bench 2 pulse rig" }).click();
    await row.getByRole("button", { name: "Keep" }).click();
    await expect(row).toContainText("Active");
    await row.getByRole("button", { name: "Revoke the token Bench 2 pulse rig" }).click();
    await row.getByRole("button", { name: "Confirm revoking Bench 2 pulse rig" }).click();
    await expect(row).toContainText("Revoked");
    await expect(row.getByRole("button")).toHaveCount(0);
    await shell.signOut();
  });

  const link = await test.step("the invitation e-mail arrives with its link", async () => {
    const mail = await waitForMail(technician.email, /invited you to/);
    expect(mail.text).toContain(admin.workspaceName);
    return linkIn(mail, "/invite/");
  });

  await test.step("the technician accepts and sees the reduced menu", async () => {
    await page.goto(link);
    await expect(page.getByRole("heading", { level: 1 })).toHaveText(`Join ${admin.workspaceName}`);
    await expect(page.getByText("Technician", { exact: true })).toBeVisible();
    await acceptInvitation(page, link, technician);
    await expect(page.getByRole("heading", { level: 1, name: "Overview" })).toBeVisible();
    expect(await shell.itemNames()).toEqual(["Overview", "Library", "Projects", "Account"]);
    await expect(shell.item("Team")).toHaveCount(0);
  });

  await test.step("the technician signs out and in again, still without Team", async () => {
    await shell.signOut();
    await signIn(page, technician);
    expect(await shell.itemNames()).toEqual(["Overview", "Library", "Projects", "Account"]);
    await page.goto("/team");
    // A page the role may not open says which role may and whom to ask (not a false "not found").
    await expect(page.getByRole("heading", { level: 1, name: "Not for your role" })).toBeVisible();
    await expect(page.getByTestId("not-allowed")).toContainText("It opens for the roles: admin, lead.");
    await expect(page.getByTestId("not-allowed")).toContainText(admin.email);
  });

  await test.step("the used link does not work a second time", async () => {
    await page.goto(link);
    await expect(page.getByRole("heading", { level: 1 })).toHaveText("This invitation link cannot be used");
  });

  await test.step("the admin changes the technician's role, undoes it, and removes them after a confirm step", async () => {
    await page.goto("/app"); // the technician is still signed in
    await shell.signOut();
    await signIn(page, admin);
    await shell.open("Team");
    const team = new TeamPage(page);
    const role = page.getByLabel(`Role of ${technician.name}`);
    await expect(role).toHaveValue("technician");
    await role.selectOption({ label: "Engineer" });
    await page.getByRole("button", { name: "Change role" }).click();
    await expect(page.getByRole("status").filter({ hasText: "Saved:" })).toHaveText(
      `Saved: ${technician.name} is now engineer.`,
    );
    await expect(role).toHaveValue("engineer");
    await page.getByRole("button", { name: "Undo" }).click();
    await expect(role).toHaveValue("technician");
    await expect(page.getByRole("status").filter({ hasText: "Saved:" })).toHaveCount(0);

    const row = team.memberRow(technician.email);
    await row.getByRole("button", { name: `Remove ${technician.name} from the workspace` }).click();
    await expect(row).toContainText("Remove?");
    await row.getByRole("button", { name: "Keep" }).click();
    await expect(row).not.toContainText("Remove?");
    await row.getByRole("button", { name: `Remove ${technician.name} from the workspace` }).click();
    await row.getByRole("button", { name: `Confirm removing ${technician.name}` }).click();
    await expect(team.memberRow(technician.email)).toHaveCount(0);
    await expect(team.memberRow(admin.email)).toContainText(admin.name);
    // The admin's own row has no remove action.
    await expect(team.members.getByRole("button", { name: /^Remove / })).toHaveCount(0);
  });
});
