/** A release's entity tag is its sha256, quoted (a strong validator: the bytes never change). */
export function releaseEtag(sha256: string): string {
  return `"${sha256}"`;
}

/**
 * Whether an If-None-Match header matches the entity tag (RFC 9110 §13.1.2: weak comparison, so W/ prefixes are
 * ignored; "*" matches any current representation; a list is comma-separated).
 */
export function ifNoneMatchHits(header: string | null, etag: string): boolean {
  if (!header) return false;
  const bare = (t: string) => t.trim().replace(/^W\//, "");
  const target = bare(etag);
  return header.split(",").some((part) => {
    const tag = part.trim();
    return tag === "*" || bare(tag) === target;
  });
}
