/**
 * Where to send someone after signing in (or out): only a path on this site. The candidate is read the way a browser
 * reads a link (WHATWG URL parsing drops tabs and newlines, turns `\` into `/`, resolves `.` segments), so
 * `/%09/evil.example`, `/\evil`, `\/evil`, `//evil`, `https://evil` and `javascript:` all fall back to `/`.
 */
export const HOME_PATH = "/";

/** C0 controls and DEL: never part of a link we write, and CR/LF would break a Location header. */
const CONTROL_CHARACTERS = /[\u0000-\u001f\u007f]/;

/**
 * The same-origin path (with query and hash) that `raw` leads to, or "/" when it leads anywhere else or is malformed.
 * `origin` is this site's origin; absolute URLs on it are accepted and reduced to their path.
 */
export function safeReturnPath(raw: unknown, origin: string): string {
  if (typeof raw !== "string" || raw === "" || raw.length > 2048 || CONTROL_CHARACTERS.test(raw)) return HOME_PATH;
  let base: URL;
  let target: URL;
  try {
    base = new URL(origin);
    target = new URL(raw, base);
  } catch {
    return HOME_PATH;
  }
  if (target.origin !== base.origin) return HOME_PATH;
  const path = `${target.pathname}${target.search}${target.hash}`;
  // "/.//evil" resolves to the path "//evil", which a browser would again read as another host.
  if (!path.startsWith("/") || path.startsWith("//")) return HOME_PATH;
  return path;
}
