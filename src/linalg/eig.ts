/**
 * Eigenvalues of a dense real matrix. Refuses non-finite input: the underlying QR iteration
 * would never return on NaN or Infinity.
 */
import { EigenvalueDecomposition, Matrix } from 'ml-matrix';
import type { Eigenvalue } from '../types.js';

export class NonFiniteMatrixError extends Error {}

export function assertFiniteMatrix(a: Float64Array): void {
  for (let i = 0; i < a.length; i++) {
    if (!Number.isFinite(a[i]!)) throw new NonFiniteMatrixError(`matrix entry ${i} is ${a[i]}`);
  }
}

function toMatrix(a: Float64Array, n: number): Matrix {
  const m = new Matrix(n, n);
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) m.set(i, j, a[i * n + j]!);
  return m;
}

/** Eigenvalues of the n×n row-major matrix, sorted by decreasing real part. */
export function eigenvalues(a: Float64Array, n: number): Eigenvalue[] {
  assertFiniteMatrix(a.subarray(0, n * n));
  if (n === 0) return [];
  const e = new EigenvalueDecomposition(toMatrix(a, n), { assumeSymmetric: false });
  const re = e.realEigenvalues;
  const im = e.imaginaryEigenvalues;
  const out: Eigenvalue[] = re.map((r, i) => ({ re: r, im: im[i]! }));
  return out.sort((x, y) => y.re - x.re || y.im - x.im);
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
