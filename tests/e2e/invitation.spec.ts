import { expect, test } from "@playwright/test";
import { E2E_PASSWORD, E2E_PEOPLE } from "./fixtures/people";
import { AppShell } from "./pages/app-shell";
import { SignInPage } from "./pages/sign-in-page";

test("an admin invites a colleague, who follows the link from the mail catcher, sets a password and signs in", async ({ page }) => {
  const invitee = { name: "Priya Raman", email: `priya-${Date.now()}@test.invalid`, password: "priya-secret-password" };
  const signIn = new SignInPage(page);
  await signIn.goto("/login?callbackUrl=%2Fadmin%2Fpeople");
  await signIn.signIn(E2E_PEOPLE.admin.email, E2E_PASSWORD);
  await expect(page.getByRole("heading", { name: "People" })).toBeVisible();

  const form = page.getByRole("form", { name: "Invite a person" });
  await form.getByLabel("Name").fill(invitee.name);
  await form.getByLabel("E-mail").fill(invitee.email);
  await form.getByLabel("reviewer").check();
  await form.getByLabel("author").check();
  await form.getByRole("button", { name: "Send invitation" }).click();
  await expect(form.getByRole("status")).toHaveText("Invitation sent.");
  await expect(page.getByText(invitee.email)).toBeVisible();

  await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Mail catcher" }).click();
  await page.getByRole("link", { name: new RegExp(`${invitee.email}.*You are invited to Bandgate`) }).click();
  const link = await page.getByTestId("mail-body").getByRole("link").getAttribute("href");
  expect(link).toMatch(/\/join\//);
  await new AppShell(page).signOut();

  await page.goto(link!);
  await expect(page.getByRole("heading", { name: `Welcome, ${invitee.name}` })).toBeVisible();
  await page.getByLabel("New password").fill("short");
  await page.getByLabel("Repeat the password").fill("short");
  await page.getByRole("button", { name: "Set password and join" }).click();
  await expect(page.getByText("Use at least 10 characters.")).toBeVisible();
  await page.getByLabel("New password").fill(invitee.password);
  await page.getByLabel("Repeat the password").fill(invitee.password);
  await page.getByRole("button", { name: "Set password and join" }).click();
  await expect(page.getByText(`Your account ${invitee.email} is ready.`)).toBeVisible();

  await page.getByRole("link", { name: "Sign in" }).click();
  await signIn.signInAndWait(invitee.email, invitee.password, invitee.name);
  await expect(page.getByTestId("signed-in-roles")).toHaveText("author · reviewer");

  await page.goto(link!);
  await expect(page.getByRole("heading", { name: "This invitation cannot be used" })).toBeVisible();
  await expect(page.getByText("already been used")).toBeVisible();
});
