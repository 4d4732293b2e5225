import type { ElementContent } from "hast";
import type { Options as RehypeKatexOptions } from "rehype-katex";
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

/** KaTeX as user math gets it (rehype-katex passes these on): no trusted commands (\href, \htmlStyle…), bounded expansion and sizes. */
export const KATEX_OPTIONS: RehypeKatexOptions = {
  trust: false,
  strict: "ignore",
  maxExpand: KATEX_MAX_EXPAND,
  maxSize: KATEX_MAX_SIZE_EM,
  output: "htmlAndMathml",
};

const defined = new Set<string>(MACRO_DEFINITION_COMMANDS);
// A control word as KaTeX reads it: a backslash and letters (or @).
const CONTROL_WORD = /\\[a-zA-Z@]+/g;

// KaTeX can only make a control word from literal source (it has no \csname), so reading the source finds every
// definition. Built-ins such as \tag define a macro internally, which this does not hinder.
function definesMacros(source: string): boolean {
  return (source.match(CONTROL_WORD) ?? []).some((word) => defined.has(word));
}

const count = (n: number) => n.toLocaleString("en");

/** Why a formula may not go to KaTeX at all (its source, or the text's formulas so far), or null. */
export function sourceRefusal(source: string, budget: MathBudget): string | null {
  if (source.length > FORMULA_SOURCE_MAX) return `over ${count(FORMULA_SOURCE_MAX)} characters of TeX`;
  if (budget.attempted >= FORMULAS_PER_TEXT_MAX) return `one text renders at most ${count(FORMULAS_PER_TEXT_MAX)} formulas`;
  if (budget.source + source.length > TEXT_FORMULA_SOURCE_MAX) return `one text renders at most ${count(TEXT_FORMULA_SOURCE_MAX)} characters of TeX`;
  if (definesMacros(source)) return "macro definitions such as \\def and \\newcommand are not allowed";
  return null;
}

/** Why KaTeX's output for a formula may not be kept (its size, or the text's math so far), or null. */
export function outputRefusal(htmlLength: number, budget: MathBudget): string | null {
  if (htmlLength > FORMULA_HTML_MAX) return `its rendering would exceed ${count(FORMULA_HTML_MAX)} characters`;
  if (budget.html + htmlLength > TEXT_FORMULA_HTML_MAX) return `the math of one text may render to at most ${count(TEXT_FORMULA_HTML_MAX)} characters`;
  return null;
}

/** Why a KaTeX error means the formula is too large rather than wrong, or null. */
export function errorRefusal(message: string): string | null {
  if (/^RangeError\b/.test(message)) return "nested too deeply";
  if (/too many expansions/i.test(message)) return `more than ${count(KATEX_MAX_EXPAND)} macro expansions`;
  return null;
}

/** A visible "formula too large" with the reason and the (truncated) source, in place of the formula. */
export function refusal(source: string, display: boolean, reason: string): ElementContent {
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

/** A formula that does not parse: its source, marked, with KaTeX's message. */
export function invalid(source: string, message: string): ElementContent {
  return { type: "element", tagName: "span", properties: { className: ["math-error"], title: message }, children: [{ type: "text", value: source }] };
}
