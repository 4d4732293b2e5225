import type { Element, Root, RootContent } from "hast";
import { fromHtmlIsomorphic } from "hast-util-from-html-isomorphic";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { Markdown } from "@/app/_components/markdown";
import { MarkdownPreview } from "@/app/_components/markdown-preview";
import { FORMULAS_PER_TEXT_MAX } from "@/lib/markdown/bounds";
import { renderUserMarkdown } from "@/lib/markdown/render";
import { displayMath, MACRO_BOMB, TOO_LARGE } from "@/tests/support/user-math";

const preview = (text: string) => renderToStaticMarkup(<MarkdownPreview text={text} />);
const stored = (text: string) => renderToStaticMarkup(<Markdown html={renderUserMarkdown(text).html} />);

// Elements, classes, link targets, image sources and text in order: React and the string renderer write attributes
// such as style differently, but the two must show the same thing. React's server renderer adds a preload <link> per
// image, which is not part of the markdown.
function shape(html: string): string[] {
  const out: string[] = [];
  const walk = (node: Root | RootContent) => {
    if (node.type === "text") out.push(`"${node.value}"`);
    if (node.type === "element") {
      const el: Element = node;
      if (el.tagName === "link") return;
      const { className, href, src } = el.properties;
      out.push(`<${el.tagName} ${JSON.stringify({ className, href, src })}>`);
    }
    if ("children" in node) node.children.forEach(walk);
  };
  walk(fromHtmlIsomorphic(html, { fragment: true }));
  return out;
}

const TEXTS = [
  "Gap $E_g$ and\n\n" + displayMath(String.raw`\Delta E \approx \frac{\partial E}{\partial p}\,\Delta p`),
  MACRO_BOMB,
  displayMath(String.raw`\iff`.repeat(240)),
  `$${String.raw`\sqrt{x}`.repeat(125)}$`,
  "before $\\frac{$ after",
  Array.from({ length: FORMULAS_PER_TEXT_MAX + 3 }, (_, i) => `$x_{${i}}$`).join(" "),
  "<script>alert(1)</script> [click](javascript:alert(1)) [paper](HTTPS://example.org/p)",
  "![gap plot](https://tracker.example/p.gif) and ![mark](/brand/mark.svg) [![t](//evil.example/t.gif)](https://example.org)",
  "```math\n\\begin{pmatrix}a&b\\\\c&d\\end{pmatrix}\n```",
];

describe("the remark preview (react-markdown) and the stored HTML use one plugin list", () => {
  it.each(TEXTS)("shows %j as it will be stored", (text) => {
    expect(shape(preview(text))).toEqual(shape(stored(text)));
  });

  it("keeps the bounds in the browser: the macro bomb is refused, not rendered", () => {
    const html = preview(MACRO_BOMB);
    expect(html).toContain(TOO_LARGE);
    expect(html).not.toContain('class="katex"');
    expect(html.length).toBeLessThan(2_000);
  });
});
