import { seededUniform } from "./seeded-uniform";

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

export function randomKPoints(dimension: number, count: number, seed: number): number[][] {
  const next = seededUniform(seed);
  return Array.from({ length: count }, () => Array.from({ length: dimension }, () => next() - 0.5));
}
