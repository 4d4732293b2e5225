import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { Markdown } from "@/app/_components/markdown";

describe("remark markdown", () => {
  it("renders inline and display math with KaTeX", () => {
    const html = renderToStaticMarkup(<Markdown text={"Gap $E_g$ and\n\n$$\nm^* = \\hbar^2 / (2t a^2)\n$$\n"} />);
    expect(html).toContain('class="katex"');
    expect(html).toContain('class="katex-display"');
  });
  it("shows raw HTML as text, never as elements", () => {
    const html = renderToStaticMarkup(<Markdown text={"<script>alert(1)</script> <img src=x onerror=alert(1)>"} />);
    expect(html).not.toContain("<script");
    expect(html).not.toContain("<img");
    expect(html).toContain("&lt;script&gt;");
  });
  it("drops javascript: link targets but keeps the link text and safe links", () => {
    const html = renderToStaticMarkup(<Markdown text={"See [click](javascript:alert(1)) and [paper](https://example.org/p)."} />);
    expect(html).not.toMatch(/href="javascript/i);
    expect(html).toContain(">click</a>");
    expect(html).toContain('href="https://example.org/p"');
  });
});
