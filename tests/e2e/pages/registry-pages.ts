import { expect, type Locator, type Page } from "@playwright/test";

export class ReleaseFormPage {
  constructor(private readonly page: Page) {}

  version(): Locator {
    return this.page.getByLabel("Version");
  }

  async release() {
    await this.page.getByRole("button", { name: "Release" }).click();
  }
}

export class ReleasePage {
  constructor(private readonly page: Page) {}

  version(): Locator {
    return this.page.getByTestId("release-version");
  }

  checksum(): Locator {
    return this.page.getByTestId("release-sha256");
  }

  bands(): Locator {
    return this.page.getByRole("img", { name: /^Bands of/ });
  }

  async pullCommand(): Promise<string> {
    return (await this.page.getByTestId("pull-command").innerText()).trim();
  }
}

export class TokensPage {
  constructor(private readonly page: Page) {}

  async goto() {
    await this.page.goto("/settings/tokens");
    await expect(this.page.getByRole("heading", { name: "API tokens" })).toBeVisible();
  }

  /** Creates a token and returns the text shown once. */
  async create(name: string): Promise<string> {
    await this.page.getByLabel("Token name").fill(name);
    await this.page.getByRole("button", { name: "Create read-only token" }).click();
    const shown = this.page.getByTestId("new-token");
    await expect(shown).toBeVisible();
    return (await shown.innerText()).trim();
  }
}
