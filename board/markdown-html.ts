import "server-only";
import { createHash } from "node:crypto";
import { and, eq, inArray } from "drizzle-orm";
import { db } from "@/db/client";
import { markdownRenders } from "@/db/schema";
import { RENDERER_VERSION } from "@/lib/markdown/bounds";
import type { SanitizedHtml } from "@/lib/markdown/render";
import { renderInThread, unrenderedText } from "@/lib/markdown/render-in-thread";

/** The stored HTML of a text given to loadMarkdownHtml. */
export type HtmlOf = (text: string) => SanitizedHtml;

const sha256 = (text: string) => createHash("sha256").update(text, "utf8").digest("hex");
const reason = (err: unknown) => (err instanceof Error ? err.message : err);

async function renderAndStore(text: string): Promise<SanitizedHtml> {
  let html: SanitizedHtml;
  try {
    html = (await renderInThread(text)).html;
  } catch (err) {
    // Not stored: the next view tries again.
    console.error("[bandgate] markdown not rendered", reason(err));
    return unrenderedText(text).html;
  }
  await db.insert(markdownRenders).values({ sourceSha256: sha256(text), renderer: RENDERER_VERSION, html }).onConflictDoNothing();
  return html;
}

/**
 * Stored HTML for each text. A text with none under the current renderer (written before HTML was stored, or
 * rendered by an older version) is rendered now, in the render thread, and stored, so later views only read.
 */
export async function loadMarkdownHtml(texts: readonly string[]): Promise<HtmlOf> {
  const byHash = new Map([...new Set(texts)].filter((t) => t !== "").map((t) => [sha256(t), t]));
  const found = new Map<string, SanitizedHtml>([["", "" as SanitizedHtml]]);
  if (byHash.size > 0) {
    const rows = await db
      .select({ sha256: markdownRenders.sourceSha256, html: markdownRenders.html })
      .from(markdownRenders)
      .where(and(eq(markdownRenders.renderer, RENDERER_VERSION), inArray(markdownRenders.sourceSha256, [...byHash.keys()])));
    // Written only by renderAndStore, from the sanitizer's output.
    for (const row of rows) found.set(byHash.get(row.sha256)!, row.html as SanitizedHtml);
  }
  const missing = [...byHash.values()].filter((t) => !found.has(t));
  const rendered = await Promise.all(missing.map(renderAndStore));
  missing.forEach((text, i) => found.set(text, rendered[i]));
  return (text) => found.get(text) ?? unrenderedText(text).html;
}

/**
 * Renders and stores the HTML of texts just written (after their transaction commits), so no page view renders
 * them. A failure here loses nothing: the first view renders the text instead.
 */
export async function storeMarkdownHtml(...texts: string[]): Promise<void> {
  try {
    await loadMarkdownHtml(texts);
  } catch (err) {
    console.error("[bandgate] markdown HTML not stored", reason(err));
  }
}
