import { createEigenWorkspace, eigHermitian, eigvalsHermitian, type EigenWorkspace } from "../eigen";

/**
 * First-order level shifts dE_n = ⟨ψ_n|D|ψ_n⟩ for a perturbation D (Hellmann–Feynman theorem: Feynman, Phys. Rev. 56,
 * 340 (1939)). Inside a degenerate cluster (levels closer than `tol`) the shifts are the eigenvalues of the cluster
 * block ⟨ψ_i|D|ψ_j⟩ (degenerate perturbation theory), assigned in ascending order: that is the derivative of the
 * ascending bands for an increasing parameter (the one-sided derivative; the two sides differ at a crossing).
 * Only the Hermitian part of D counts, so a non-Hermitian D (e.g. one of two tied mirror keys) gives half the tied change.
 */
export class LevelShiftSolver {
  private readonly n: number;
  private readonly vRe: Float64Array;
  private readonly vIm: Float64Array;
  private readonly values: Float64Array;
  private readonly ws: EigenWorkspace;

  constructor(n: number, private readonly tol = 1e-6) {
    this.n = n;
    this.vRe = new Float64Array(n * n);
    this.vIm = new Float64Array(n * n);
    this.values = new Float64Array(n);
    this.ws = createEigenWorkspace(n);
  }

  /** Diagonalises H (re/im are overwritten) and returns its eigenvalues (a copy). */
  diagonalise(re: Float64Array, im: Float64Array): Float64Array {
    eigHermitian(this.n, re, im, this.values, this.vRe, this.vIm, this.ws);
    return Float64Array.from(this.values);
  }

  /** ⟨ψ_i|D|ψ_j⟩ for the last diagonalised H. */
  private element(dRe: Float64Array, dIm: Float64Array, i: number, j: number): [number, number] {
    const n = this.n, vRe = this.vRe, vIm = this.vIm;
    let sRe = 0, sIm = 0;
    for (let r = 0; r < n; r++) {
      let wRe = 0, wIm = 0;
      for (let c = 0; c < n; c++) {
        const a = dRe[r * n + c], b = dIm[r * n + c];
        if (a === 0 && b === 0) continue;
        const xr = vRe[c * n + j], xi = vIm[c * n + j];
        wRe += a * xr - b * xi;
        wIm += a * xi + b * xr;
      }
      const ur = vRe[r * n + i], ui = -vIm[r * n + i];
      sRe += ur * wRe - ui * wIm;
      sIm += ur * wIm + ui * wRe;
    }
    return [sRe, sIm];
  }

  /** Writes dE_n for every band n into out[n * stride + offset]. */
  levelShifts(dRe: Float64Array, dIm: Float64Array, out: Float64Array, stride = 1, offset = 0): void {
    const n = this.n, e = this.values;
    for (let a = 0; a < n; ) {
      let b = a + 1;
      while (b < n && e[b] - e[b - 1] < this.tol) b++;
      const m = b - a;
      if (m === 1) {
        out[a * stride + offset] = this.element(dRe, dIm, a, a)[0];
      } else {
        const mRe = new Float64Array(m * m), mIm = new Float64Array(m * m);
        for (let i = 0; i < m; i++) {
          for (let j = i; j < m; j++) {
            const [xr, xi] = this.element(dRe, dIm, a + i, a + j);
            const [yr, yi] = i === j ? [xr, xi] : this.element(dRe, dIm, a + j, a + i);
            mRe[i * m + j] = mRe[j * m + i] = 0.5 * (xr + yr);
            mIm[i * m + j] = 0.5 * (xi - yi);
            mIm[j * m + i] = -mIm[i * m + j];
          }
        }
        const mu = new Float64Array(m);
        eigvalsHermitian(m, mRe, mIm, mu);
        for (let i = 0; i < m; i++) out[(a + i) * stride + offset] = mu[i];
      }
      a = b;
    }
  }
}
