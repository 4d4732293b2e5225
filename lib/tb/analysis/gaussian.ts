const INV_SQRT_2PI = 1 / Math.sqrt(2 * Math.PI);

/** Normalised Gaussian of width sigma (standard deviation), the broadening kernel. */
export function gaussian(x: number, sigma: number): number {
  const u = x / sigma;
  return (INV_SQRT_2PI / sigma) * Math.exp(-0.5 * u * u);
}

/**
 * Complementary error function, fractional error below 1.2e-7 everywhere
 * (Press et al., Numerical Recipes, 2nd ed. (1992), §6.2, erfcc: Chebyshev fit).
 */
export function erfc(x: number): number {
  const z = Math.abs(x);
  const t = 1 / (1 + 0.5 * z);
  const poly =
    -z * z - 1.26551223 +
    t * (1.00002368 + t * (0.37409196 + t * (0.09678418 + t * (-0.18628806 +
    t * (0.27886807 + t * (-1.13520398 + t * (1.48851587 + t * (-0.82215223 + t * 0.17087277))))))));
  const r = t * Math.exp(poly);
  return x >= 0 ? r : 2 - r;
}

/** Occupation of a level at energy e for a Gaussian-broadened step at mu: ½·erfc((e − mu)/(√2·sigma)). */
export function gaussianOccupation(e: number, mu: number, sigma: number): number {
  return 0.5 * erfc((e - mu) / (Math.SQRT2 * sigma));
}
