import { fromHtmlIsomorphic } from "hast-util-from-html-isomorphic";
import { toHtml } from "hast-util-to-html";
import katex from "katex";
import { describe, expect, it } from "vitest";
import { KATEX_OPTIONS } from "@/lib/markdown/formula";
import { renderUserMarkdown } from "@/lib/markdown/render";

/** Formulas covering KaTeX's output: fractions, roots, stretchy SVGs, arrays, colours, MathML attributes, spacing. */
const CORPUS = String.raw`x^2+y_1 | \frac{a}{b} | \sqrt[3]{x} | \overbrace{abc}^{n} | \underbrace{abc}_{n} | \widehat{xyz} | \xrightarrow[b]{a} | \overrightarrow{AB} | \cancel{x} | \xcancel{x} | \sout{x} | \boxed{x} | \colorbox{red}{x} | \fcolorbox{red}{blue}{x} | \textcolor{#00f}{x} | \begin{pmatrix}a&b\\c&d\end{pmatrix} | \begin{array}{c|c}a&b\\\hline c&d\end{array} | \begin{aligned}a&=b\\c&=d\end{aligned} | \begin{cases}a&x>0\\b&\text{else}\end{cases} | \left\{x\middle|y\right\} | \Biggl[ \Biggr] | \sum_{i=1}^n i | \int_0^\infty e^{-x}dx | \mathbb{R}\mathcal{H}\mathfrak{g}\boldsymbol{\sigma} | \langle\psi|H|\psi\rangle | \vec{k}\dot{x}\hat{H}\bar{E}\tilde{t} | \overset{!}{=} | \binom{n}{k} | \cfrac{1}{1+\cfrac{1}{x}} | \phantom{x}y\smash{x}\rlap{x} | \kern1em\hspace{1em}\quad\,\;\! | \rule{2em}{1em} | \raisebox{0.5em}{x} | \operatorname*{argmax}_x | \pmod{3} | \tag{1} E_g | \begin{gather}a\\b\end{gather} | \substack{a\\b} | \Huge x \tiny y | \displaystyle x \scriptstyle y | \overgroup{ab} | \xlongequal{a} | \not= | \verb|x| | \Delta E \approx \frac{\partial E}{\partial p}\,\Delta p`.split(" | ");

const stringify = (html: string) => toHtml(fromHtmlIsomorphic(html, { fragment: true }), { characterReferences: { useNamedReferences: true } });

describe("the sanitizer keeps KaTeX's output whole", () => {
  it.each(CORPUS)("%s", (tex) => {
    const expected = stringify(katex.renderToString(tex, { ...KATEX_OPTIONS, displayMode: true }));
    expect(renderUserMarkdown(`$$\n${tex}\n$$`).html).toBe(expected);
  });
});
