import { describe, expect, it } from "vitest";
import { inAppImageUrl } from "@/lib/markdown/links";
import { renderUserMarkdown } from "@/lib/markdown/render";

const imgSources = (html: string) => [...html.matchAll(/<img\b[^>]*\bsrc="([^"]*)"/g)].map((m) => m[1]);

describe("images load only from this origin", () => {
  it.each([
    ["/figures/gap.png", "/figures/gap.png"],
    [" /figures/gap.png\n", "/figures/gap.png"],
    ["/fig\tures/gap.png", "/figures/gap.png"],
    ["/%2F%2Fevil.example/x.png", "/%2F%2Fevil.example/x.png"],
    ["/..//evil.example/x.png", "/..//evil.example/x.png"],
  ])("keeps the in-app path %j", (src, kept) => {
    expect(inAppImageUrl(src)).toBe(kept);
  });

  it.each([
    "//evil.example/x.png",
    "/\\evil.example/x.png",
    "\\\\evil.example\\x.png",
    "/\t/evil.example/x.png",
    "/\n/evil.example/x.png",
    "\u0001//evil.example/x.png",
    " //evil.example/x.png",
    "https://evil.example/x.png",
    "HTTP://evil.example/x.png",
    "http:evil.example/x.png",
    "javascript:alert(1)",
    "java\tscript:alert(1)",
    "data:image/svg+xml;base64,PHN2Zz48L3N2Zz4=",
    "figures/gap.png",
    "../gap.png",
    "",
  ])("refuses %j", (src) => {
    expect(inAppImageUrl(src)).toBeNull();
  });

  it.each([
    "![t](//evil.example/t.gif)",
    "![t](&#32;//evil.example/t.gif)",
    "![t](https://evil.example/t.gif)",
    "![t](javascript:alert(1))",
    "![t](data:image/png;base64,AAAA)",
    "![t][ref]\n\n[ref]: //evil.example/t.gif",
    "[![t](https://evil.example/t.gif)](https://example.org)",
  ])("renders %j without an <img> from elsewhere", (text) => {
    const html = renderUserMarkdown(text).html;
    for (const src of imgSources(html)) expect(src).toMatch(/^\/(?![/\\])/);
    expect(imgSources(html)).toHaveLength(0);
    expect(html).toContain("t");
  });

  it.each(["![t](</\t/evil.example/t.gif>)", "![t](/&#9;/evil.example/t.gif)", "![t](/&#10;/evil.example/t.gif)", "![t](/&#13;/evil.example/t.gif)"])(
    "keeps %j on this origin: the tab or newline is percent-encoded, so the browser does not drop it",
    (text) => {
      const sources = imgSources(renderUserMarkdown(text).html);
      expect(sources).toHaveLength(1);
      expect(sources[0]).toMatch(/^\/%0[9AD]\/evil\.example/);
      expect(inAppImageUrl(sources[0])).toBe(sources[0]);
    },
  );

  it("turns a remote image into a link naming its host, and keeps in-app images", () => {
    const html = renderUserMarkdown("![gap plot](https://tracker.example/p.gif) and ![mark](/brand/mark.svg)").html;
    expect(html).toContain('<a href="https://tracker.example/p.gif"');
    expect(html).toContain("gap plot (image at tracker.example, not loaded)");
    expect(imgSources(html)).toEqual(["/brand/mark.svg"]);
  });
});

describe("links and raw HTML", () => {
  it.each(["javascript:alert(1)", "JAVASCRIPT:alert(1)", "java&#9;script:alert(1)", "&#1;javascript:alert(1)", "vbscript:x", "data:text/html,x"])("drops the link target %j", (target) => {
    const html = renderUserMarkdown(`[click](${target})`).html;
    expect(html).toContain(">click</a>");
    expect(html).not.toMatch(/href=/);
  });

  it("keeps http(s), mailto and in-app links, marked nofollow", () => {
    const html = renderUserMarkdown("[a](https://example.org/p) [b](HTTPS://example.org/q) [c](mailto:noor@example.org) [d](/proposals/x#remarks)").html;
    expect(html).toContain('href="https://example.org/p"');
    expect(html).toContain('href="https://example.org/q"');
    expect(html).toContain('href="mailto:noor@example.org"');
    expect(html).toContain('href="/proposals/x#remarks"');
    expect(html).toContain('rel="nofollow noopener noreferrer"');
  });

  it("never produces event handlers, styles or scripts from what the user writes", () => {
    const html = renderUserMarkdown('<a href="/x" onclick="alert(1)">x</a> <svg onload=alert(1)> <style>*{}</style>\n\n<div style="position:fixed">x</div>').html;
    expect(html).not.toMatch(/<(a|svg|style|div)\b/);
    expect(html).not.toMatch(/<[^>]*\son\w+=/);
  });

  it("keeps KaTeX's trusted-only commands inert (no links, classes or styles from TeX)", () => {
    const html = renderUserMarkdown(String.raw`$\href{javascript:alert(1)}{x} \url{https://evil.example} \htmlClass{fixed}{y} \htmlStyle{position:fixed}{z} \includegraphics{/x.png}$`).html;
    expect(html).not.toContain("href=");
    expect(html).not.toMatch(/style="[^"]*position/);
    expect(html).not.toContain('class="fixed"');
    expect(imgSources(html)).toHaveLength(0);
  });
});
