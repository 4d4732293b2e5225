import type { SanitizedHtml } from "@/lib/markdown/render";

/** How rendered user markdown looks, stored or previewed. */
export const MARKDOWN_CLASS =
  "markdown space-y-2 leading-relaxed [&_a]:text-copper-deep [&_a]:underline [&_code]:num [&_code]:rounded [&_code]:bg-paper-deep [&_code]:px-1 [&_ol]:list-decimal [&_ol]:pl-6 [&_ul]:list-disc [&_ul]:pl-6";

/**
 * User markdown as HTML that lib/markdown rendered and sanitized (stored when the text was written): math by KaTeX
 * within bounds, raw HTML as text, links http(s), mailto or in-app, images from this origin only.
 */
export function Markdown({ html }: { html: SanitizedHtml }) {
  return <div className={MARKDOWN_CLASS} dangerouslySetInnerHTML={{ __html: html }} />;
}
