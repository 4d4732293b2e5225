import { expect, test } from "@playwright/test";
import { E2E_PEOPLE, E2E_SECOND_REVIEWER } from "./fixtures/people";
import { openReviewAs, ReviewPage } from "./pages/review-page";
import { MACRO_BOMB, TOO_LARGE } from "../support/user-math";

const TITLE = "E2E review";

test("a blocking remark with math and a major revision hold the gate until the author revises and reviewers accept again", async ({ browser }) => {
  test.setTimeout(180_000);
  // Reviewer: bands, diff, a blocking remark with inline and display math, a major revision.
  const reviewer = new ReviewPage(await openReviewAs(browser, E2E_PEOPLE.reviewer.email, TITLE));
  await expect(reviewer.page.getByRole("img", { name: /Band structure along/ })).toBeVisible();
  await expect(reviewer.page.locator("#param-shell\\/A-A\\/1\\/sp_sigma")).toBeVisible();
  // The preview renders in the browser with the server's bounds.
  const { preview, back } = await reviewer.previewRemark(`Gap $E_g$, and a bomb:\n\n${MACRO_BOMB}`);
  await expect(preview.locator(".katex").first()).toBeVisible();
  await expect(preview.locator(".math-too-large")).toContainText(TOO_LARGE);
  await back();
  await reviewer.writeRemark("Why does $E_g$ move here?\n\n$$\n\\Delta E \\approx \\frac{\\partial E}{\\partial p}\\,\\Delta p\n$$\n", true);
  const remark = reviewer.remark("Why does");
  await expect(remark.locator(".katex").first()).toBeVisible();
  await expect(remark.locator(".katex-display")).toBeVisible();
  await expect(remark).toContainText("⚑ blocking");
  await reviewer.giveVerdict("major revision", "The gap moves more than the rationale says.");

  // Curator sends it back for revision.
  const curator = new ReviewPage(await openReviewAs(browser, E2E_PEOPLE.curator.email, TITLE));
  await curator.page.getByRole("button", { name: /Move to Revision/ }).click();
  await curator.page.getByLabel(/Reason/).fill("Answer the blocking remark.");
  await curator.page.getByRole("button", { name: "Move", exact: true }).click();
  await expect(curator.page.getByText("Moved to Revision.")).toBeVisible();

  // Author: a new revision with different physics, back under review, remark addressed.
  const author = new ReviewPage(await openReviewAs(browser, E2E_PEOPLE.author.email, TITLE));
  await author.page.getByRole("link", { name: "← Proposal overview" }).click();
  await author.page.getByLabel("on-site energy of A pz (eV)").fill("1.6");
  await author.page.getByLabel("What changed in this revision").fill("raise pz a little");
  await author.page.getByRole("button", { name: "Save revision" }).click();
  await expect(author.page.getByRole("status").filter({ hasText: "Saved as a new revision." })).toBeVisible();
  await author.page.getByRole("button", { name: /Move to Under review/ }).click();
  await expect(author.page.getByText("Moved to Under review.")).toBeVisible();
  await author.page.getByRole("link", { name: /Open the review workspace/ }).click();
  await author.remark("Why does").getByRole("button", { name: "Mark addressed" }).click();
  await expect(author.remark("Why does")).toContainText("addressed");

  // The old verdict is stale; the curator's accept is refused with every reason.
  await reviewer.page.reload();
  await expect(reviewer.page.getByTestId("verdict").first()).toHaveAttribute("data-fresh", "false");
  await expect(reviewer.page.getByText("stale: the physics changed since")).toBeVisible();
  await curator.page.reload();
  const blocked = curator.page.getByRole("list", { name: "What blocks Accepted" });
  await expect(blocked).toContainText("Needs 2 fresh accept verdicts from assigned reviewers; has 0.");
  await expect(blocked).toContainText("1 blocking remark still open.");
  await curator.page.getByRole("button", { name: /Move to Accepted/ }).click();
  await expect(curator.page.getByRole("status").filter({ hasText: "still open" })).toBeVisible();

  // Remark resolved, two fresh accepts: now the gate opens.
  await reviewer.remark("Why does").getByRole("button", { name: "Resolve" }).click();
  await expect(reviewer.remark("Why does")).toContainText("resolved");
  await reviewer.giveVerdict("accept", "Fine now.");
  const second = new ReviewPage(await openReviewAs(browser, E2E_SECOND_REVIEWER.email, TITLE));
  await second.giveVerdict("accept", "Agreed.");
  await curator.page.reload();
  await expect(curator.page.getByTestId("fresh-accepts")).toHaveText("2 / 2");
  await curator.page.getByRole("button", { name: /Move to Accepted/ }).click();
  await expect(curator.page.getByText("Moved to Accepted.")).toBeVisible();
  await curator.page.reload();
  await expect(curator.page.getByTestId("proposal-stage")).toContainText("Accepted");
});
