import type { Element, Root } from "hast";
import { toHtml } from "hast-util-to-html";
import { toText } from "hast-util-to-text";
import { SKIP, visit } from "unist-util-visit";
import type { VFile } from "vfile";
import { emptyBudget, errorRefusal, invalid, outputRefusal, refusal, sourceRefusal, type MathBudget } from "./formula";

/** A text's math as the two plugins around rehype-katex share it (on the file, so each render starts afresh). */
interface MathState {
  budget: MathBudget;
  /** Formulas let through to rehype-katex, in document order: each comes back as one KaTeX element or one error. */
  passed: { source: string; display: boolean }[];
}

declare module "vfile" {
  interface DataMap {
    math: MathState;
  }
}

const classesOf = (el: Element): unknown[] => (Array.isArray(el.properties.className) ? el.properties.className : []);
const hasClass = (el: Element, ...names: string[]) => classesOf(el).some((c) => names.includes(String(c)));

/** The budget of a rendered file: formulas rendered and refused. */
export function mathBudgetOf(file: VFile): MathBudget {
  return file.data.math?.budget ?? emptyBudget();
}

// The element rehype-katex replaces, as it finds it: ```math and display math are <pre><code class="language-math">.
function mathElement(el: Element): { scope: Element; display: boolean } | null {
  if (el.tagName === "pre") {
    const code = el.children.find((c): c is Element => c.type === "element" && c.tagName === "code");
    return code && hasClass(code, "language-math") ? { scope: el, display: true } : null;
  }
  return hasClass(el, "language-math", "math-display", "math-inline") ? { scope: el, display: hasClass(el, "math-display") } : null;
}

/**
 * Before rehype-katex: a formula over a source bound (its length, the text's formula count or TeX, macro definitions)
 * becomes "formula too large" and never reaches KaTeX; the others are charged to the text's budget.
 */
export function rehypeMathSourceBounds() {
  return (tree: Root, file: VFile) => {
    const state: MathState = { budget: emptyBudget(), passed: [] };
    file.data.math = state;
    visit(tree, "element", (el, index, parent) => {
      const math = mathElement(el);
      if (!math || !parent || index === undefined) return;
      const source = toText(math.scope, { whitespace: "pre" });
      const reason = sourceRefusal(source, state.budget);
      if (reason) {
        state.budget.refused += 1;
        parent.children[index] = refusal(source, math.display, reason);
        return SKIP;
      }
      state.budget.attempted += 1;
      state.budget.source += source.length;
      state.passed.push({ source, display: math.display });
      return SKIP;
    });
  };
}

/**
 * After rehype-katex: a formula whose HTML is over a bound (its own, or the text's math together), or that KaTeX
 * stopped for too many expansions or too deep nesting, becomes "formula too large"; any other KaTeX error shows
 * the source, marked.
 */
export function rehypeMathOutputBounds() {
  return (tree: Root, file: VFile) => {
    const state = file.data.math;
    if (!state) throw new Error("rehypeMathOutputBounds needs rehypeMathSourceBounds before rehype-katex");
    const { budget, passed } = state;
    visit(tree, "element", (el, index, parent) => {
      const error = hasClass(el, "katex-error");
      if (!(error || hasClass(el, "katex", "katex-display")) || !parent || index === undefined) return;
      const { source, display } = passed.shift() ?? { source: toText(el), display: hasClass(el, "katex-display") };
      if (error) {
        const message = String(el.properties.title ?? "");
        const reason = errorRefusal(message);
        if (reason) budget.refused += 1;
        parent.children[index] = reason ? refusal(source, display, reason) : invalid(source, message.replace(/^ParseError: /, ""));
        return SKIP;
      }
      const length = toHtml(el).length;
      const reason = outputRefusal(length, budget);
      if (reason) {
        budget.refused += 1;
        parent.children[index] = refusal(source, display, reason);
        return SKIP;
      }
      budget.html += length;
      budget.rendered += 1;
      return SKIP;
    });
  };
}
