// The URL standard has browsers strip leading and trailing C0 controls and spaces, and drop every tab and newline.
const EDGE_CONTROLS = /^[\u0000-\u0020]+|[\u0000-\u0020]+$/g;
const TAB_OR_NEWLINE = /[\t\n\r]/g;
const SCHEME = /^([a-zA-Z][a-zA-Z0-9+.-]*):/;
const SENTINEL = "https://in-app.invalid";

/** A URL as a browser reads the attribute: what it fetches depends on this text, not on the original. */
export function browserUrlText(url: string): string {
  return url.replace(EDGE_CONTROLS, "").replace(TAB_OR_NEWLINE, "");
}

/**
 * The URL text to use for an image when it loads from this origin, else null. Only a path with a single leading
 * slash qualifies: `//host/x`, `/\host/x`, `\\host\x` and any scheme (`https:`, `data:`, `javascript:`) load from
 * elsewhere or run something; relative paths without a slash depend on the page's own address.
 */
export function inAppImageUrl(src: string): string | null {
  const text = browserUrlText(src);
  if (!text.startsWith("/") || text[1] === "/" || text[1] === "\\") return null;
  let resolved: URL;
  try {
    resolved = new URL(text, `${SENTINEL}/page/`);
  } catch {
    return null;
  }
  return resolved.origin === SENTINEL ? text : null;
}

/** A link target with its scheme in lower case (the sanitizer compares schemes case-sensitively). */
export function normalizedHref(href: string): string {
  const text = browserUrlText(href);
  return text.replace(SCHEME, (_, scheme: string) => `${scheme.toLowerCase()}:`);
}

/** The host an absolute http(s) URL points to, for telling the reader where an image would have come from. */
export function remoteHost(url: string): string | null {
  try {
    const parsed = new URL(browserUrlText(url), `${SENTINEL}/page/`);
    return parsed.origin !== SENTINEL && (parsed.protocol === "https:" || parsed.protocol === "http:") ? parsed.host : null;
  } catch {
    return null;
  }
}
