import { expect, test } from "@playwright/test";
import { runStamp } from "./fixtures/stamp";
import { signIn, signUp } from "./pages/auth-pages";
import { linkIn, waitForMail } from "./pages/mail-inbox";

// The password forms end to end: a forgotten password reset by its e-mailed link (once only), a wrong sign-in,
// and the account page's password and name forms, each with its browser check and its server's answer.

const stamp = runStamp();
const person = {
  name: "Ilse Varga",
  email: `ilse.${stamp}@pulsefence.test`,
  password: "long-enough-first-pass",
  workspaceName: `Reset bench ${stamp}`,
};
const resetPassword = "long-enough-second-pass";
const changedPassword = "long-enough-third-pass";

test("a forgotten password is reset by its link once; the account page changes the password and the name", async ({
  page,
}) => {
  test.setTimeout(120_000);
  await signUp(page, person);
  await page.context().clearCookies();

  const link = await test.step("the forgot-password form checks the address and sends a link", async () => {
    await page.goto("/forgot-password");
    await page.getByRole("button", { name: "Send reset link" }).click();
    await expect(page.getByText("Enter a valid e-mail address")).toBeVisible();
    await page.getByLabel("E-mail").fill(person.email);
    await page.getByRole("button", { name: "Send reset link" }).click();
    await expect(page.locator("main").getByRole("status")).toContainText(
      `If an account exists for ${person.email}`,
    );
    return linkIn(await waitForMail(person.email, /Reset your Pulsefence password/), "/reset-password/");
  });

  await test.step("the reset form wants 10 characters, then saves and goes to sign-in", async () => {
    await page.goto(link);
    await expect(page.getByText("At least 10 characters.")).toBeVisible();
    await page.getByLabel("New password").fill("short");
    await page.getByRole("button", { name: "Save password" }).click();
    await expect(page.getByText("Use at least 10 characters")).toBeVisible();
    await page.getByLabel("New password").fill(resetPassword);
    await page.getByRole("button", { name: "Save password" }).click();
    await expect(page).toHaveURL(/\/sign-in\?reset=done$/);
  });

  await test.step("the used link says so, offers a new one and disables the button", async () => {
    await page.goto(link);
    await page.getByLabel("New password").fill("long-enough-unused-pass");
    await page.getByRole("button", { name: "Save password" }).click();
    // The form's own alert (Next.js keeps an empty route announcer with the same role).
    const alert = page.locator("form").getByRole("alert");
    await expect(alert).toContainText("This reset link is not valid any more.");
    await expect(alert.getByRole("link", { name: "Ask for a new link" })).toHaveAttribute(
      "href",
      "/forgot-password",
    );
    await expect(page.getByRole("button", { name: "Save password" })).toBeDisabled();
  });

  await test.step("sign-in refuses the old password and takes the new one", async () => {
    await page.goto("/sign-in");
    await page.getByLabel("E-mail").fill(person.email);
    await page.getByLabel("Password", { exact: true }).fill(person.password);
    await page.getByRole("button", { name: "Sign in" }).click();
    await expect(page.locator("form").getByRole("alert")).toBeVisible();
    await expect(page).toHaveURL(/\/sign-in/);
    await signIn(page, { ...person, password: resetPassword });
  });

  await test.step("the account page's password form wants the right current password", async () => {
    await page.goto("/account");
    await page.getByLabel("Current password").fill("not-the-current-pass");
    await page.getByLabel("New password").fill(changedPassword);
    await page.getByRole("button", { name: "Change password" }).click();
    await expect(page.getByText("The current password is wrong")).toBeVisible();
    await page.getByLabel("Current password").fill(resetPassword);
    await page.getByRole("button", { name: "Change password" }).click();
    await expect(page.getByRole("status").filter({ hasText: "Password changed." })).toBeVisible();
    await expect(page.getByLabel("Current password")).toHaveValue("");
  });

  await test.step("the name form saves only a changed name", async () => {
    const save = page.getByRole("button", { name: "Save name" });
    await expect(save).toBeDisabled();
    await page.getByLabel("Name", { exact: true }).fill("Ilse M. Varga");
    await save.click();
    await expect(page.getByRole("status").filter({ hasText: "Name saved." })).toBeVisible();
    await expect(save).toBeDisabled();
  });

  await test.step("the changed password signs in", async () => {
    await page.context().clearCookies();
    await signIn(page, { ...person, password: changedPassword });
  });
});
