import { expect, test } from "@playwright/test";
import { runStamp } from "./fixtures/stamp";
import { requestSignUp, signUp } from "./pages/auth-pages";
import { waitForMail } from "./pages/mail-inbox";
import { saveScreenshot } from "./screenshots";

// Each person chooses which notices they get; sign-up never tells whether an address already has an account.

const stamp = runStamp();
const person = {
  name: "Tamsin Ferreira",
  email: `tamsin.${stamp}@pulsefence.test`,
  password: "long-enough-notice-pass",
  workspaceName: `Notice Bench ${stamp}`,
};

test("a user turns decision-drift notices off on the account page, and the choice is kept", async ({
  page,
}) => {
  await signUp(page, person);
  await page.goto("/account");
  const notices = page.getByRole("region", { name: "Notices" });
  const drift = notices.getByRole("checkbox", { name: "Standing decisions that drift" });
  const failing = notices.getByRole("checkbox", { name: "Failing evidence on projects I own" });
  await expect(drift).toBeChecked();
  await expect(failing).toBeChecked();
  const save = notices.getByRole("button", { name: "Save notices" });
  await expect(save).toBeDisabled();

  await drift.uncheck();
  await save.click();
  await expect(notices.getByRole("status")).toHaveText("Notice choices saved.");
  await saveScreenshot(page, "account-notices");

  await page.reload();
  await expect(
    page
      .getByRole("region", { name: "Notices" })
      .getByRole("checkbox", { name: "Standing decisions that drift" }),
  ).not.toBeChecked();
  await expect(
    page
      .getByRole("region", { name: "Notices" })
      .getByRole("checkbox", { name: "Failing evidence on projects I own" }),
  ).toBeChecked();
});

test("signing up with an address that has an account looks the same; its owner is e-mailed", async ({
  page,
}) => {
  // The demo workspace's admin (seeded) already has an account.
  const known = "admin@tidewater.example";
  await requestSignUp(page, { ...person, email: known, workspaceName: "Someone else's lab" });
  await expect(page.getByRole("status").filter({ hasText: "Check your e-mail" })).toContainText(known);
  await saveScreenshot(page, "sign-up-check-email");
  const mail = await waitForMail(known, /tried to sign up/);
  expect(mail.text).toContain("/reset-password/");
  expect(mail.text).not.toContain("/sign-up/confirm/");
});
