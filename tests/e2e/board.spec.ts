import { expect, test } from "@playwright/test";
import { E2E_PASSWORD, E2E_PEOPLE } from "./fixtures/people";
import { BoardPage } from "./pages/board-page";
import { SignInPage } from "./pages/sign-in-page";

test.beforeEach(async ({ page }) => {
  const signIn = new SignInPage(page);
  await signIn.goto("/login?callbackUrl=%2Fboard%3Ffamily%3De2e-chain");
  await signIn.signIn(E2E_PEOPLE.curator.email, E2E_PASSWORD);
  await expect(page.getByRole("heading", { name: "Review board" })).toBeVisible();
});

test("a curator drags a card with the mouse to start the review", async ({ page }) => {
  const board = new BoardPage(page);
  await expect(board.lane("submitted").getByRole("article", { name: /^E2E mouse move,/ })).toBeVisible();
  await board.dragWithMouse("E2E mouse move", "under_review");
  await expect(board.notice()).toContainText("Moved “E2E mouse move” to Under review");
  await expect(board.lane("under_review").getByRole("article", { name: /^E2E mouse move,/ })).toBeVisible();
  await page.reload();
  await expect(board.lane("under_review").getByRole("article", { name: /^E2E mouse move,/ })).toBeVisible();
});

test("a curator carries a card to the next lane with the keyboard", async ({ page }) => {
  const board = new BoardPage(page);
  await board.dragWithKeyboard("E2E keyboard move", "submitted", "Under review", 1);
  await expect(board.notice()).toContainText("Moved “E2E keyboard move” to Under review");
  await expect(board.lane("under_review").getByRole("article", { name: /^E2E keyboard move,/ })).toBeVisible();
});

test("a move the gate refuses snaps back with the server's reason", async ({ page }) => {
  const board = new BoardPage(page);
  const card = board.lane("under_review").getByRole("article", { name: /^E2E refused move,/ });
  await expect(card).toBeVisible();
  await board.dragWithMouse("E2E refused move", "accepted");
  await expect(board.notice()).toContainText("stays in Under review");
  await expect(board.notice()).toContainText("Needs 2 fresh accept verdicts from assigned reviewers; has 0.");
  await expect(card).toBeVisible();
  await expect(board.lane("accepted").getByRole("article", { name: /^E2E refused move,/ })).toHaveCount(0);
});

test("lanes say where the dragged card may go while it is dragged", async ({ page }) => {
  const board = new BoardPage(page);
  await board.ready();
  await board.handle("E2E draft").focus();
  await page.keyboard.press("Space");
  await expect(board.lane("draft")).toHaveAttribute("data-lane-state", "origin");
  await expect(board.lane("accepted")).toHaveAttribute("data-lane-state", "refused");
  await page.keyboard.press("Escape");
  await expect(board.lane("accepted")).toHaveAttribute("data-lane-state", "idle");
});
