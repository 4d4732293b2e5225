import { expect, test } from "@playwright/test";
import { E2E_FAMILY, E2E_PASSWORD, E2E_PEOPLE } from "./fixtures/people";
import { SignInPage } from "./pages/sign-in-page";

test("an author starts a proposal from a release, sees the bands follow an edit, and saves a revision", async ({ page }) => {
  const signIn = new SignInPage(page);
  await signIn.goto("/login?callbackUrl=%2Fproposals%2Fnew");
  await signIn.signIn(E2E_PEOPLE.author.email, E2E_PASSWORD);
  await expect(page.getByRole("heading", { name: "New proposal" })).toBeVisible();

  await page.getByLabel("Model family").selectOption({ label: E2E_FAMILY.title });
  await expect(page.getByLabel("Start from")).toContainText("release 1.0.0 (latest)");
  await page.getByLabel("Title").fill("Raise the pz level");
  await page.getByLabel(/^Rationale/).fill("Move $\\varepsilon_{p}$ up by 0.5 eV.");
  await page.getByRole("button", { name: "Create draft" }).click();

  await expect(page.getByRole("heading", { name: "Raise the pz level" })).toBeVisible();
  await expect(page.getByTestId("proposal-stage")).toContainText("Draft");
  await expect(page.locator(".katex").first()).toBeVisible();

  const preview = page.getByRole("region", { name: "Band preview" });
  const plot = preview.getByRole("img", { name: /^Bands of/ });
  await expect(plot).toBeVisible();
  const gap = preview.locator("dt", { hasText: /^gap$/ }).locator("xpath=following-sibling::dd[1]");
  await expect(gap).toContainText("1.500");
  const before = await plot.innerHTML();

  // At X the s+pz chain's bands are inverted: s at εs − 2·ss_sigma = −2.2 eV above p at εp − 2·pp_sigma (analytic
  // two-band chain, no s–p mixing at the zone boundary). Raising εp from 1.5 to 2.0 eV closes the gap from 1.5 to 1.0 eV.
  await page.getByLabel("on-site energy of A pz (eV)").fill("2.0");
  await expect(gap).toContainText("1.000");
  await expect.poll(() => plot.innerHTML()).not.toBe(before);

  await page.getByLabel("What changed in this revision").fill("pz level up by 0.5 eV");
  await page.getByRole("button", { name: "Save revision" }).click();
  await expect(page.getByRole("status").filter({ hasText: "Saved as a new revision." })).toBeVisible();
  await page.reload();
  await expect(page.getByText("pz level up by 0.5 eV")).toBeVisible();
  await expect(page.getByText(/base 1\.0\.0 → revision 2/)).toBeVisible();
});
