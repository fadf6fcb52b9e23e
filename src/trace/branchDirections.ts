/**
 * Directions of the two branches through a simple branch point z*, from the algebraic branching
 * equation (Allgower & Georg 1990, §8.3; Kuznetsov, 3rd ed., §10.3).
 *
 * At z* the n×(n+1) Jacobian F_z has rank n−1: a two-dimensional null space spanned by the known
 * tangent t and a vector φ ⊥ t, and a left null vector ψ (ψᵀF_z = 0). Tangents of the branches
 * are α t + β φ with
 *   a α² + 2 b αβ + c β² = 0,   a = ψᵀF_zz[t,t],  b = ψᵀF_zz[t,φ],  c = ψᵀF_zz[φ,φ],
 * solvable (two real directions) when b² − ac > 0. φ and (ψ, 0) are the right and left null
 * vectors of [F_z; t₀ᵀ] with t₀ the branch tangent near z*, and t the null vector of [F_z; φᵀ]:
 * an orthonormal basis of null(F_z) even when t₀ is only approximate. Inverse iteration, 3 sweeps.
 * F_zz[u,v] = B(u_x,v_x) + u_λ f_xλ v_x + v_λ f_xλ u_x + u_λ v_λ f_λλ in unscaled pieces
 * (u_x = u/w); f_λλ is a central difference of f_λ (the System gives no such method).
 *
 * Classification: a pitchfork when one of the two branches turns at the point (its tangent has a
 * zero λ-component), a transcritical point otherwise (Kuznetsov, 3rd ed., §10.3).
 */
import { TRACE } from '../defaults.js';
import { luFactor, luSolve, luSolveTransposed } from '../linalg/lu.js';
import type { ExtendedSystem } from './extendedSystem.js';
import { dot } from '../linalg/vector.js';
import type { Workspace } from './workspace.js';

export interface BranchDirections {
  kind: 'transcritical' | 'pitchfork' | 'branch-point';
  /** Unit tangent of the other branch (scaled coordinates); null when there are no two real roots. */
  direction: Float64Array | null;
  /** b² − ac (normalised by a² + b² + c²). */
  discriminant: number;
}


export function branchDirections(
  ext: ExtendedSystem, work: Workspace, z: Float64Array, tApprox: Float64Array,
): BranchDirections {
  const { n, m } = ext;
  const failed: BranchDirections = { kind: 'branch-point', direction: null, discriminant: NaN };
  const left = new Float64Array(m);
  const phi = borderedNullVector(ext, work, z, tApprox, left);
  const t = phi === null ? null : borderedNullVector(ext, work, z, phi, null);
  if (phi === null || t === null) return failed;
  if (dot(t, tApprox) < 0) for (let j = 0; j < m; j++) t[j] = -t[j]!;
  const form = secondForm(ext, z, left.subarray(0, n));
  const qa = form(t, t);
  const qb = form(t, phi);
  const qc = form(phi, phi);
  const norm = qa * qa + qb * qb + qc * qc;
  const disc = qb * qb - qa * qc;
  if (!(norm > 0) || !(disc > 0)) return { ...failed, discriminant: norm > 0 ? disc / norm : NaN };
  // Roots of a r² + 2b r + c = 0 in r = α/β, without cancellation: q = −(b + sign(b)√disc),
  // r₁ = q/a and r₂ = c/q, i.e. (α, β) ∝ (q, a) and (c, q). The root closer to t is the known branch.
  const q = -(qb + (qb >= 0 ? 1 : -1) * Math.sqrt(disc));
  const d1 = combine(t, phi, q, qa);
  const d2 = combine(t, phi, qc, q);
  if (d1 === null || d2 === null) return { ...failed, discriminant: disc / norm };
  const [known, other] = Math.abs(dot(d1, t)) >= Math.abs(dot(d2, t)) ? [d1, d2] : [d2, d1];
  // Relative test: the located point is only accurate to about the square root of the parameter
  // tolerance in the state along a turning branch, so its t_λ is small, not zero.
  const [a, b] = [Math.abs(known[n]!), Math.abs(other[n]!)];
  const turning = Math.min(a, b) <= TRACE.turningTol * Math.max(a, b);
  return { kind: turning ? 'pitchfork' : 'transcritical', direction: other, discriminant: disc / norm };
}

