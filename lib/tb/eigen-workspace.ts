/** Scratch buffers for the Hermitian eigen-solver, sized once so repeated solves never allocate. */
export interface EigenWorkspace {
  readonly n: number;
}

export class HermitianScratch implements EigenWorkspace {
  readonly n: number;
  /** Diagonal of the real tridiagonal matrix; eigenvalues after QL. */
  readonly diag: Float64Array;
  /** off[i] couples rows i and i+1 of the tridiagonal matrix (off[n-1] is spare). */
  readonly off: Float64Array;
  /** Householder scalar h of the reflector that reduced row i (0: no reflector). */
  readonly reflectorNorm: Float64Array;
  /** Diagonal unitary phase that makes the tridiagonal matrix real. */
  readonly phaseRe: Float64Array;
  readonly phaseIm: Float64Array;
  /** Two pairs of length-n vectors that alternate between the owed rank-2 update vector q and the next
   *  matrix–vector product p of the reduction; afterwards scratch for the tridiagonal eigenvector solvers. */
  readonly tmpRe: Float64Array;
  readonly tmpIm: Float64Array;
  readonly tmp2Re: Float64Array;
  readonly tmp2Im: Float64Array;
  /** Eigenvectors, one per row (keeps QL rotations and reflector applications on contiguous memory). */
  readonly vectorsRe: Float64Array;
  readonly vectorsIm: Float64Array;
  /** Cosines and sines of one QL sweep, applied to the eigenvectors after the sweep. */
  readonly rotCos: Float64Array;
  readonly rotSin: Float64Array;
  readonly order: Int32Array;
  /** Tridiagonal LU factors and iterate of inverse iteration. */
  readonly solver: {
    readonly u0: Float64Array; readonly u1: Float64Array; readonly u2: Float64Array;
    readonly mult: Float64Array; readonly x: Float64Array; readonly swap: Float64Array;
  };

  constructor(n: number) {
    assertSize(n);
    this.n = n;
    this.diag = new Float64Array(n);
    this.off = new Float64Array(n);
    this.reflectorNorm = new Float64Array(n);
    this.phaseRe = new Float64Array(n);
    this.phaseIm = new Float64Array(n);
    this.tmpRe = new Float64Array(n);
    this.tmpIm = new Float64Array(n);
    this.tmp2Re = new Float64Array(n);
    this.tmp2Im = new Float64Array(n);
    this.vectorsRe = new Float64Array(n * n);
    this.vectorsIm = new Float64Array(n * n);
    this.rotCos = new Float64Array(n);
    this.rotSin = new Float64Array(n);
    this.order = new Int32Array(n);
    this.solver = {
      u0: new Float64Array(n), u1: new Float64Array(n), u2: new Float64Array(n),
      mult: new Float64Array(n), x: new Float64Array(n), swap: new Float64Array(n),
    };
  }
}

export function assertSize(n: number): void {
  if (!Number.isInteger(n) || n < 0) throw new Error(`eigen: matrix order must be a non-negative integer, got ${n}`);
}

export function createEigenWorkspace(n: number): EigenWorkspace {
  return new HermitianScratch(n);
}

export function scratchFor(n: number, ws: EigenWorkspace | undefined): HermitianScratch {
  if (ws === undefined) return new HermitianScratch(n);
  if (!(ws instanceof HermitianScratch)) throw new Error("eigen: workspace must come from createEigenWorkspace");
  if (ws.n !== n) throw new Error(`eigen: workspace is for n = ${ws.n}, matrix has n = ${n}`);
  return ws;
}
