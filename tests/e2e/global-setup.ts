import { execFileSync } from "node:child_process";

/** Puts the test accounts, a family and proposals into the test database through the real use-cases. */
export default function globalSetup(): void {
  execFileSync("node_modules/.bin/tsx", ["--conditions=react-server", "tests/e2e/seed-e2e.ts"], { stdio: "inherit", env: process.env });
}
