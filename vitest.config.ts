import { fileURLToPath } from "node:url";
import { defineConfig } from "vitest/config";

const root = fileURLToPath(new URL(".", import.meta.url));

export default defineConfig({
  resolve: { alias: { "@": root, "server-only": `${root}tests/support/empty-module.ts` } },
  test: {
    environment: "node",
    projects: [
      {
        extends: true,
        test: { name: "unit", include: ["tests/unit/**/*.test.{ts,tsx}"] },
      },
      {
        extends: true,
        test: {
          name: "integration",
          include: ["tests/integration/**/*.test.{ts,tsx}"],
          fileParallelism: false,
          testTimeout: 30_000,
          hookTimeout: 30_000,
          globalSetup: ["tests/integration/global-setup.ts"],
        },
      },
      {
        extends: true,
        // Worker processes started, killed and stopped by the tests themselves: no other worker may share the database.
        test: { name: "faults", include: ["tests/faults/**/*.test.ts"], fileParallelism: false, testTimeout: 480_000, hookTimeout: 60_000 },
      },
    ],
  },
});