/** Unit α t + β φ, or null when (α, β) = 0. */
function combine(t: Float64Array, phi: Float64Array, alpha: number, beta: number): Float64Array | null {
  const r = Math.hypot(alpha, beta);
  if (!(r > 0)) return null;
  const d = new Float64Array(t.length);
  for (let j = 0; j < t.length; j++) d[j] = (alpha * t[j]! + beta * phi[j]!) / r;
  normalise(d);
  return d;
}

/**
 * Unit null vector of [F_z(z); rowᵀ] (in null(F_z) ∩ row⊥) by inverse iteration, and optionally
 * its left null vector, whose first n entries are then the left null vector ψ of F_z.
 */
export function borderedNullVector(
  ext: ExtendedSystem, work: Workspace, z: Float64Array, row: Float64Array, left: Float64Array | null,
): Float64Array | null {
  const { n, m } = ext;
  const { a: mat, lu } = work;
  if (!ext.jacobian(z, mat)) return null;
  mat.set(row, n * m);
  let size = 0;
  for (let j = 0; j < m * m; j++) size = Math.max(size, Math.abs(mat[j]!));
  if (!(size > 0)) return null;
  luFactor(mat, m, lu);
  // (Nearly) exactly singular: shift slightly so inverse iteration runs without overflow. At an
  // exactly located branch point of a structured matrix (small integer entries) the shifted matrix
  // can again have an exactly zero pivot, so the shift grows until it has none; inverse iteration
  // converges by the factor shift / (next singular value) per sweep, still negligible.
  if (lu.singular || smallestPivot(lu.lu, m) < 1e-14 * size) {
    for (let shift = 1e-13; ; shift *= 100) {
      for (let j = 0; j < m; j++) mat[j * m + j] = mat[j * m + j]! + shift * size;
      luFactor(mat, m, lu);
      if (!lu.singular) break;
      if (shift > 1e-9) return null;
    }
  }
  const right = new Float64Array(m);
  for (let j = 0; j < m; j++) right[j] = 1 + ((0.618 * (j + 1)) % 1);
  if (left !== null) left.set(right);
  for (let sweep = 0; sweep < 3; sweep++) {
    luSolve(lu, right, right);
    normalise(right);
    if (left !== null) {
      luSolveTransposed(lu, left, left);
      normalise(left);
    }
  }
  return Number.isFinite(right[0]!) ? right : null;
}

function smallestPivot(lu: Float64Array, m: number): number {
  let r = Infinity;
  for (let j = 0; j < m; j++) r = Math.min(r, Math.abs(lu[j * m + j]!));
  return r;
}

function normalise(v: Float64Array): void {
  const r = Math.sqrt(dot(v, v));
  if (r > 0 && Number.isFinite(r)) for (let j = 0; j < v.length; j++) v[j] = v[j]! / r;
}

/** (u, v) ↦ ψᵀ F_zz[u, v] at z, in scaled coordinates. */
function secondForm(ext: ExtendedSystem, z: Float64Array, psi: Float64Array): (u: Float64Array, v: Float64Array) => number {
  const { n, k, system } = ext;
  ext.load(z);
  const x = ext.x.slice();
  const p = ext.p.slice();
  const lambda = p[k]!;
  const h = 1e-5 * Math.max(1, Math.abs(lambda));
  const plus = new Float64Array(n);
  const minus = new Float64Array(n);
  p[k] = lambda + h;
  system.paramDerivative(x, p, k, plus);
  p[k] = lambda - h;
  system.paramDerivative(x, p, k, minus);
  p[k] = lambda;
  let fll = 0;
  for (let i = 0; i < n; i++) fll += psi[i]! * (plus[i]! - minus[i]!) / (2 * h);
  const ux = new Float64Array(n);
  const vx = new Float64Array(n);
  const out = new Float64Array(n);
  return (u, v) => {
    for (let i = 0; i < n; i++) {
      ux[i] = u[i]! / ext.w[i]!;
      vx[i] = v[i]! / ext.w[i]!;
    }
    system.secondDerivative(x, p, ux, vx, out);
    let s = dot(psi, out);
    system.mixedDerivative(x, p, k, vx, out);
    s += u[n]! * dot(psi, out);
    system.mixedDerivative(x, p, k, ux, out);
    s += v[n]! * dot(psi, out);
    return s + u[n]! * v[n]! * fll;
  };
}
