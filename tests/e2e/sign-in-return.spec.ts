import { expect, test } from "@playwright/test";
import { E2E_PASSWORD, E2E_PEOPLE } from "./fixtures/people";
import { SignInPage } from "./pages/sign-in-page";

// Links someone could be sent to sign in from; each must bring them back to this site, never to evil.example
// (a browser drops the tab or newline of the first two and reads "//evil.example/phish").
const lures = ["/%09/evil.example/phish", "/%0a/evil.example/phish", "/%5Cevil.example/phish"];

for (const lure of lures) {
  test(`signing in from /login?callbackUrl=${lure} ends on this site`, async ({ page, baseURL }) => {
    const visited: string[] = [];
    // Nothing leaves the machine: a request to the lure's host is answered here and remembered.
    await page.route((url) => url.hostname === "evil.example", async (route) => {
      visited.push(route.request().url());
      await route.fulfill({ status: 200, contentType: "text/html", body: "<h1>phished</h1>" });
    });
    const signIn = new SignInPage(page);
    await signIn.goto(`/login?callbackUrl=${lure}`);
    await signIn.signIn(E2E_PEOPLE.consumer.email, E2E_PASSWORD);
    await page.waitForURL((url) => url.pathname !== "/login");
    expect(new URL(page.url()).origin).toBe(new URL(baseURL!).origin);
    await expect(page.getByTestId("signed-in-name")).toHaveText(E2E_PEOPLE.consumer.name);
    expect(visited).toEqual([]);
  });
}
