/**
 * Corners of a branch. A model with abs, min or max is smooth only piecewise: where a switch flips
 * (a saturation min(k·λ, 1) reached, say), the branch has a corner, its tangent jumps, and the step
 * control, which halves the step until successive tangents agree, would stop there with a step
 * "too small". Over a step this short (TRACE.cornerStep of the range) a smooth model changes its
 * extended Jacobian [f_x f_λ] about evenly over both halves of the step; a switch changes it in one
 * half only. So a switch lies between two points when the change over one half is more than SPLIT
 * times that over the other and more than CORNER_JUMP of the Jacobian's size; the walker then
 * accepts the turn (walkBranch.ts). Common practice for piecewise-smooth models: detect the switch,
 * step over it.
 */
import { TRACE } from '../defaults.js';
import { distance } from '../linalg/vector.js';
import { correctPoint } from './correctPoint.js';
import type { ExtendedSystem } from './extendedSystem.js';
import { rawPoint, type RawPoint } from './rawPoint.js';
import { tangentAt } from './tangentAt.js';
import type { Workspace } from './workspace.js';

/** Common practice: a change of [f_x f_λ] this large against its size, and this uneven between the halves, is a switch. */
const CORNER_JUMP = 1e-3;
const SPLIT = 10;

/** The longest step across which a turn is taken as a corner, for a sweep over `range`. */
export function cornerStep(range: number): number {
  return TRACE.cornerStep * range;
}

export interface CornerScratch {
  mid: Float64Array;
  a: Float64Array;
  b: Float64Array;
  c: Float64Array;
}

export function cornerScratch(ext: ExtendedSystem): CornerScratch {
  const size = ext.n * ext.m;
  return { mid: new Float64Array(ext.m), a: new Float64Array(size), b: new Float64Array(size), c: new Float64Array(size) };
}

/**
 * Whether a special point at z (located on a branch with tangent t) sits on a switch of the model:
 * [f_x f_λ] jumps across it within a corner step. There the eigenvalues jump rather than pass
 * through the axis, and no normal form applies. Leaves ext.jx at the far probe.
 */
export function atCorner(ext: ExtendedSystem, z: Float64Array, t: Float64Array, range: number, s: CornerScratch): boolean {
  const h = cornerStep(range);
  const before = Float64Array.from(z, (v, j) => v - h * t[j]!);
  const after = Float64Array.from(z, (v, j) => v + h * t[j]!);
  return jacobianJumps(ext, before, after, s);
}

/**
 * Whether a switch of the model lies between the scaled points p and q (see the file comment).
 * Leaves ext.jx holding f_x at q. False when a Jacobian is not finite.
 */
export function jacobianJumps(ext: ExtendedSystem, p: Float64Array, q: Float64Array, s: CornerScratch): boolean {
  for (let j = 0; j < ext.m; j++) s.mid[j] = 0.5 * (p[j]! + q[j]!);
  const ok = ext.jacobian(p, s.a) && ext.jacobian(s.mid, s.b);
  if (!ext.jacobian(q, s.c) || !ok) return false;
  let first = 0;
  let second = 0;
  let size = 0;
  for (let i = 0; i < ext.n; i++) {
    let d1 = 0;
    let d2 = 0;
    let row = 0;
    for (let j = 0; j < ext.m; j++) {
      const k = i * ext.m + j;
      d1 += Math.abs(s.b[k]! - s.a[k]!);
      d2 += Math.abs(s.c[k]! - s.b[k]!);
      row += Math.max(Math.abs(s.a[k]!), Math.abs(s.c[k]!));
    }
    first = Math.max(first, d1);
    second = Math.max(second, d2);
    size = Math.max(size, row);
  }
  const big = Math.max(first, second);
  return big > CORNER_JUMP * size && big > SPLIT * Math.min(first, second);
}

/** max over rows of Σ_j |P_ij − Q_ij| for two n×(n+1) matrices. */
function rowGap(ext: ExtendedSystem, p: Float64Array, q: Float64Array): number {
  let gap = 0;
  for (let i = 0; i < ext.n; i++) {
    let row = 0;
    for (let j = 0; j < ext.m; j++) row += Math.abs(p[i * ext.m + j]! - q[i * ext.m + j]!);
    gap = Math.max(gap, row);
  }
  return gap;
}

/**
 * Past a corner where the branch turns back (no step along the old tangent meets the new piece):
 *  1. the switch on the ray z + σt from the last point, by bisection on which side's Jacobian holds
 *     (within `length`, where stuckAt found it): that is the corner c;
 *  2. the new piece's direction d: the null vector of the far side's [f_x f_λ], with the sign that
 *     stays on the far side of the switch;
 *  3. a point c + length·d corrected onto the new piece (pseudo-arclength corrector), with its tangent.
 * Returns the corner and that point, or null when any step fails or the point fell back on the old
 * side. Common practice for piecewise-smooth continuation: locate the switch, restart beyond it.
 */
export function pastCorner(
  ext: ExtendedSystem, work: Workspace, cur: RawPoint, length: number, s: CornerScratch,
  opts: { absTol: number; maxIter: number; lengthScale: number },
): { corner: Float64Array; point: RawPoint } | null {
  const { m } = ext;
  const ray = (sigma: number) => Float64Array.from(cur.z, (v, j) => v + sigma * cur.t[j]!);
  const far = ray(length);
  if (!ext.jacobian(cur.z, s.a) || !ext.jacobian(far, s.c)) return null;
  const full = rowGap(ext, s.a, s.c);
  const farSide = (z: Float64Array): boolean | null => (ext.jacobian(z, s.b) ? rowGap(ext, s.b, s.c) < 0.5 * full : null);
  let lo = 0;
  let hi = length;
  for (let k = 0; k < 40; k++) {
    const mid = 0.5 * (lo + hi);
    const side = farSide(ray(mid));
    if (side === null) return null;
    if (side) hi = mid;
    else lo = mid;
  }
  const corner = ray(0.5 * (lo + hi));
  // The null vector of the far side's [f_x f_λ]; the bordering row must not be orthogonal to it,
  // and at a right-angled corner the old tangent is: then the parameter axis, then a generic row.
  const d = new Float64Array(m);
  const rows = [cur.t, Float64Array.from({ length: m }, (_, j) => (j === m - 1 ? 1 : 0)), Float64Array.from({ length: m }, (_, j) => 1 + ((0.618 * (j + 1)) % 1))];
  if (!rows.some((row) => tangentAt(ext, far, row, d, work).ok)) return null;
  const probe = (sign: number) => Float64Array.from(corner, (v, j) => v + sign * length * d[j]!);
  const plus = farSide(probe(1));
  const minus = farSide(probe(-1));
  if (plus === null || minus === null || plus === minus) return null;
  if (minus) for (let j = 0; j < m; j++) d[j] = -d[j]!;
  const z = probe(1);
  const zHat = new Float64Array(m);
  const c = correctPoint(ext, z, zHat, d, { ...opts, maxDistance: length }, work);
  if (c.status !== 'converged' || farSide(z) !== true) return null;
  const t = new Float64Array(m);
  const tangent = tangentAt(ext, z, d, t, work);
  if (!tangent.ok) return null;
  const step = distance(z, cur.z);
  return { corner, point: rawPoint(ext, z, t, tangent, { residual: c.residual, iterations: c.iterations, step, s: cur.s + step }) };
}
