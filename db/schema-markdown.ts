import { primaryKey, pgTable, text, timestamp } from "drizzle-orm/pg-core";

/**
 * Sanitized HTML of user markdown (remark bodies, verdict summaries, rationales, changelogs), rendered once when
 * the text is written (or first shown) and read back on every view. Keyed by the text's sha256 and the renderer
 * version, so an edit or a change of the renderer's bounds simply finds no row and renders again.
 */
export const markdownRenders = pgTable(
  "markdown_renders",
  {
    sourceSha256: text("source_sha256").notNull(),
    renderer: text("renderer").notNull(),
    html: text("html").notNull(),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [primaryKey({ columns: [t.sourceSha256, t.renderer] })],
);
export type MarkdownRender = typeof markdownRenders.$inferSelect;
