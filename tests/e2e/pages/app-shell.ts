import type { Page } from "@playwright/test";

export class AppShell {
  constructor(private readonly page: Page) {}

  mainNav() {
    return this.page.getByRole("navigation", { name: "Main" });
  }

  async navLabels(): Promise<string[]> {
    return (await this.mainNav().getByRole("link").allInnerTexts()).map((s) => s.trim());
  }

  async signOut() {
    await this.page.getByRole("button", { name: "Sign out" }).click();
    await this.page.waitForURL(/\/login/);
  }
}
