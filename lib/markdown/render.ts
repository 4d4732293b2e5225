import type { Element, ElementContent, Parents, Root } from "hast";
import { toText } from "hast-util-to-text";
import rehypeSanitize from "rehype-sanitize";
import rehypeStringify from "rehype-stringify";
import remarkMath from "remark-math";
import remarkParse from "remark-parse";
import remarkRehype from "remark-rehype";
import { unified } from "unified";
import { SKIP, visit } from "unist-util-visit";
import { emptyBudget, renderFormula, type MathBudget } from "./formula";
import { inAppImageUrl, normalizedHref, remoteHost } from "./links";
import { USER_MARKDOWN_SCHEMA } from "./sanitize-schema";

/** HTML that came out of the sanitizer below: the only kind pages may insert as HTML. */
export type SanitizedHtml = string & { readonly __sanitized: true };

export interface RenderedMarkdown {
  html: SanitizedHtml;
  /** Formulas rendered with KaTeX, and formulas shown as "formula too large". */
  formulas: number;
  refused: number;
}

const classesOf = (el: Element): unknown[] => (Array.isArray(el.properties.className) ? el.properties.className : []);

/** Raw HTML written in markdown is shown as the text it is. */
function rawAsText() {
  return (tree: Root) => {
    visit(tree, "raw", (node, index, parent) => {
      if (parent && index !== undefined) parent.children[index] = { type: "text", value: node.value };
    });
  };
}

function mathSource(el: Element): { code: Element; display: boolean } | null {
  if (el.tagName === "pre") {
    // remark-math writes display math (and ```math blocks) as <pre><code class="language-math">.
    const code = el.children.find((c): c is Element => c.type === "element" && c.tagName === "code");
    return code && classesOf(code).includes("language-math") ? { code, display: true } : null;
  }
  const classes = classesOf(el);
  return el.tagName === "code" && (classes.includes("math-inline") || classes.includes("language-math")) ? { code: el, display: false } : null;
}

/** `$…$`, `$$…$$` and ```math blocks through the bounded formula renderer. */
function boundedMath() {
  return (tree: Root, file: { data: Record<string, unknown> }) => {
    const budget: MathBudget = emptyBudget();
    visit(tree, "element", (el, index, parent) => {
      const math = mathSource(el);
      if (!math || !parent || index === undefined) return;
      const nodes = renderFormula(toText(math.code, { whitespace: "pre" }), math.display, budget);
      parent.children.splice(index, 1, ...nodes);
      return [SKIP, index + nodes.length];
    });
    file.data.math = budget;
  };
}

function insideLink(ancestors: Parents[]): boolean {
  return ancestors.some((a) => a.type === "element" && a.tagName === "a");
}

/** Images load only from this origin; any other image becomes a link to it (or, inside a link, its text). */
function inAppImages() {
  return (tree: Root) => {
    const replace: { parent: Parents; index: number; node: ElementContent }[] = [];
    const walk = (node: Parents, ancestors: Parents[]) => {
      node.children.forEach((child, index) => {
        if (child.type !== "element") return;
        if (child.tagName === "img") {
          const src = String(child.properties.src ?? "");
          const local = inAppImageUrl(src);
          if (local) child.properties.src = local;
          else replace.push({ parent: node, index, node: remoteImage(src, String(child.properties.alt ?? ""), insideLink([...ancestors, node])) });
          return;
        }
        walk(child, [...ancestors, node]);
      });
    };
    walk(tree, []);
    for (const { parent, index, node } of replace) parent.children[index] = node;
  };
}

function remoteImage(src: string, alt: string, linked: boolean): ElementContent {
  const host = remoteHost(src);
  const label = alt.trim() || "image";
  const text: ElementContent = { type: "text", value: host ? `${label} (image at ${host}, not loaded)` : label };
  if (!host || linked) return { type: "element", tagName: "span", properties: { className: ["remote-image"] }, children: [text] };
  return { type: "element", tagName: "a", properties: { href: src, className: ["remote-image"] }, children: [text] };
}

function linkTargets() {
  return (tree: Root) => {
    visit(tree, "element", (el) => {
      if (el.tagName === "a" && typeof el.properties.href === "string") el.properties.href = normalizedHref(el.properties.href);
    });
  };
}

const processor = unified()
  .use(remarkParse)
  .use(remarkMath)
  .use(remarkRehype, { allowDangerousHtml: true })
  .use(rawAsText)
  .use(boundedMath)
  .use(inAppImages)
  .use(linkTargets)
  .use(rehypeSanitize, USER_MARKDOWN_SCHEMA)
  .use(rehypeStringify, { characterReferences: { useNamedReferences: true } })
  .freeze();

/**
 * User markdown with math as sanitized HTML, within the bounds of ./bounds: raw HTML shown as text, links only
 * http(s), mailto or relative, images only from this origin, each formula rendered by KaTeX or shown as too large.
 */
export function renderUserMarkdown(text: string): RenderedMarkdown {
  const file = processor.processSync(text);
  const budget = (file.data.math as MathBudget | undefined) ?? emptyBudget();
  return { html: String(file) as SanitizedHtml, formulas: budget.rendered, refused: budget.refused };
}
