/** Analytic band models used by the analysis tests (no engine core needed). */
const TWO_PI = 2 * Math.PI;

/** One s orbital per site, nearest-neighbour hopping t: E = ε + 2t·cos(2πk) (any solid-state text, e.g.
 * Ashcroft & Mermin, Solid State Physics (1976), ch. 10). */
export function chainBand(eps: number, t: number) {
  return (k: number[]) => Float64Array.of(eps + 2 * t * Math.cos(TWO_PI * k[0]));
}

/** Square lattice, one orbital: E = ε + 2t(cos 2πk₁ + cos 2πk₂) (same source). */
export function squareBand(eps: number, t: number) {
  return (k: number[]) => Float64Array.of(eps + 2 * t * (Math.cos(TWO_PI * k[0]) + Math.cos(TWO_PI * k[1])));
}

/** Dimerised chain, bands ±|v + w·e^{i2πk}| (Su, Schrieffer & Heeger, Phys. Rev. Lett. 42, 1698 (1979)):
 * direct gap 2|v − w| at k = ½. */
export function dimerChainBands(v: number, w: number) {
  return (k: number[]) => {
    const e = Math.sqrt(v * v + w * w + 2 * v * w * Math.cos(TWO_PI * k[0]));
    return Float64Array.of(-e, e);
  };
}

/** Uniform 1D sampling k = 0 … 1 − 1/n (or including 1 with closed = true). */
export function lineSamples(n: number, closed = false): number[][] {
  const count = closed ? n + 1 : n;
  return Array.from({ length: count }, (_, i) => [i / n]);
}
