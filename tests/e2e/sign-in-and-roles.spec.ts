import { expect, test } from "@playwright/test";
import { E2E_PASSWORD, E2E_PEOPLE } from "./fixtures/people";
import { AppShell } from "./pages/app-shell";
import { SignInPage } from "./pages/sign-in-page";

const expectedNav: Record<keyof typeof E2E_PEOPLE, string[]> = {
  author: ["Overview", "Review board", "Model families", "Registry", "API tokens", "Account"],
  reviewer: ["Overview", "Review board", "Model families", "Registry", "API tokens", "Account"],
  curator: ["Overview", "Review board", "Model families", "Registry", "Audit trail", "API tokens", "Account"],
  consumer: ["Overview", "Model families", "Registry", "API tokens", "Account"],
  admin: ["Overview", "Review board", "Model families", "Registry", "People", "Mail catcher", "Audit trail", "API tokens", "Account"],
};

for (const [role, person] of Object.entries(E2E_PEOPLE) as [keyof typeof E2E_PEOPLE, { email: string; name: string }][]) {
  test(`a ${role} signs in and sees the navigation of that role`, async ({ page }) => {
    const signIn = new SignInPage(page);
    await signIn.goto();
    await signIn.signInAndWait(person.email, E2E_PASSWORD, person.name);
    await expect(page.getByTestId("signed-in-roles")).toHaveText(role);
    expect(await new AppShell(page).navLabels()).toEqual(expectedNav[role]);
    await expect(page.getByRole("note", { name: "Safety note" })).toBeVisible();
    await new AppShell(page).signOut();
  });
}

test("a wrong password gets a clear message and no session", async ({ page }) => {
  const signIn = new SignInPage(page);
  await signIn.goto();
  await signIn.signIn(E2E_PEOPLE.author.email, "not-the-password");
  await expect(page.getByRole("alert").filter({ hasText: "do not match an active account" })).toBeVisible();
  await page.goto("/");
  await expect(page).toHaveURL(/\/login\?callbackUrl=%2F/);
});

test("a reviewer is refused the admin page and the admin action called directly", async ({ page }) => {
  const signIn = new SignInPage(page);
  await signIn.goto("/login?callbackUrl=%2Fadmin%2Fpeople");
  await signIn.signIn(E2E_PEOPLE.reviewer.email, E2E_PASSWORD);
  await expect(page.getByRole("heading", { name: "Not for your role" })).toBeVisible();

  // Sent as the page would send it (same origin, JSON), so only the role decides.
  const response = await page.request.post("/api/admin/invitations", {
    headers: { origin: new URL(page.url()).origin },
    data: { email: "smuggled@test.invalid", name: "Smuggled", roles: ["admin"] },
  });
  expect(response.status()).toBe(403);
  expect(await response.json()).toMatchObject({ error: { code: "forbidden:role" } });
});
