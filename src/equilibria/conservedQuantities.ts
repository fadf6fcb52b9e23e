/**
 * Linear conserved quantities: weights w with wᵀ f(x) the same at every state, so that
 * d/dt (wᵀ x) = wᵀ f does not depend on the state. Closed populations (S + I + R) and mass-action
 * networks (free plus bound enzyme) have them. Then every Jacobian is singular (wᵀ J = 0), and
 *   - if wᵀ f = 0 the equilibria are not isolated: they come in families along which wᵀ x changes,
 *     so Newton has no unique answer and a branch cannot be followed;
 *   - otherwise wᵀ x drifts at a constant rate and there is no equilibrium at all.
 * The remedy is the same in the model: replace one state by the conserved total minus the others.
 *
 * Found numerically: a Jacobian whose LU factorisation is clearly regular settles that there is none;
 * otherwise the common left null space of the Jacobian at a few spread-out states (the
 * right singular vectors of the stacked, scaled Jᵀ blocks with negligible singular values), each
 * candidate kept only if wᵀ J cancels to rounding in every column at every sample (a test that does
 * not depend on the units of states or equations), then brought to reduced row echelon form so that
 * the weights come out as small whole numbers where they are.
 */
import { Matrix, SingularValueDecomposition } from 'ml-matrix';
import type { CompiledSystem } from '../compile/compileModel.js';
import { luFactor } from '../linalg/lu.js';
import { allFinite } from '../linalg/norm.js';
import { boxAround, startPoints } from './startPoints.js';

export interface ConservedQuantity {
  /** The weights w: whole numbers where they are fractions with small denominators, else with the first nonzero weight 1. */
  weights: Float64Array;
  /** wᵀ f, the same at every state: 0 for a conserved quantity, otherwise the drift rate (no equilibrium). */
  rate: number;
}

/** States where the Jacobian is sampled (half at each scale), and how many of them must give finite values. */
const SAMPLES = 6;
const LEAST_SAMPLES = 2;
/** Smallest LU pivot against the largest above which a Jacobian is taken as regular. Common practice. */
const PIVOT_RATIO = 1e-8;
/** Singular values below this fraction of the largest are candidates (each then verified). */
const CANDIDATE = 1e-6;
/** |Σ w_i J_ij| at most this fraction of Σ |w_i J_ij|: cancellation to rounding. Common practice. */
const CANCELLATION = 1e-9;
/** Largest denominator tried when writing the weights as fractions. */
const DENOMINATOR = 12;

export function conservedQuantities(system: CompiledSystem, params: Float64Array, guess: Float64Array): ConservedQuantity[] {
  const n = system.n;
  const jacobians: Float64Array[] = [];
  const residuals: Float64Array[] = [];
  // Samples at two scales: within half the start guess of it (the states' own sizes), and within a
  // box of at least 1 around it (states that start at 0). A sum that only nearly cancels, where large
  // terms swamp a small one at states far beyond their sizes, fails at the first kind.
  const boxes = [boxAround(guess, 0.5, 0), boxAround(guess, 1, 1)];
  for (const box of boxes) {
    let taken = 0;
    for (const x of startPoints(box, 3 * SAMPLES, 1)) {
      const jac = new Float64Array(n * n);
      const f = new Float64Array(n);
      system.jacobian(x, params, jac);
      system.rhs(x, params, f);
      if (!allFinite(jac) || !allFinite(f)) continue;
      jacobians.push(jac);
      residuals.push(f);
      if (++taken === SAMPLES / boxes.length) break;
    }
  }
  if (jacobians.length < LEAST_SAMPLES || clearlyRegular(jacobians[0]!, n)) return [];
  const stacked = new Matrix(n * jacobians.length, n);
  jacobians.forEach((jac, k) => {
    const scale = Math.max(...jac.map(Math.abs)) || 1;
    for (let j = 0; j < n; j++) for (let i = 0; i < n; i++) stacked.set(k * n + j, i, jac[i * n + j]! / scale);
  });
  const svd = new SingularValueDecomposition(stacked, { computeLeftSingularVectors: false, autoTranspose: true });
  const sigma = svd.diagonal;
  const largest = Math.max(...sigma);
  const v = svd.rightSingularVectors;
  const kept: Float64Array[] = [];
  sigma.forEach((s, c) => {
    if (!(s <= CANDIDATE * largest)) return;
    const w = Float64Array.from({ length: n }, (_, i) => v.get(i, c));
    if (jacobians.every((jac) => cancels(w, jac, n))) kept.push(w);
  });
  return echelon(kept).map((w) => {
    const weights = wholeNumbers(w);
    return { weights, rate: commonRate(weights, residuals) };
  });
}

