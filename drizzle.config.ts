import { defineConfig } from "drizzle-kit";

export default defineConfig({
  dialect: "postgresql",
  schema: "./db/schema.ts",
  out: "./db/migrations",
  // drizzle-kit changes the schema, so it connects as the owner role, as the migration step does.
  dbCredentials: { url: process.env.MIGRATION_DATABASE_URL ?? process.env.DATABASE_URL ?? "postgres://bandgate_owner@127.0.0.1:54329/bandgate" },
});
