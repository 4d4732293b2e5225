import type { ElementContent } from "hast";
import { fromHtmlIsomorphic } from "hast-util-from-html-isomorphic";
import katex, { type KatexOptions } from "katex";
import {
  FORMULA_HTML_MAX,
  FORMULA_SOURCE_MAX,
  FORMULAS_PER_TEXT_MAX,
  KATEX_MAX_EXPAND,
  KATEX_MAX_SIZE_EM,
  MACRO_DEFINITION_COMMANDS,
  REFUSED_SOURCE_SHOWN,
  TEXT_FORMULA_HTML_MAX,
  TEXT_FORMULA_SOURCE_MAX,
} from "./bounds";

/** What the formulas of one text have used so far. */
export interface MathBudget {
  /** Formulas given to KaTeX, and the TeX and HTML characters they took. */
  attempted: number;
  source: number;
  html: number;
  rendered: number;
  refused: number;
}

export const emptyBudget = (): MathBudget => ({ attempted: 0, source: 0, html: 0, rendered: 0, refused: 0 });

const defined = new Set<string>(MACRO_DEFINITION_COMMANDS);
// A control word as KaTeX reads it: a backslash and letters (or @).
const CONTROL_WORD = /\\[a-zA-Z@]+/g;

// KaTeX can only make a control word from literal source (it has no \csname), so reading the source finds every
// definition. Built-ins such as \tag define a macro internally, which this does not hinder.
function definesMacros(source: string): boolean {
  return (source.match(CONTROL_WORD) ?? []).some((word) => defined.has(word));
}

/** KaTeX as user math gets it: no trusted commands (\href, \htmlStyle…), bounded expansion and sizes. */
export function katexOptions(display: boolean): KatexOptions {
  return {
    displayMode: display,
    throwOnError: true,
    trust: false,
    strict: "ignore",
    maxExpand: KATEX_MAX_EXPAND,
    maxSize: KATEX_MAX_SIZE_EM,
    output: "htmlAndMathml",
  };
}

const count = (n: number) => n.toLocaleString("en");

function refusal(source: string, display: boolean, reason: string): ElementContent {
  const shown = source.length > REFUSED_SOURCE_SHOWN ? `${source.slice(0, REFUSED_SOURCE_SHOWN)}…` : source;
  const text = (value: string): ElementContent => ({ type: "text", value });
  const span = (className: string, children: ElementContent[]): ElementContent => ({ type: "element", tagName: "span", properties: { className: [className] }, children });
  return {
    type: "element",
    tagName: "span",
    properties: { className: ["math-too-large", display ? "math-too-large-display" : "math-too-large-inline"], role: "note" },
    children: [span("math-too-large-label", [text("formula too large")]), text(" "), span("math-too-large-reason", [text(`(${reason})`)]), text(" "), span("math-too-large-source", [text(shown)])],
  };
}

function invalid(source: string, message: string): ElementContent {
  return { type: "element", tagName: "span", properties: { className: ["math-error"], title: message }, children: [{ type: "text", value: source }] };
}

function tooLargeReason(source: string, budget: MathBudget): string | null {
  if (source.length > FORMULA_SOURCE_MAX) return `over ${count(FORMULA_SOURCE_MAX)} characters of TeX`;
  if (budget.attempted >= FORMULAS_PER_TEXT_MAX) return `one text renders at most ${count(FORMULAS_PER_TEXT_MAX)} formulas`;
  if (budget.source + source.length > TEXT_FORMULA_SOURCE_MAX) return `one text renders at most ${count(TEXT_FORMULA_SOURCE_MAX)} characters of TeX`;
  if (definesMacros(source)) return "macro definitions such as \\def and \\newcommand are not allowed";
  return null;
}

/**
 * One formula as KaTeX HTML, or, over a bound, a visible "formula too large" with the (truncated) source.
 * Charges the text's budget; a formula that does not parse is shown as its source, marked as an error.
 */
export function renderFormula(source: string, display: boolean, budget: MathBudget): ElementContent[] {
  const refuse = (reason: string) => {
    budget.refused += 1;
    return [refusal(source, display, reason)];
  };
  const reason = tooLargeReason(source, budget);
  if (reason) return refuse(reason);
  budget.attempted += 1;
  budget.source += source.length;
  let html: string;
  try {
    html = katex.renderToString(source, katexOptions(display));
  } catch (error) {
    if (error instanceof RangeError) return refuse("nested too deeply");
    const message = error instanceof Error ? error.message : String(error);
    if (/too many expansions/i.test(message)) return refuse(`more than ${count(KATEX_MAX_EXPAND)} macro expansions`);
    return [invalid(source, message)];
  }
  if (html.length > FORMULA_HTML_MAX) return refuse(`its rendering would exceed ${count(FORMULA_HTML_MAX)} characters`);
  if (budget.html + html.length > TEXT_FORMULA_HTML_MAX) return refuse(`the math of one text may render to at most ${count(TEXT_FORMULA_HTML_MAX)} characters`);
  budget.html += html.length;
  budget.rendered += 1;
  return fromHtmlIsomorphic(html, { fragment: true }).children as ElementContent[];
}
