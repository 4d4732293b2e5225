import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { Markdown } from "@/app/_components/markdown";
import { renderUserMarkdown } from "@/lib/markdown/render";

const page = (text: string) => renderToStaticMarkup(<Markdown html={renderUserMarkdown(text).html} />);

describe("remark markdown", () => {
  it("renders inline and display math with KaTeX", () => {
    const html = page("Gap $E_g$ and\n\n$$\nm^* = \\hbar^2 / (2t a^2)\n$$\n");
    expect(html).toContain('class="katex"');
    expect(html).toContain('class="katex-display"');
  });
  it("shows raw HTML as text, never as elements", () => {
    const html = page("<script>alert(1)</script> <img src=x onerror=alert(1)>");
    expect(html).not.toContain("<script");
    expect(html).not.toContain("<img");
    expect(html).toContain("&lt;script>alert(1)&lt;/script>");
  });
  it("drops javascript: link targets but keeps the link text and safe links", () => {
    const html = page("See [click](javascript:alert(1)) and [paper](https://example.org/p).");
    expect(html).not.toMatch(/href="javascript/i);
    expect(html).toContain(">click</a>");
    expect(html).toContain('href="https://example.org/p"');
  });
});
