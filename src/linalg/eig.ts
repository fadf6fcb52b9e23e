/**
 * Eigenvalues of a dense real matrix. Refuses non-finite input: a QR iteration never returns on
 * NaN or Infinity (ml-matrix's would hang; ours would hit its cap with garbage).
 *
 * `eigenvalues` is the fast path used at every continuation point: balancing (Parlett & Reinsch
 * 1969), Householder reduction to Hessenberg form (Golub & Van Loan, 4th ed., Alg. 7.4.2) and the
 * Francis double-shift QR iteration without accumulated vectors (EISPACK `hqr`; Golub & Van Loan
 * Alg. 7.5.2), all on Float64Array. `eigenDecomposition` (ml-matrix) also returns eigenvectors;
 * it is meant for small matrices.
 */
import { EigenvalueDecomposition, Matrix } from 'ml-matrix';
import type { Eigenvalue } from '../types.js';
import { balanceInPlace } from './balance.js';
import { hessenbergInPlace } from './hessenberg.js';
import { hessenbergQr } from './hessenbergQr.js';

export class NonFiniteMatrixError extends Error {}

export function assertFiniteMatrix(a: Float64Array): void {
  for (let i = 0; i < a.length; i++) {
    if (!Number.isFinite(a[i]!)) throw new NonFiniteMatrixError(`matrix entry ${i} is ${a[i]}`);
  }
}

export interface EigenvalueResult {
  /** Sorted by decreasing real part, ties by decreasing imaginary part; complex pairs exactly conjugate. */
  values: Eigenvalue[];
  /** False when the QR iteration hit its cap; then some values are only diagonal estimates. */
  converged: boolean;
  /** Double-shift QR sweeps used. */
  sweeps: number;
}

/** Decreasing real part, then decreasing imaginary part. */
export function compareEigenvalues(x: Eigenvalue, y: Eigenvalue): number {
  return y.re - x.re || y.im - x.im;
}

/** Eigenvalues of the n×n row-major matrix `a` (not modified), with convergence diagnostics. */
export function eigenvaluesWithDiagnostics(a: Float64Array, n: number): EigenvalueResult {
  const m = a.slice(0, n * n);
  assertFiniteMatrix(m);
  if (n === 0) return { values: [], converged: true, sweeps: 0 };
  balanceInPlace(m, n);
  hessenbergInPlace(m, n);
  const { re, im, converged, sweeps } = hessenbergQr(m, n);
  const values: Eigenvalue[] = [];
  for (let i = 0; i < n; i++) values.push({ re: re[i]!, im: im[i]! });
  values.sort(compareEigenvalues);
  return { values, converged, sweeps };
}

/** Eigenvalues of the n×n row-major matrix, sorted by decreasing real part (see `eigenvaluesWithDiagnostics`). */
export function eigenvalues(a: Float64Array, n: number): Eigenvalue[] {
  return eigenvaluesWithDiagnostics(a, n).values;
}

function toMatrix(a: Float64Array, n: number): Matrix {
  const m = new Matrix(n, n);
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) m.set(i, j, a[i * n + j]!);
  return m;
}

/** Eigenvalues and right eigenvectors (columns; complex pairs stored as in ml-matrix: re, im columns). */
export function eigenDecomposition(a: Float64Array, n: number): { values: Eigenvalue[]; vectors: Float64Array[] } {
  assertFiniteMatrix(a.subarray(0, n * n));
  const e = new EigenvalueDecomposition(toMatrix(a, n), { assumeSymmetric: false });
  const re = e.realEigenvalues;
  const im = e.imaginaryEigenvalues;
  const v = e.eigenvectorMatrix;
  const values = re.map((r, i) => ({ re: r, im: im[i]! }));
  const vectors: Float64Array[] = [];
  for (let j = 0; j < n; j++) vectors.push(Float64Array.from(v.getColumn(j)));
  return { values, vectors };
}
