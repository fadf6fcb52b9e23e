/**
 * Linear stability and type of an equilibrium from its Jacobian J (n×n, row-major, finite).
 *
 * Eigenvalue tests use tol = PLANAR_TOL·scale (common practice): Re λ < −tol stable, Re λ > tol
 * unstable, otherwise on the imaginary axis; |λ| ≤ tol counts as a zero eigenvalue. The scale is
 * the size of the spectrum, max |λ|, and at least ROUNDING_SHARE·‖J‖∞ (what rounding can leave of a
 * zero eigenvalue): both stay the same when a state changes its unit (J → DJD⁻¹, D diagonal), and
 * scale with J when time does, so the type does not depend on the units. (‖J‖∞ alone does: a
 * concentration in mol/L beside a pressure in Pa gives entries 1e6 apart and a norm far above the
 * eigenvalues.)
 *
 * Type words:
 *   n = 1: 'stable' (f' < 0), 'unstable' (f' > 0), 'degenerate' (f' ≈ 0).
 *   n = 2: trace/determinant rules of `classifyPlanar`; a focus also gets its rotation sense.
 *   n > 2: 'degenerate' (a zero eigenvalue), 'centre-type' (eigenvalues on the imaginary axis and
 *          none unstable), otherwise "saddle (2 stable, 1 unstable; 1 complex pair)",
 *          "stable (3 stable; 1 complex pair)" or "unstable (…)"; imaginary-axis eigenvalues of an
 *          unstable equilibrium are added as "k on the imaginary axis".
 * Saddles (any n) carry their real eigenvector directions, unit length, largest component positive.
 */
import { eigenDecomposition, eigenvalues as computeEigenvalues } from '../linalg/eig.js';
import type { Eigenvalue, Equilibrium } from '../types.js';
import { classifyPlanar, PLANAR_TOL } from './classifyPlanar.js';

function matrixNormInf(J: Float64Array, n: number): number {
  let m = 0;
  for (let i = 0; i < n; i++) {
    let s = 0;
    for (let j = 0; j < n; j++) s += Math.abs(J[i * n + j]!);
    m = Math.max(m, s);
  }
  return m;
}

/** Rounding floor of the eigenvalue scale, relative to ‖J‖∞ (PLANAR_TOL times it is a few units of rounding). */
const ROUNDING_SHARE = 1e-6;

function plural(k: number, word: string): string {
  return `${k} ${word}${k === 1 ? '' : 's'}`;
}

function describeHigher(values: Eigenvalue[], tol: number): string {
  let stable = 0;
  let unstable = 0;
  let axis = 0;
  let pairs = 0;
  for (const v of values) {
    if (Math.hypot(v.re, v.im) <= tol) return 'degenerate';
    if (v.re < -tol) stable++;
    else if (v.re > tol) unstable++;
    else axis++;
    if (v.im > tol) pairs++;
  }
  if (unstable === 0 && axis > 0) return 'centre-type';
  const parts: string[] = [];
  if (stable > 0) parts.push(`${stable} stable`);
  if (unstable > 0) parts.push(`${unstable} unstable`);
  if (axis > 0) parts.push(`${axis} on the imaginary axis`);
  const counts = parts.join(', ') + (pairs > 0 ? `; ${plural(pairs, 'complex pair')}` : '');
  const head = unstable === 0 ? 'stable' : stable > 0 ? 'saddle' : 'unstable';
  return `${head} (${counts})`;
}

/** Unit length, largest-magnitude component positive. */
function normaliseDirection(v: Float64Array): Float64Array {
  let norm = 0;
  let big = 0;
  for (let i = 0; i < v.length; i++) {
    norm += v[i]! * v[i]!;
    if (Math.abs(v[i]!) > Math.abs(v[big]!)) big = i;
  }
  const s = (v[big]! < 0 ? -1 : 1) / Math.sqrt(norm);
  return v.map((c) => c * s);
}

/** Real eigenvector directions of the stable and unstable real eigenvalues, in eigenvalue order. */
function saddleDirections(J: Float64Array, n: number, tol: number): { stable: Float64Array[]; unstable: Float64Array[] } {
  const { values, vectors } = eigenDecomposition(J, n);
  const stable: { re: number; v: Float64Array }[] = [];
  const unstable: { re: number; v: Float64Array }[] = [];
  values.forEach((value, j) => {
    if (value.im !== 0) return;
    const v = normaliseDirection(vectors[j]!);
    if (value.re < -tol) stable.push({ re: value.re, v });
    else if (value.re > tol) unstable.push({ re: value.re, v });
  });
  const byRe = (a: { re: number }, b: { re: number }): number => b.re - a.re;
  return { stable: stable.sort(byRe).map((d) => d.v), unstable: unstable.sort(byRe).map((d) => d.v) };
}

export function classifyEquilibrium(
  J: Float64Array,
  n: number,
  state: Float64Array,
  residual: number,
  iterations: number,
): Equilibrium {
  const values = computeEigenvalues(J, n);
  const radius = values.reduce((r, v) => Math.max(r, Math.hypot(v.re, v.im)), 0);
  const scale = Math.max(radius, ROUNDING_SHARE * matrixNormInf(J, n));
  const tol = PLANAR_TOL * scale;
  const unstableDimension = values.filter((v) => v.re > tol).length;
  const stable = values.every((v) => v.re < -tol);
  let type: string;
  if (n === 1) {
    const d = J[0]!;
    type = Math.abs(d) <= tol ? 'degenerate' : d < 0 ? 'stable' : 'unstable';
  } else if (n === 2) {
    type = classifyPlanar(J[0]! + J[3]!, J[0]! * J[3]! - J[1]! * J[2]!, scale);
  } else {
    type = describeHigher(values, tol);
  }
  const eq: Equilibrium = { state, residual, iterations, eigenvalues: values, stable, unstableDimension, type };
  if (type.endsWith('focus')) {
    // Focus: τ² < 4Δ ⇔ (J11 − J22)² < −4·J12·J21, so J12 and J21 have opposite signs and J21 ≠ 0.
    // Angular velocity θ' = (x1·x2' − x2·x1')/r²; on the ray (r, 0) this is x1·(J21·x1)/r² = J21.
    // A focus has no real eigendirection, so θ' never changes sign: J21 > 0 ⇒ counterclockwise.
    eq.rotation = J[2]! > 0 ? 'counterclockwise' : 'clockwise';
  }
  if (type.startsWith('saddle')) {
    const d = saddleDirections(J, n, tol);
    eq.stableDirections = d.stable;
    eq.unstableDirections = d.unstable;
  }
  return eq;
}
