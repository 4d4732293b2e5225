import type { ElementContent, Parents, Root } from "hast";
import rehypeKatex from "rehype-katex";
import rehypeSanitize from "rehype-sanitize";
import remarkMath from "remark-math";
import type { PluggableList } from "unified";
import { visit } from "unist-util-visit";
import { KATEX_OPTIONS } from "./formula";
import { inAppImageUrl, normalizedHref, remoteHost } from "./links";
import { rehypeMathOutputBounds, rehypeMathSourceBounds } from "./math-plugins";
import { USER_MARKDOWN_SCHEMA } from "./sanitize-schema";

/** Raw HTML written in markdown is shown as the text it is. */
function rehypeRawAsText() {
  return (tree: Root) => {
    visit(tree, "raw", (node, index, parent) => {
      if (parent && index !== undefined) parent.children[index] = { type: "text", value: node.value };
    });
  };
}

function insideLink(ancestors: Parents[]): boolean {
  return ancestors.some((a) => a.type === "element" && a.tagName === "a");
}

/** Images load only from this origin; any other image becomes a link to it (or, inside a link, its text). */
function rehypeInAppImages() {
  return (tree: Root) => {
    const replace: { parent: Parents; index: number; node: ElementContent }[] = [];
    const walk = (node: Parents, ancestors: Parents[]) => {
      node.children.forEach((child, index) => {
        if (child.type !== "element") return;
        if (child.tagName === "img") {
          const src = String(child.properties.src ?? "");
          const local = inAppImageUrl(src);
          if (local) child.properties.src = local;
          else replace.push({ parent: node, index, node: remoteImage(src, String(child.properties.alt ?? ""), insideLink([...ancestors, node])) });
          return;
        }
        walk(child, [...ancestors, node]);
      });
    };
    walk(tree, []);
    for (const { parent, index, node } of replace) parent.children[index] = node;
  };
}

function remoteImage(src: string, alt: string, linked: boolean): ElementContent {
  const host = remoteHost(src);
  const label = alt.trim() || "image";
  const text: ElementContent = { type: "text", value: host ? `${label} (image at ${host}, not loaded)` : label };
  if (!host || linked) return { type: "element", tagName: "span", properties: { className: ["remote-image"] }, children: [text] };
  return { type: "element", tagName: "a", properties: { href: src, className: ["remote-image"] }, children: [text] };
}

function rehypeLinkTargets() {
  return (tree: Root) => {
    visit(tree, "element", (el) => {
      if (el.tagName === "a" && typeof el.properties.href === "string") el.properties.href = normalizedHref(el.properties.href);
    });
  };
}

/**
 * The one plugin list for user markdown, used by the server's string renderer (./render) and by react-markdown in
 * the browser preview: `$…$`, `$$…$$` and ```math as math.
 */
export const USER_MARKDOWN_REMARK_PLUGINS: PluggableList = [remarkMath];

/**
 * From markdown's HTML tree (raw HTML kept as raw nodes) to what may be shown: raw HTML as text, math by
 * rehype-katex within the bounds of ./bounds, images only from this origin, links http(s), mailto or relative,
 * then the sanitizer.
 */
export const USER_MARKDOWN_REHYPE_PLUGINS: PluggableList = [
  rehypeRawAsText,
  rehypeMathSourceBounds,
  [rehypeKatex, KATEX_OPTIONS],
  rehypeMathOutputBounds,
  rehypeInAppImages,
  rehypeLinkTargets,
  [rehypeSanitize, USER_MARKDOWN_SCHEMA],
];