/**
 * A Jacobian whose LU pivots are all within PIVOT_RATIO of the largest is regular, so no weighted
 * sum is conserved: the usual case, settled at the cost of one factorisation instead of a singular
 * value decomposition of all samples (a conserved sum leaves a last pivot at rounding level).
 */
function clearlyRegular(jac: Float64Array, n: number): boolean {
  const { lu, singular } = luFactor(jac, n);
  if (singular) return false;
  let smallest = Infinity;
  let largest = 0;
  for (let k = 0; k < n; k++) {
    const d = Math.abs(lu[k * n + k]!);
    smallest = Math.min(smallest, d);
    largest = Math.max(largest, d);
  }
  return smallest > PIVOT_RATIO * largest;
}

/** Whether wᵀ J vanishes to rounding in every column. */
function cancels(w: Float64Array, jac: Float64Array, n: number): boolean {
  for (let j = 0; j < n; j++) {
    let sum = 0;
    let size = 0;
    for (let i = 0; i < n; i++) {
      const term = w[i]! * jac[i * n + j]!;
      sum += term;
      size += Math.abs(term);
    }
    if (Math.abs(sum) > CANCELLATION * size) return false;
  }
  return true;
}

/** Reduced row echelon form of the rows (partial pivoting); rows that vanish are dropped. */
function echelon(rows: readonly Float64Array[]): Float64Array[] {
  const a = rows.map((r) => Float64Array.from(r));
  const n = a[0]?.length ?? 0;
  let top = 0;
  for (let col = 0; col < n && top < a.length; col++) {
    let pivot = top;
    for (let r = top + 1; r < a.length; r++) if (Math.abs(a[r]![col]!) > Math.abs(a[pivot]![col]!)) pivot = r;
    if (Math.abs(a[pivot]![col]!) < 1e-9) continue;
    [a[top], a[pivot]] = [a[pivot]!, a[top]!];
    const row = a[top]!;
    const p = row[col]!;
    for (let j = 0; j < n; j++) row[j]! /= p;
    for (let r = 0; r < a.length; r++) {
      if (r === top) continue;
      const factor = a[r]![col]!;
      if (factor !== 0) for (let j = 0; j < n; j++) a[r]![j]! -= factor * row[j]!;
    }
    top++;
  }
  return a.slice(0, top);
}

/** An echelon row (leading weight 1) scaled to whole numbers when each weight is a fraction with a small denominator. */
function wholeNumbers(row: Float64Array): Float64Array {
  const largest = Math.max(...row.map(Math.abs));
  const w = row.map((x) => (Math.abs(x) < 1e-12 * largest ? 0 : x));
  let multiple = 1;
  for (const x of w) {
    const q = denominator(x * multiple);
    if (q === undefined) return w;
    multiple *= q;
  }
  return multiple > DENOMINATOR ** 2 ? w : w.map((x) => Math.round(x * multiple));
}

function denominator(x: number): number | undefined {
  for (let q = 1; q <= DENOMINATOR; q++) if (Math.abs(x * q - Math.round(x * q)) <= 1e-9 * q) return q;
  return undefined;
}

/** wᵀ f at the samples (the same at each, as wᵀ J = 0): 0 when it cancels to rounding there. */
function commonRate(w: Float64Array, residuals: readonly Float64Array[]): number {
  const f = residuals[0]!;
  let sum = 0;
  let size = 0;
  for (let i = 0; i < w.length; i++) {
    sum += w[i]! * f[i]!;
    size += Math.abs(w[i]! * f[i]!);
  }
  return Math.abs(sum) <= CANCELLATION * size ? 0 : sum;
}

/** The weighted sum in words: `S + I + R`, `E + ES`, `2*A - B`. */
export function weightedSum(names: readonly string[], w: Float64Array): string {
  const terms: string[] = [];
  w.forEach((c, i) => {
    if (c === 0) return;
    const size = Math.abs(c);
    const factor = size === 1 ? '' : `${Number(size.toPrecision(6))}*`;
    const sign = c < 0 ? '-' : '+';
    terms.push(terms.length === 0 ? `${c < 0 ? '-' : ''}${factor}${names[i]}` : `${sign} ${factor}${names[i]}`);
  });
  return terms.join(' ');
}
