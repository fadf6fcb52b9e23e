/**
 * Right and left null vectors of A − λI for a simple critical eigenvalue λ of a real matrix A
 * (λ = 0 at a fold, λ ≈ iω at a Hopf point), by inverse iteration with both vectors from one
 * LU factorisation (Golub & Van Loan, Matrix Computations, 4th ed., §7.6.1; Wilkinson 1965: a
 * nearly singular shifted matrix is harmless, the error is amplified along the wanted vector).
 *
 * The complex matrix M = A − λI − δI is factored through its real 2n×2n embedding E; E's
 * transpose is the embedding of M^H, so `luSolveTransposed` gives the left vector:
 *   A q = λ q,   Aᵀ p = λ̄ p   (Kuznetsov 3rd ed. §3.5: Aᵀ p = −iω p at a Hopf point).
 * The tiny shift δ = 1e-10 · (1 + ‖A‖∞) (common practice) keeps an exactly singular M from a zero
 * pivot; the convergence factor per iteration is about δ / (distance to the next eigenvalue).
 *
 * Normalisation (so results are reproducible): ‖q‖₂ = 1 with its largest-modulus component real
 * and positive (the first such component on ties); p scaled so ⟨p, q⟩ = p̄ᵀq = 1.
 */
import { luFactor, luSolve, luSolveTransposed } from '../linalg/lu.js';
import type { Eigenvalue } from '../types.js';
import { type ComplexVector, embedComplex, innerProduct, scaleComplex, stack, unstack } from './complexAlgebra.js';

export type VectorStatus = 'converged' | 'max-iter' | 'singular' | 'non-finite';

export interface CriticalVectors {
  q: ComplexVector;
  p: ComplexVector;
  status: VectorStatus;
  /** ‖A q − λ q‖∞ with ‖q‖₂ = 1. */
  residual: number;
  /** ‖Aᵀ p − λ̄ p‖∞ / ‖p‖∞. */
  adjointResidual: number;
  /** |⟨p, q⟩ − 1| after normalisation. */
  normalisationError: number;
  /** Inverse-iteration steps (each one right and one left solve). */
  iterations: number;
}

const SHIFT = 1e-10;
const MAX_ITER = 8;

/** ‖(A − λI) v‖∞ for v = [re; im], or for Aᵀ − λ̄I when `transposed`. */
function eigenResidual(a: Float64Array, n: number, lambda: Eigenvalue, v: ComplexVector, transposed: boolean): number {
  const lamIm = transposed ? -lambda.im : lambda.im;
  let worst = 0;
  for (let i = 0; i < n; i++) {
    let re = -(lambda.re * v.re[i]! - lamIm * v.im[i]!);
    let im = -(lambda.re * v.im[i]! + lamIm * v.re[i]!);
    for (let j = 0; j < n; j++) {
      const aij = transposed ? a[j * n + i]! : a[i * n + j]!;
      re += aij * v.re[j]!;
      im += aij * v.im[j]!;
    }
    worst = Math.max(worst, Math.hypot(re, im));
  }
  return worst;
}

/** Scale to unit 2-norm with the largest-modulus component real positive. */
function normalisePhase(v: ComplexVector): ComplexVector {
  let k = 0;
  let big = -1;
  let norm2 = 0;
  for (let i = 0; i < v.re.length; i++) {
    const m = Math.hypot(v.re[i]!, v.im[i]!);
    norm2 += m * m;
    if (m > big) {
      big = m;
      k = i;
    }
  }
  const norm = Math.sqrt(norm2);
  // Multiply by conj(v_k) / (|v_k| ‖v‖): makes v_k real positive and ‖v‖ = 1.
  return scaleComplex(v, { re: v.re[k]! / (big * norm), im: -v.im[k]! / (big * norm) });
}

function startVector(n: number): ComplexVector {
  const v = { re: new Float64Array(n), im: new Float64Array(n) };
  for (let i = 0; i < n; i++) {
    v.re[i] = Math.cos(1.7 * i + 0.3);
    v.im[i] = Math.sin(2.3 * i + 0.7);
  }
  return v;
}

function isFiniteVector(v: ComplexVector): boolean {
  return v.re.every(Number.isFinite) && v.im.every(Number.isFinite);
}

/** Null vectors of A − λI (A n×n row-major, finite), normalised as in the file comment. */
export function criticalVectors(a: Float64Array, n: number, lambda: Eigenvalue): CriticalVectors {
  let scale = 0;
  for (let i = 0; i < n; i++) {
    let row = 0;
    for (let j = 0; j < n; j++) row += Math.abs(a[i * n + j]!);
    scale = Math.max(scale, row);
  }
  const delta = SHIFT * (1 + scale + Math.hypot(lambda.re, lambda.im));
  const mRe = a.slice(0, n * n);
  const mIm = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    mRe[i * n + i]! -= lambda.re + delta;
    mIm[i * n + i] = -lambda.im;
  }
  const f = luFactor(embedComplex(mRe, mIm, n), 2 * n);
  let q = normalisePhase(startVector(n));
  let p = normalisePhase(startVector(n));
  const fail = (status: VectorStatus, iterations: number): CriticalVectors => ({
    q, p, status, residual: NaN, adjointResidual: NaN, normalisationError: NaN, iterations,
  });
  if (f.singular) return fail('singular', 0);
  const tol = 1e-14 * (1 + scale);
  let residual = Infinity;
  let adjointResidual = Infinity;
  let iterations = 0;
  while (iterations < MAX_ITER) {
    iterations++;
    const qNext = unstack(luSolve(f, stack(q), new Float64Array(2 * n)));
    const pNext = unstack(luSolveTransposed(f, stack(p), new Float64Array(2 * n)));
    if (!isFiniteVector(qNext) || !isFiniteVector(pNext)) return fail('non-finite', iterations);
    q = normalisePhase(qNext);
    p = normalisePhase(pNext);
    const r = eigenResidual(a, n, lambda, q, false);
    const ra = eigenResidual(a, n, lambda, p, true);
    const stalled = r >= 0.5 * residual && ra >= 0.5 * adjointResidual;
    residual = r;
    adjointResidual = ra;
    if ((r <= tol && ra <= tol) || stalled) break;
  }
  const pq = innerProduct(p, q);
  const pqAbs2 = pq.re * pq.re + pq.im * pq.im;
  if (!(pqAbs2 > 0) || !Number.isFinite(pqAbs2)) return fail('singular', iterations);
  // p ← p / conj(⟨p, q⟩), so that ⟨p, q⟩ = 1; 1/conj(c) = c / |c|².
  p = scaleComplex(p, { re: pq.re / pqAbs2, im: pq.im / pqAbs2 });
  const check = innerProduct(p, q);
  let pMax = 0;
  for (let i = 0; i < n; i++) pMax = Math.max(pMax, Math.hypot(p.re[i]!, p.im[i]!));
  return {
    q,
    p,
    status: residual <= tol * 1e4 ? 'converged' : 'max-iter',
    residual,
    adjointResidual: eigenResidual(a, n, lambda, p, true) / pMax,
    normalisationError: Math.hypot(check.re - 1, check.im),
    iterations,
  };
}
