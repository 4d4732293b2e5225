import erfc from "@stdlib/math-base-special-erfc";

const INV_SQRT_2PI = 1 / Math.sqrt(2 * Math.PI);

/** Normalised Gaussian of width sigma (standard deviation), the broadening kernel. */
export function gaussian(x: number, sigma: number): number {
  const u = x / sigma;
  return (INV_SQRT_2PI / sigma) * Math.exp(-0.5 * u * u);
}

/** Occupation of a level at energy e for a Gaussian-broadened step at mu: ½·erfc((e − mu)/(√2·sigma)). */
export function gaussianOccupation(e: number, mu: number, sigma: number): number {
  return 0.5 * erfc((e - mu) / (Math.SQRT2 * sigma));
}
