import type { LevelList } from "./constants";

/** ΔE = proposed − base per k and band on one shared set of k-points (e.g. the agreed path). */
export interface BandDifference {
  delta: Float64Array[];
  /** max_n |ΔE_n(k)| per k: the sparkline of a proposal card. */
  maxAbsPerK: Float64Array;
  maxAbsPerBand: Float64Array;
  maxAbs: number;
  /** Bands compared (the smaller band count when the basis changed). */
  bandCount: number;
  bandCountChanged: boolean;
}

export function compareBandSets(base: LevelList[], proposed: LevelList[]): BandDifference {
  if (base.length !== proposed.length) throw new Error("compare: both band sets need the same k-points");
  const nb = base.length > 0 ? base[0].length : 0;
  const np = proposed.length > 0 ? proposed[0].length : 0;
  const bandCount = Math.min(nb, np);
  const maxAbsPerK = new Float64Array(base.length);
  const maxAbsPerBand = new Float64Array(bandCount);
  let maxAbs = 0;
  const delta = base.map((levels, k) => {
    const row = new Float64Array(bandCount);
    for (let n = 0; n < bandCount; n++) {
      row[n] = proposed[k][n] - levels[n];
      const a = Math.abs(row[n]);
      if (a > maxAbsPerK[k]) maxAbsPerK[k] = a;
      if (a > maxAbsPerBand[n]) maxAbsPerBand[n] = a;
      if (a > maxAbs) maxAbs = a;
    }
    return row;
  });
  return { delta, maxAbsPerK, maxAbsPerBand, maxAbs, bandCount, bandCountChanged: nb !== np };
}
