import { expect, type Page } from "@playwright/test";

export interface Person {
  name: string;
  email: string;
  password: string;
}

export async function signUp(page: Page, person: Person & { workspaceName: string }): Promise<void> {
  await page.goto("/sign-up");
  await page.getByLabel("Your name").fill(person.name);
  await page.getByLabel("E-mail").fill(person.email);
  await page.getByLabel("Password").fill(person.password);
  await page.getByLabel("Workspace name").fill(person.workspaceName);
  await page.getByRole("button", { name: "Create workspace" }).click();
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
