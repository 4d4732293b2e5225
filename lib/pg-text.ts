import type { z } from "zod";

/**
 * PostgreSQL text and jsonb cannot hold U+0000, so text that is stored must not contain it: refused as bad input
 * (400) at the edge instead of failing in the database (500).
 */
export const NUL_MESSAGE = "Text must not contain the NUL character (U+0000).";

export function hasNul(text: string): boolean {
  return text.includes("\u0000");
}

/** The shared refinement for zod string schemas: `withoutNul(z.string().trim().max(200))`. */
export function withoutNul<S extends z.ZodString>(schema: S): S {
  return schema.refine((text) => !hasNul(text), { error: NUL_MESSAGE });
}

/** The path ("a.b.0") of the first string or key holding NUL anywhere in a parsed JSON value, or null. */
export function findNul(value: unknown, path: readonly (string | number)[] = []): string | null {
  if (typeof value === "string") return hasNul(value) ? path.join(".") || "_form" : null;
  if (Array.isArray(value)) {
    for (const [i, item] of value.entries()) {
      const hit = findNul(item, [...path, i]);
      if (hit !== null) return hit;
    }
    return null;
  }
  if (value !== null && typeof value === "object") {
    for (const [key, item] of Object.entries(value)) {
      if (hasNul(key)) return [...path, key.replaceAll("\u0000", "\\u0000")].join(".");
      const hit = findNul(item, [...path, key]);
      if (hit !== null) return hit;
    }
  }
  return null;
}
