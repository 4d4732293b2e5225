/**
 * Monkhorst–Pack mesh (Monkhorst & Pack, Phys. Rev. B 13, 5188 (1976), Eq. 3):
 * k_r = (2r − q − 1) / (2q), r = 1…q along each reciprocal vector. Every point keeps
 * weight 1/N: no symmetry reduction, so the mesh is valid for any model.
 */
export interface KMesh {
  kFrac: number[][];
  weights: Float64Array;
}

export interface MeshOptions {
  /** Shift the mesh so that it contains Γ (every q). Default false (the plain MP mesh). */
  gammaCentred?: boolean;
}

export function monkhorstPackMesh(divisions: number[], opts: MeshOptions = {}): KMesh {
  if (divisions.length < 1 || divisions.length > 3) throw new Error("mesh: 1 to 3 divisions expected");
  for (const q of divisions) {
    if (!Number.isInteger(q) || q < 1) throw new Error(`mesh: division ${q} is not a positive integer`);
  }
  const axes = divisions.map((q) =>
    Array.from({ length: q }, (_, i) => (opts.gammaCentred ? i / q : (2 * (i + 1) - q - 1) / (2 * q))),
  );
  let kFrac: number[][] = [[]];
  for (const axis of axes) kFrac = kFrac.flatMap((k) => axis.map((x) => [...k, x]));
  const weights = new Float64Array(kFrac.length).fill(1 / kFrac.length);
  return { kFrac, weights };
}
