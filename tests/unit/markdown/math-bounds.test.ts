import { describe, expect, it } from "vitest";
import { FORMULA_HTML_MAX, FORMULA_SOURCE_MAX, FORMULAS_PER_TEXT_MAX, KATEX_MAX_SIZE_EM, TEXT_FORMULA_SOURCE_MAX } from "@/lib/markdown/bounds";
import { renderUserMarkdown } from "@/lib/markdown/render";
import { displayMath as display, MACRO_BOMB, TOO_LARGE } from "@/tests/support/user-math";

describe("bounded math", () => {
  it("renders ordinary math with KaTeX", () => {
    const r = renderUserMarkdown("Gap $E_g$ and\n\n" + display(String.raw`\Delta E \approx \frac{\partial E}{\partial p}\,\Delta p`));
    expect(r.formulas).toBe(2);
    expect(r.refused).toBe(0);
    expect(r.html).toContain('class="katex-display"');
    expect(r.html).not.toContain(TOO_LARGE);
  });

  it("refuses the macro bomb of the report: a few hundred characters of output instead of megabytes", () => {
    expect(MACRO_BOMB.length).toBeLessThan(240);
    const r = renderUserMarkdown(MACRO_BOMB);
    expect(r.html).toContain(TOO_LARGE);
    expect(r.html).toContain("macro definitions");
    expect(r.html.length).toBeLessThan(1_000);
    expect(r.refused).toBe(1);
    expect(r.html).not.toContain('class="katex"');
  });

  it.each([
    ["nested \\newcommand", String.raw`\newcommand{\a}{\b\b}\newcommand{\b}{\c\c}\newcommand{\c}{x}\a`],
    ["\\def inside \\def", String.raw`\def\a{\def\b{\sqrt{x}}\b\b}\a\a`],
    ["\\global\\def", String.raw`\global\def\a{x}\a`],
    ["\\gdef, \\edef and \\xdef", String.raw`\gdef\a{x}\edef\b{\a\a}\xdef\c{\b\b}\c`],
    ["\\let", String.raw`\let\a=\sqrt \a{x}`],
    ["\\renewcommand", String.raw`\renewcommand{\sqrt}{x}\sqrt{2}`],
    ["\\providecommand", String.raw`\providecommand{\a}{x}\a`],
    ["\\futurelet", String.raw`\futurelet\a\b c`],
  ])("refuses macro definitions: %s", (_name, tex) => {
    const r = renderUserMarkdown(display(tex));
    expect(r.html).toContain(TOO_LARGE);
    expect(r.formulas).toBe(0);
  });

  it("keeps control words that merely start like a definition (\\left, \\leq, \\delta)", () => {
    const r = renderUserMarkdown(display(String.raw`\left( \delta \leq \lvert x \rvert \right) \defeq`));
    expect(r.html).not.toContain(TOO_LARGE);
  });

  it("refuses a formula over the source limit, showing its source truncated", () => {
    const tex = "x+".repeat(FORMULA_SOURCE_MAX / 2) + "y";
    const r = renderUserMarkdown(`$${tex}$`);
    expect(r.html).toContain(TOO_LARGE);
    expect(r.html).toContain("x+x+x+");
    expect(r.html.length).toBeLessThan(1_000);
  });

  it("refuses a formula whose output would be over the HTML limit", () => {
    const tex = String.raw`\sqrt{x}`.repeat(Math.floor(FORMULA_SOURCE_MAX / 8));
    const r = renderUserMarkdown(`$${tex}$`);
    expect(r.html).toContain(TOO_LARGE);
    expect(r.html.length).toBeLessThan(FORMULA_HTML_MAX / 100);
  });

  it("refuses built-in macros expanding past the expansion limit", () => {
    const r = renderUserMarkdown(display(String.raw`\iff`.repeat(240)));
    expect(r.html).toContain(TOO_LARGE);
    expect(r.html).toContain("macro expansions");
  });

  it("renders at most the per-text number of formulas; the rest are shown as too large", () => {
    const text = Array.from({ length: FORMULAS_PER_TEXT_MAX + 5 }, (_, i) => `$x_{${i}}$`).join(" ");
    const r = renderUserMarkdown(text);
    expect(r.formulas).toBe(FORMULAS_PER_TEXT_MAX);
    expect(r.refused).toBe(5);
    expect(r.html.split(TOO_LARGE).length - 1).toBe(5);
  });

  it("renders at most the per-text amount of TeX", () => {
    // Light output (spaces), so the TeX bound is met before the HTML one.
    const one = `x${" ".repeat(FORMULA_SOURCE_MAX - 10)}y`;
    const count = Math.ceil(TEXT_FORMULA_SOURCE_MAX / one.length) + 2;
    const r = renderUserMarkdown(Array.from({ length: count }, () => display(one)).join("\n"));
    expect(r.formulas).toBe(Math.floor(TEXT_FORMULA_SOURCE_MAX / one.length));
    expect(r.refused).toBe(count - r.formulas);
    expect(r.html).toContain(TOO_LARGE);
  });

  it("clamps sizes such as \\rule{1000em}{1000em} to the size limit", () => {
    const r = renderUserMarkdown(`$\\rule{1000em}{1000em}$`);
    expect(r.formulas).toBe(1);
    const output = r.html.replace(/<annotation[^>]*>.*?<\/annotation>/g, "");
    expect(output).not.toContain("1000em");
    const sizes = [...output.matchAll(/(\d+(?:\.\d+)?)em/g)].map((m) => Number(m[1]));
    expect(Math.max(...sizes)).toBeLessThanOrEqual(KATEX_MAX_SIZE_EM);
  });

  it("shows a formula that does not parse as its source, marked, without failing the text", () => {
    const r = renderUserMarkdown("before $\\frac{$ after");
    expect(r.html).toContain('class="math-error"');
    expect(r.html).toContain("before");
    expect(r.html).toContain("after");
  });

  it("keeps deep nesting within the bounds", () => {
    const depth = Math.floor(FORMULA_SOURCE_MAX / 8);
    const r = renderUserMarkdown(`$${"{".repeat(depth)}x${"}".repeat(depth)}$`);
    expect(r.html.length).toBeLessThan(FORMULA_HTML_MAX);
  });
});
