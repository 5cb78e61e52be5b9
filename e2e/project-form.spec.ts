import { expect, test } from "@playwright/test";
import { signIn } from "./pages/auth-pages";

// The project form checks its values with a schema it loads at the first check, and previews a typed case path
// with a parser it loads once a path is typed (neither is in the page's first load): both must still work.

// The seeded demo engineer (README.md, "Demo sign-in").
const engineer = { name: "", email: "engineer@tidewater.example", password: "tidewater-engineer-demo" };

test("the new project form checks its values, previews a case path and creates the project", async ({
  page,
}) => {
  await signIn(page, engineer);
  await page.goto("/projects/new");
  await page.getByRole("button", { name: "Create project" }).click();
  await expect(page.getByText("Name the project")).toBeVisible();

  // Two Foster terms, R τ per line: R_th(c-a) is their sum, 0.5 + 1.5 = 2 K/W.
  await page.getByLabel("Case to ambient, Foster terms").fill("0.5 0.01\n1.5 2");
  const preview = page.getByTestId("case-path");
  await expect(preview.getByText(/= 2(\.0+)?\s?K\/W/)).toBeVisible();

  await page.getByLabel("Name").fill("Form check, hold-up stage");
  await page.getByRole("button", { name: "Create project" }).click();
  await expect(page).toHaveURL(/\/projects\/[0-9a-f-]{36}$/);
  await expect(page.getByRole("heading", { level: 1 })).toHaveText("Form check, hold-up stage");
});
