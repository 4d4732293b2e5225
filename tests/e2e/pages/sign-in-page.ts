import { expect, type Page } from "@playwright/test";

export class SignInPage {
  constructor(private readonly page: Page) {}

  async goto(path = "/login") {
    await this.page.goto(path);
    await expect(this.page.getByRole("heading", { name: "Sign in" })).toBeVisible();
  }

  async signIn(email: string, password: string) {
    await this.page.getByLabel("E-mail").fill(email);
    await this.page.getByLabel("Password").fill(password);
    await this.page.getByRole("button", { name: "Sign in" }).click();
  }

  async signInAndWait(email: string, password: string, name: string) {
    await this.signIn(email, password);
    await expect(this.page.getByTestId("signed-in-name")).toHaveText(name);
  }
}
