import { expect, type Browser, type Page } from "@playwright/test";
import { E2E_PASSWORD } from "../fixtures/people";
import { SignInPage } from "./sign-in-page";

/** A browser context of its own per person, signed in and on the review workspace of one proposal. */
export async function openReviewAs(browser: Browser, email: string, proposalTitle: string): Promise<Page> {
  const context = await browser.newContext();
  const page = await context.newPage();
  const signIn = new SignInPage(page);
  await signIn.goto("/login?callbackUrl=%2Fboard%3Ffamily%3De2e-chain");
  await signIn.signIn(email, E2E_PASSWORD);
  await page.getByRole("link", { name: proposalTitle, exact: true }).click();
  await page.getByRole("link", { name: /Open the review workspace/ }).click();
  await expect(page.getByRole("heading", { name: `Review: ${proposalTitle}` })).toBeVisible();
  return page;
}

export class ReviewPage {
  constructor(readonly page: Page) {}

  remarkForm() {
    return this.page.getByRole("form", { name: "Write a remark" });
  }

  /** Opens the preview of a remark not yet posted; returns where it shows, and a way back to the text box. */
  async previewRemark(text: string) {
    const form = this.remarkForm();
    await form.getByRole("textbox", { name: "Remark" }).fill(text);
    await form.getByRole("button", { name: "Preview" }).click();
    return { preview: form.getByTestId("remark-preview"), back: () => form.getByRole("button", { name: "Edit" }).click() };
  }

  async writeRemark(text: string, blocking: boolean) {
    const form = this.remarkForm();
    await form.getByRole("textbox", { name: "Remark" }).fill(text);
    if (blocking) await form.getByLabel(/blocking/).check();
    await form.getByRole("button", { name: "Post remark" }).click();
    await expect(this.page.getByText("Remark posted.")).toBeVisible();
  }

  async giveVerdict(verdict: string, summary: string) {
    const form = this.page.getByRole("form", { name: "Give a verdict" });
    await form.getByLabel(verdict, { exact: true }).check();
    await form.getByLabel(/Summary/).fill(summary);
    await form.getByRole("button", { name: "Record verdict" }).click();
    await expect(this.page.getByText("Verdict recorded.")).toBeVisible();
  }

  remark(text: string) {
    return this.page.getByRole("article").filter({ hasText: text });
  }
}
