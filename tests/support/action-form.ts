import type { HttpSession } from "./http-session";

const unescapeHtml = (v: string) => v.replace(/&quot;/g, '"').replace(/&#x27;/g, "'").replace(/&lt;/g, "<").replace(/&gt;/g, ">").replace(/&amp;/g, "&");

/**
 * Submits a server-action form the way a browser without JavaScript does: a multipart POST of the page's form,
 * with the hidden fields React renders for it, to the page's own URL. Answers with the page rendered after the action.
 */
export async function postActionForm(session: HttpSession, pagePath: string, formLabel: string, fields: Record<string, string>): Promise<{ status: number; html: string }> {
  const page = await (await session.fetch(pagePath)).text();
  const start = page.indexOf(`aria-label="${formLabel}"`);
  if (start < 0) throw new Error(`no form "${formLabel}" on ${pagePath}`);
  const form = page.slice(start, page.indexOf("</form>", start));
  const body = new FormData();
  for (const [, name, value] of form.matchAll(/<input type="hidden" name="(\$ACTION[^"]*)"(?: value="([^"]*)")?/g)) body.append(name, unescapeHtml(value ?? ""));
  for (const [name, value] of Object.entries(fields)) body.append(name, value);
  const res = await session.fetch(pagePath, { method: "POST", body });
  return { status: res.status, html: unescapeHtml(await res.text()) };
}
