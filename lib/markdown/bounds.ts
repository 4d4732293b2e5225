/**
 * What user math may cost. Each bound is checked per formula or per text (a remark, verdict summary, rationale or
 * changelog); a formula over any of them is shown as "formula too large" with its source, never rendered.
 * Keep the README's "Markdown and math" section in step with these numbers.
 */

/** Characters of TeX source in one formula. */
export const FORMULA_SOURCE_MAX = 1_000;
/** Characters of KaTeX HTML one formula may produce (a few dozen nested roots or a large matrix). */
export const FORMULA_HTML_MAX = 150_000;
/** Formulas rendered per text; later ones are shown as too large. */
export const FORMULAS_PER_TEXT_MAX = 100;
/** Characters of TeX source rendered per text, all formulas together. */
export const TEXT_FORMULA_SOURCE_MAX = 8_000;
/** Characters of KaTeX HTML per text, all formulas together. */
export const TEXT_FORMULA_HTML_MAX = 1_000_000;
/** Macro expansions KaTeX may perform in one formula (built-in macros such as \neq expand too). */
export const KATEX_MAX_EXPAND = 500;
/** Largest size, in em, a formula may ask for (\rule, \kern, \raisebox…); larger sizes are clamped to it. */
export const KATEX_MAX_SIZE_EM = 20;
/** Characters of a refused formula's source shown in its place. */
export const REFUSED_SOURCE_SHOWN = 200;
/**
 * TeX commands that define or rebind macros: refused outright, because a few definitions can expand into
 * thousands of symbols within KaTeX's expansion limit.
 */
export const MACRO_DEFINITION_COMMANDS = [
  "\\def",
  "\\gdef",
  "\\edef",
  "\\xdef",
  "\\let",
  "\\futurelet",
  "\\global",
  "\\long",
  "\\newcommand",
  "\\renewcommand",
  "\\providecommand",
  "\\DeclareMathOperator",
  "\\DeclareRobustCommand",
  "\\newenvironment",
  "\\renewenvironment",
  "\\csname",
  "\\expandafter",
] as const;
/** Wall-clock limit for rendering one text in the render thread; past it the text is shown unrendered. */
export const RENDER_TIME_LIMIT_MS = 10_000;
/**
 * Names the renderer and its bounds in stored HTML. Change it whenever the output or a bound changes: HTML stored
 * under another name is then rendered again when it is next shown.
 */
export const RENDERER_VERSION = "bounded-1";
