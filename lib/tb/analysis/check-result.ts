/** One physics check of a document, as shown on a proposal and used by the gate. */
export type CheckStatus = "pass" | "fail" | "warn";

export interface CheckResult {
  id: string;
  title: string;
  status: CheckStatus;
  detail: string;
  /** The number the status was decided on (eV unless the detail says otherwise); null when not measurable. */
  measured: number | null;
}

/** Deterministic uniform numbers in [0, 1) (mulberry32), so checks at "random" k repeat exactly. */
export function seededUniform(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

export function randomKPoints(dimension: number, count: number, seed: number): number[][] {
  const next = seededUniform(seed);
  return Array.from({ length: count }, () => Array.from({ length: dimension }, () => next() - 0.5));
}
