/**
 * A narrow window of the other stability between two points: the largest real part of the
 * eigenvalues m(s) is negative at three consecutive points but rises above zero between the last two
 * and falls back (a Hopf "bubble": oscillations over a stretch of the parameter shorter than a step),
 * or positive at all three and dips below zero between them. No test function changes its sign
 * across the step, so neither special point would be seen. The parabola through the three values of
 * m (arclength s as abscissa) predicts the extremum; when it lies between the last two points with
 * the other sign, the walker shortens the step until a point falls into the window (its two special
 * points are then found as usual) or the prediction no longer crosses zero.
 *
 * Common practice: quadratic interpolation of a monitored quantity to guard the step. The threshold
 * is the one stabilityOf.ts counts eigenvalues with (relative to the size of the spectrum).
 */
import { TRACE } from '../defaults.js';
import type { RawPoint } from './rawPoint.js';

function largestRealPart(q: RawPoint): { m: number; size: number } {
  let m = -Infinity;
  let size = 1;
  for (const v of q.eigenvalues) {
    m = Math.max(m, v.re);
    size = Math.max(size, Math.hypot(v.re, v.im));
  }
  return { m, size };
}

/** Whether the step from b to c may hide a window of the other stability (a, b, c consecutive points). */
export function hiddenExcursion(a: RawPoint, b: RawPoint, c: RawPoint): boolean {
  const pa = largestRealPart(a);
  const pb = largestRealPart(b);
  const pc = largestRealPart(c);
  const threshold = TRACE.stabilityTol * Math.max(pa.size, pb.size, pc.size);
  const sign = Math.sign(pb.m);
  if (Math.abs(pb.m) <= threshold || Math.sign(pa.m) !== sign || Math.sign(pc.m) !== sign) return false;
  const [s0, s1, s2] = [a.s, b.s, c.s];
  if (!(s0 < s1 && s1 < s2)) return false;
  const d01 = (pb.m - pa.m) / (s1 - s0);
  const d12 = (pc.m - pb.m) / (s2 - s1);
  const curvature = (d12 - d01) / (s2 - s0);
  // An extremum of the other sign: a maximum (curvature < 0) of a negative m, or a minimum of a positive one.
  if (!(curvature * sign > 0)) return false;
  const vertex = (s0 + s1) / 2 - d01 / (2 * curvature);
  if (!(vertex > s1 && vertex < s2)) return false;
  const peak = pb.m + d01 * (vertex - s1) + curvature * (vertex - s0) * (vertex - s1);
  return peak * sign < -threshold;
}
