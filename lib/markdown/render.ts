import rehypeStringify from "rehype-stringify";
import remarkParse from "remark-parse";
import remarkRehype from "remark-rehype";
import { unified } from "unified";
import { mathBudgetOf } from "./math-plugins";
import { USER_MARKDOWN_REHYPE_PLUGINS, USER_MARKDOWN_REMARK_PLUGINS } from "./plugins";

/** HTML that came out of the sanitizer below: the only kind pages may insert as HTML. */
export type SanitizedHtml = string & { readonly __sanitized: true };

export interface RenderedMarkdown {
  html: SanitizedHtml;
  /** Formulas rendered with KaTeX, and formulas shown as "formula too large". */
  formulas: number;
  refused: number;
}

const processor = unified()
  .use(remarkParse)
  .use(USER_MARKDOWN_REMARK_PLUGINS)
  .use(remarkRehype, { allowDangerousHtml: true })
  .use(USER_MARKDOWN_REHYPE_PLUGINS)
  .use(rehypeStringify, { characterReferences: { useNamedReferences: true } })
  .freeze();

/**
 * User markdown with math as sanitized HTML, within the bounds of ./bounds: raw HTML shown as text, links only
 * http(s), mailto or relative, images only from this origin, each formula rendered by KaTeX or shown as too large.
 */
export function renderUserMarkdown(text: string): RenderedMarkdown {
  const file = processor.processSync(text);
  const budget = mathBudgetOf(file);
  return { html: String(file) as SanitizedHtml, formulas: budget.rendered, refused: budget.refused };
}
