/** What subscribers are told about a release. */
export const RELEASE_EVENT_KINDS = ["release.published", "release.deprecated", "release.withdrawn"] as const;
export type ReleaseEventKind = (typeof RELEASE_EVENT_KINDS)[number];

export const RELEASE_EVENT_TEXT: Record<ReleaseEventKind, string> = {
  "release.published": "released",
  "release.deprecated": "deprecated",
  "release.withdrawn": "withdrawn",
};
