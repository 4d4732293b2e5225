import { readFileSync } from "node:fs";
import { expect, test } from "@playwright/test";
import { REFERENCE_TOO_LARGE } from "@/lib/size-limits";
import { parseModelDocument } from "@/lib/tb/document";
import { samplePath } from "@/lib/tb/kpath";
import { BoardPage } from "./pages/board-page";
import { E2E_PASSWORD, E2E_PEOPLE } from "./fixtures/people";
import { SignInPage } from "./pages/sign-in-page";

const MIB = 1024 * 1024;

/**
 * Reference bands on the E2E chain's default path (k_path kind, 20,000 rows), padded with comment lines to exactly
 * `bytes`: a valid file of any size between about 1 MiB and the limit.
 */
function referenceCsv(bytes: number): Buffer {
  const chain = parseModelDocument(JSON.parse(readFileSync("db/seed/models/demo-sp-chain.json", "utf8")));
  const path = samplePath(chain);
  const length = path.distance[path.distance.length - 1];
  const rows = Array.from({ length: 20_000 }, (_, i) => {
    const k = (length * i) / 19_999;
    return [k.toFixed(7), ...[-7.8, -2.1, 1.4, 5.2, 6.7].map((e) => (e + 0.3 * Math.cos(k * 2.5)).toFixed(6))].join(",");
  });
  const text = ["k_path (1/angstrom),E1 (eV),E2 (eV),E3 (eV),E4 (eV),E5 (eV)", ...rows].join("\n") + "\n";
  const pad = bytes - Buffer.byteLength(text);
  if (pad < 2) throw new Error(`the rows alone take ${Buffer.byteLength(text)} bytes`);
  return Buffer.from(`#${" ".repeat(pad - 2)}\n${text}`);
}

test("an author uploads a 1.5 MiB reference file through the form, and one over 5 MiB is refused with a message", async ({ page }) => {
  const signIn = new SignInPage(page);
  await signIn.goto("/login?callbackUrl=%2Fboard%3Ffamily%3De2e-chain");
  await signIn.signIn(E2E_PEOPLE.author.email, E2E_PASSWORD);
  const board = new BoardPage(page);
  await board.ready();
  await board.card("E2E draft").getByRole("link", { name: "E2E draft" }).click();
  await expect(page.getByRole("heading", { name: "E2E draft" })).toBeVisible();

  const form = page.getByRole("form", { name: "Upload reference bands" });
  const fill = async (name: string, file: Buffer, fileName: string) => {
    await form.getByLabel("Name").fill(name);
    await form.getByLabel("File").setInputFiles({ name: fileName, mimeType: "text/csv", buffer: file });
    await form.getByLabel("Method").fill("DFT-PBE");
    await form.getByLabel("Code and version").fill("invented code 1.0");
    await form.getByLabel("Structure source").fill("e2e chain, a = 2.5 Å");
    await form.getByRole("button", { name: "Upload" }).click();
  };

  const medium = referenceCsv(1.5 * MIB);
  expect(medium.length).toBe(1.5 * MIB);
  await fill("one and a half MiB", medium, "medium.csv");
  await expect(form.getByRole("status")).toHaveText("Reference bands stored.");
  const list = page.getByRole("region", { name: "Reference bands" });
  await expect(list.getByText("one and a half MiB")).toBeVisible();

  await fill("over the limit", referenceCsv(5 * MIB + 1), "large.csv");
  await expect(form.getByRole("alert").first()).toHaveText(REFERENCE_TOO_LARGE);
  await page.reload();
  await expect(page.getByRole("region", { name: "Reference bands" }).getByText("one and a half MiB")).toBeVisible();
  await expect(page.getByRole("region", { name: "Reference bands" }).getByText("over the limit")).toHaveCount(0);
});
