import { expect, type Locator, type Page } from "@playwright/test";

/** The refit page of a proposal: settings, preview and the list of runs. */
export class RefitPage {
  constructor(private readonly page: Page) {}

  async open(proposalTitle: string) {
    await this.page.goto("/board?family=e2e-diamond");
    await this.page.getByRole("link", { name: proposalTitle }).first().click();
    await this.page.getByRole("link", { name: "Refit to reference bands →" }).click();
    await expect(this.page.getByRole("heading", { name: `Refit: ${proposalTitle}` })).toBeVisible();
  }

  async freeAll() {
    await this.page.getByRole("button", { name: "Free every two-centre integral" }).click();
    await this.page.getByRole("button", { name: "Free every on-site energy" }).click();
  }

  async fixAll() {
    await this.page.getByRole("button", { name: "Fix all" }).click();
  }

  async free(label: string) {
    await this.page.getByRole("checkbox", { name: `fit ${label}` }).check();
  }

  async setField(label: string, value: string) {
    await this.page.getByLabel(label, { exact: true }).fill(value);
  }

  previewSummary(): Locator {
    return this.page.getByTestId("fit-preview-summary");
  }

  async start() {
    await this.page.getByRole("button", { name: "Start the refit" }).click();
    await expect(this.page.getByText(/Refit started/)).toBeVisible();
  }

  /** Runs are listed newest first. */
  run(index: number): Locator {
    return this.page.getByTestId("fit-run").nth(index);
  }

  async progressOf(run: Locator): Promise<number> {
    return Number(await run.getByRole("progressbar").getAttribute("aria-valuenow"));
  }
}
