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
import type { ExtendedSystem } from './extendedSystem.js';

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
