import type { Options as SanitizeSchema } from "rehype-sanitize";

// Class names KaTeX writes ("mord", "vlist-t", "reset-size6"…) and those of a refused formula.
const CLASS_NAME = ["className", /^[a-z][a-z0-9-]*$/i] as const;

/** What markdown itself produces (no raw HTML reaches the tree: it is turned into text first). */
const MARKDOWN_TAGS = ["a", "blockquote", "br", "code", "em", "h1", "h2", "h3", "h4", "h5", "h6", "hr", "img", "li", "ol", "p", "pre", "strong", "ul"];
/** What KaTeX's HTML and MathML output uses (checked against a corpus in tests/unit/markdown). */
const KATEX_ATTRIBUTES: Record<string, string[]> = {
  span: ["ariaHidden", "style", "role", "title"],
  math: ["xmlns", "display"],
  semantics: [],
  annotation: ["encoding"],
  mrow: [],
  mi: ["mathvariant"],
  mn: ["mathvariant"],
  mo: ["stretchy", "minsize", "maxsize", "fence", "separator", "lspace", "rspace", "mathvariant", "accent", "movablelimits", "form"],
  mtext: ["mathvariant"],
  ms: [],
  mspace: ["width", "height", "depth", "mathbackground"],
  msup: [],
  msub: [],
  msubsup: [],
  mfrac: ["linethickness"],
  msqrt: [],
  mroot: [],
  mover: ["accent"],
  munder: ["accentunder"],
  munderover: ["accent", "accentunder"],
  mpadded: ["width", "height", "depth", "lspace", "voffset", "mathbackground", "style"],
  mphantom: [],
  menclose: ["notation", "mathbackground"],
  mstyle: ["scriptlevel", "displaystyle", "mathcolor", "mathsize", "mathvariant"],
  mtable: ["rowspacing", "columnspacing", "columnalign", "columnlines", "rowlines", "width", "frame", "framespacing", "rowalign"],
  mtr: [],
  mtd: ["width", "columnalign", "rowalign"],
  svg: ["xmlns", "width", "height", "viewBox", "preserveAspectRatio", "style"],
  path: ["d"],
  line: ["x1", "y1", "x2", "y2", "strokeWidth"],
};

/**
 * The only elements and attributes stored HTML may hold: markdown's, KaTeX's and those of a refused formula.
 * No event handlers, no ids, no raw HTML; link targets http, https, mailto or relative; image sources only
 * a path on this origin (the image step has already turned every other image into a link or its text).
 */
export const USER_MARKDOWN_SCHEMA: SanitizeSchema = {
  tagNames: [...MARKDOWN_TAGS, ...Object.keys(KATEX_ATTRIBUTES)],
  attributes: {
    ...Object.fromEntries(Object.entries(KATEX_ATTRIBUTES).map(([tag, names]) => [tag, [...names, [...CLASS_NAME]]])),
    a: ["href", "title", "rel", [...CLASS_NAME]],
    code: [["className", /^language-./]],
    // A path on this origin only (one leading slash); the image step has cleaned the text as a browser would.
    img: [["src", /^\/(?![/\\])/], "alt", "title"],
    ol: ["start"],
  },
  protocols: { href: ["http", "https", "mailto"] },
  strip: ["script", "style"],
  clobber: [],
  required: { a: { rel: "nofollow noopener noreferrer" } },
};
