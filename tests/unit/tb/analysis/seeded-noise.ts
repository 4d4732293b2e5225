import { seededUniform } from "@/lib/tb/analysis/seeded-uniform";

/** Deterministic noise for synthetic references: the engine's seeded uniform generator + Box–Muller transform (Box & Muller, Ann. Math. Stat. 29, 610 (1958)). */
export function seededNormal(seed: number): () => number {
  const uniform = seededUniform(seed);
  return () => Math.sqrt(-2 * Math.log(1 - uniform())) * Math.cos(2 * Math.PI * uniform());
}
