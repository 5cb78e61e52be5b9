import { expect, type Page } from "@playwright/test";
import { linkIn, waitForMail } from "./mail-inbox";

export interface Person {
  name: string;
  email: string;
  password: string;
}

/** Fills in the sign-up form; the page then says to check the e-mail (the same for any address). */
export async function requestSignUp(page: Page, person: Person & { workspaceName: string }): Promise<void> {
  await page.goto("/sign-up");
  await page.getByLabel("Your name").fill(person.name);
  await page.getByLabel("E-mail").fill(person.email);
  await page.getByLabel("Password").fill(person.password);
  await page.getByLabel("Workspace name").fill(person.workspaceName);
  await page.getByRole("button", { name: "Create workspace" }).click();
  await expect(page.getByRole("status").filter({ hasText: "Check your e-mail" })).toBeVisible();
}

/** Signs up a new address: the form, then the link e-mailed to it (read from the mail fake), then the overview. */
export async function signUp(page: Page, person: Person & { workspaceName: string }): Promise<void> {
  await requestSignUp(page, person);
  const link = linkIn(await waitForMail(person.email, /Finish creating/), "/sign-up/confirm/");
  await page.goto(link);
  await page.getByRole("button", { name: "Create my workspace" }).click();
  await expect(page).toHaveURL(/\/app$/);
}

export async function signIn(page: Page, person: Person): Promise<void> {
  await page.goto("/sign-in");
  await page.getByLabel("E-mail").fill(person.email);
  await page.getByLabel("Password", { exact: true }).fill(person.password);
  await page.getByRole("button", { name: "Sign in" }).click();
  await expect(page).toHaveURL(/\/app$/);
}

/** Accepts an invitation as a newcomer: name and a new password. */
export async function acceptInvitation(page: Page, link: string, person: Person): Promise<void> {
  await page.goto(link);
  await page.getByLabel("Your name").fill(person.name);
  await page.getByLabel("Choose a password").fill(person.password);
  await page.getByRole("button", { name: "Accept and join" }).click();
  await expect(page).toHaveURL(/\/app$/);
}
