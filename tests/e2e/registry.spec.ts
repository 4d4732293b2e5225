import { execFileSync } from "node:child_process";
import { mkdtempSync, readFileSync } from "node:fs";
import { createHash } from "node:crypto";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { expect, test } from "@playwright/test";
import { E2E_PASSWORD, E2E_PEOPLE } from "./fixtures/people";
import { AppShell } from "./pages/app-shell";
import { BoardPage } from "./pages/board-page";
import { E2E_REGISTRY } from "./pages/registry-names";
import { ReleaseFormPage, ReleasePage, TokensPage } from "./pages/registry-pages";
import { SignInPage } from "./pages/sign-in-page";

test("a curator releases an accepted proposal from the board; a consumer pulls it with a token and the documented curl command", async ({ page }) => {
  const signIn = new SignInPage(page);
  await signIn.goto();
  await signIn.signInAndWait(E2E_PEOPLE.curator.email, E2E_PASSWORD, E2E_PEOPLE.curator.name);

  const board = new BoardPage(page);
  await page.goto(`/board?family=${E2E_REGISTRY.slug}`);
  await board.ready();
  await board.lane("accepted").getByRole("link", { name: E2E_REGISTRY.proposal }).click();
  await expect(page.getByRole("heading", { name: E2E_REGISTRY.proposal })).toBeVisible();
  await page.getByRole("link", { name: "Release this proposal…" }).click();

  const form = new ReleaseFormPage(page);
  // sp_sigma changed, nothing else: a minor change after 1.0.0.
  await expect(page.getByTestId("change-level")).toContainText("minor");
  await expect(form.version()).toHaveValue("1.1.0");
  await expect(page.getByLabel("Changelog")).toHaveValue(/shell\/A-A\/1\/sp_sigma`\): 1\.8 → 2 eV/);
  await form.release();

  const release = new ReleasePage(page);
  await expect(release.version()).toHaveText("1.1.0");
  await expect(release.checksum()).toHaveText(/^[0-9a-f]{64}$/);
  await expect(release.bands()).toBeVisible();
  await expect(release.bands().locator("path").first()).toBeAttached();
  await expect(page.getByRole("note", { name: "Safety note" })).toContainText("Validity range");
  const checksum = (await release.checksum().innerText()).trim();
  const releaseUrl = page.url();
  await new AppShell(page).signOut();

  await signIn.goto();
  await signIn.signInAndWait(E2E_PEOPLE.consumer.email, E2E_PASSWORD, E2E_PEOPLE.consumer.name);
  const tokens = new TokensPage(page);
  await tokens.goto();
  const token = await tokens.create("e2e pull");
  await page.goto(releaseUrl);
  const command = await release.pullCommand();
  expect(command).toContain(`/api/v1/families/${E2E_REGISTRY.slug}/releases/1.1.0/document`);

  // Run the command exactly as shown, in a scratch directory, with the token in BANDGATE_TOKEN.
  const dir = mkdtempSync(join(tmpdir(), "bandgate-pull-"));
  const printed = execFileSync("bash", ["-euo", "pipefail", "-c", command], { cwd: dir, env: { ...process.env, BANDGATE_TOKEN: token }, encoding: "utf8" });
  expect(printed.split(/\s+/)[0]).toBe(checksum);
  const file = join(dir, `${E2E_REGISTRY.slug}-1.1.0.json`);
  expect(createHash("sha256").update(readFileSync(file)).digest("hex")).toBe(checksum);
  expect(JSON.parse(readFileSync(file, "utf8")).name).toBe(E2E_REGISTRY.slug);

  await tokens.goto();
  await expect(page.getByTestId("token-row").filter({ hasText: "e2e pull" })).not.toContainText("never");
});
