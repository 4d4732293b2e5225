/** Semantic versions MAJOR.MINOR.PATCH (no pre-release or build parts: releases are final). */
export interface Semver {
  major: number;
  minor: number;
  patch: number;
}

export type ChangeLevel = "major" | "minor" | "patch";

const PATTERN = /^(0|[1-9]\d{0,5})\.(0|[1-9]\d{0,5})\.(0|[1-9]\d{0,5})$/;

export function parseSemver(text: string): Semver | null {
  const m = PATTERN.exec(text.trim());
  return m ? { major: Number(m[1]), minor: Number(m[2]), patch: Number(m[3]) } : null;
}

export function formatSemver(v: Semver): string {
  return `${v.major}.${v.minor}.${v.patch}`;
}

export function compareSemver(a: Semver, b: Semver): number {
  return a.major - b.major || a.minor - b.minor || a.patch - b.patch;
}

export function bumpSemver(v: Semver, level: ChangeLevel): Semver {
  if (level === "major") return { major: v.major + 1, minor: 0, patch: 0 };
  if (level === "minor") return { major: v.major, minor: v.minor + 1, patch: 0 };
  return { ...v, patch: v.patch + 1 };
}

/** Newest first; strings that are not versions sort last. */
export function sortVersionsDescending(versions: readonly string[]): string[] {
  return [...versions].sort((x, y) => {
    const a = parseSemver(x), b = parseSemver(y);
    if (!a || !b) return a ? -1 : b ? 1 : 0;
    return compareSemver(b, a);
  });
}
