import { expect, test, type Page } from "@playwright/test";
import { E2E_FAMILY, E2E_PASSWORD, E2E_PEOPLE } from "./fixtures/people";
import { BoardPage } from "./pages/board-page";
import { SignInPage } from "./pages/sign-in-page";

/** Every refusal the browser reports under the page's content security policy, from the console and the DOM event. */
async function watchPolicy(page: Page): Promise<string[]> {
  const seen: string[] = [];
  await page.addInitScript(() => {
    document.addEventListener("securitypolicyviolation", (e) => {
      console.error(`Content Security Policy violation: ${e.violatedDirective} blocked ${e.blockedURI || "inline"} (${e.sourceFile}:${e.lineNumber})`);
    });
  });
  page.on("console", (m) => {
    if (/Content Security Policy/i.test(m.text())) seen.push(m.text());
  });
  return seen;
}

test("pages run under the content security policy without a single refusal: sign-in, math, the editor's worker, plots, drag and drop", async ({ page }) => {
  test.setTimeout(180_000);
  const violations = await watchPolicy(page);
  const response = await page.goto("/login?callbackUrl=%2Fproposals%2Fnew");
  expect(response?.headers()["content-security-policy"]).toContain("'strict-dynamic'");
  await new SignInPage(page).signIn(E2E_PEOPLE.author.email, E2E_PASSWORD);
  await expect(page.getByRole("heading", { name: "New proposal" })).toBeVisible();

  // A draft: KaTeX in the rationale, the band preview computed in the model editor's Web Worker.
  await page.getByLabel("Model family").selectOption({ label: E2E_FAMILY.title });
  await page.getByLabel("Title").fill("Policy check draft");
  await page.getByLabel(/^Rationale/).fill("Lower $\\varepsilon_{p}$ by $\\frac{1}{2}$ eV.");
  await page.getByRole("button", { name: "Create draft" }).click();
  await expect(page.getByRole("heading", { name: "Policy check draft" })).toBeVisible();
  await expect(page.locator(".katex").first()).toBeVisible();
  const preview = page.getByRole("region", { name: "Band preview" });
  const gap = preview.locator("dt", { hasText: /^gap$/ }).locator("xpath=following-sibling::dd[1]");
  await expect(gap).toContainText("1.500");
  await page.getByLabel("on-site energy of A pz (eV)").fill("2.0");
  await expect(gap).toContainText("1.000");

  // The review workspace: the band comparison plot, a remark with display math, the PNG export (an image of blob:).
  await page.getByRole("link", { name: /Open the review workspace/ }).click();
  await expect(page.getByRole("img", { name: /Band structure along/ })).toBeVisible();
  const form = page.getByRole("form", { name: "Write a remark" });
  await form.getByRole("textbox", { name: "Remark" }).fill("Check the zone edge:\n\n$$\n\\Delta E = 2\\,t\\cos(ka)\n$$\n");
  await form.getByRole("button", { name: "Post remark" }).click();
  await expect(page.getByRole("article").filter({ hasText: "Check the zone edge" }).locator(".katex-display")).toBeVisible();
  const download = page.waitForEvent("download");
  await page.getByRole("group", { name: "Export the current view" }).getByRole("button", { name: "PNG" }).click();
  expect((await download).suggestedFilename()).toMatch(/\.png$/);

  // The board: pick a card up with the keyboard and put it back, then drag one with the mouse onto a lane it may not enter.
  const board = new BoardPage(page);
  await board.goto();
  await board.handle("Policy check draft").focus();
  await page.keyboard.press("Space");
  await expect(board.lane("draft")).toHaveAttribute("data-lane-state", "origin");
  await page.keyboard.press("Escape");
  await expect(board.lane("draft")).toHaveAttribute("data-lane-state", "idle");
  await board.dragWithMouse("Policy check draft", "accepted");
  await expect(board.lane("draft").getByRole("article", { name: /^Policy check draft,/ })).toBeVisible();

  // A release page with its band plot, and a page that could have been prerendered.
  await page.goto(`/registry/${E2E_FAMILY.slug}/1.0.0`);
  await expect(page.getByRole("img", { name: /^Bands of/ })).toBeVisible();
  await page.goto("/no-such-page");
  await expect(page.getByRole("heading").first()).toBeVisible();

  expect(violations).toEqual([]);
});
