/**
 * Test function for locating a Hopf point: Re μ of the complex eigenvalue (Im > 0) nearest to
 * `target`, where the caller follows the crossing eigenvalue along the bracket (its value at the
 * start, at the end, or in between). It is smooth along the branch and zero exactly where that
 * eigenvalue crosses the imaginary axis (Kuznetsov, 3rd ed., §10.2.2); NaN when no complex eigenvalue
 * is left (the pair became real: not a Hopf point). Nearest in the plane, not in frequency alone:
 * another pair further from the axis can have the closer frequency at the far end of a long step
 * (two pairs of a discretised reaction-diffusion model, ω 1.038 and 1.063, with the crossing pair at
 * 1.053 a step before). And nearest to the followed value, not to the axis: a damped mode
 * −0.0005 + 1.1672i lies as near to 1.2i as a crossing pair 0.0328 + 1.2i does.
 */
import type { Eigenvalue } from '../types.js';

export function pairRealPart(values: readonly Eigenvalue[], target: Eigenvalue): number {
  let best: Eigenvalue | null = null;
  let bestDistance = Infinity;
  for (const v of values) {
    if (!(v.im > 0)) continue;
    const d = Math.hypot(v.re - target.re, v.im - target.im);
    if (d < bestDistance) {
      bestDistance = d;
      best = v;
    }
  }
  return best === null ? NaN : best.re;
}
