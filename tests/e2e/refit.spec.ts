import { expect, test } from "@playwright/test";
import { E2E_PASSWORD, E2E_PEOPLE } from "./fixtures/people";
import { RefitPage } from "./pages/refit-page";
import { E2E_REFIT } from "./pages/refit-names";
import { SignInPage } from "./pages/sign-in-page";

test("an author starts a refit, watches it advance, cancels it, lets another finish and finds the new revision", async ({ page }) => {
  test.setTimeout(120_000);
  const signIn = new SignInPage(page);
  await signIn.goto();
  await signIn.signInAndWait(E2E_PEOPLE.author.email, E2E_PASSWORD, E2E_PEOPLE.author.name);
  const refit = new RefitPage(page);
  await refit.open(E2E_REFIT.proposal);

  // A long fit: every parameter free, eight extra seeded starts.
  await refit.freeAll();
  await refit.setField("Extra starts", "8");
  await expect(refit.previewSummary()).toContainText("free parameters");
  await refit.start();
  const long = refit.run(0);
  await expect(long).toHaveAttribute("data-status", "running", { timeout: 30_000 });
  await expect.poll(() => refit.progressOf(long), { timeout: 30_000 }).toBeGreaterThan(0);
  const first = await refit.progressOf(long);
  await expect.poll(() => refit.progressOf(long), { timeout: 30_000 }).toBeGreaterThan(first);
  await long.getByRole("button", { name: "Cancel" }).click();
  await expect(long).toHaveAttribute("data-status", "cancelled", { timeout: 15_000 });
  await expect(long.getByTestId("fit-status")).toHaveText("cancelled");

  // A short one: the three integrals that were moved, no extra starts.
  await refit.fixAll();
  await refit.setField("Extra starts", "0");
  for (const label of ["sp_sigma (X–X, shell 1)", "pp_pi (X–X, shell 1)", "ss_sigma (X–X, shell 1)"]) await refit.free(label);
  await expect(refit.previewSummary()).toContainText("for 3 free parameters");
  await refit.start();
  const short = refit.run(0);
  await expect(short).toHaveAttribute("data-status", "converged", { timeout: 60_000 });
  await expect(short.getByTestId("fit-result-revision")).toHaveText("Saved as revision 3.");

  await page.getByRole("link", { name: "← Proposal overview" }).click();
  const revisions = page.getByRole("region", { name: "Revisions" });
  await expect(revisions.getByText(/^Refit of 3 parameters to "Released-value bands": RMS/)).toBeVisible();
  await expect(revisions.getByText("r3")).toBeVisible();

  // Reviewers see how the numbers were obtained, and the metrics follow the window they pick.
  await page.getByRole("link", { name: /Open the review workspace/ }).click();
  // A first view computes the band view and metrics; on a busy machine that is slower than the default 10 s wait.
  await expect(page.getByTestId("fit-origin")).toContainText("Revision 3 is the result of a refit of revision 2", { timeout: 60_000 });
  await expect(page.getByRole("img", { name: /Bands at the start values \(dashed\) and fitted \(solid\)/ })).toBeVisible();
  const compared = page.locator("#metric-points td").nth(1);
  const before = await compared.innerText();
  await page.getByLabel("Energy window from (eV)").fill("-5");
  await page.getByLabel("Energy window to (eV)").fill("0");
  await expect(page.getByTestId("metrics-settings")).toContainText("window -5 to 0 eV");
  await expect(compared).not.toHaveText(before, { timeout: 20_000 });
});
