/**
 * Test function for locating a Hopf point: Re μ of the complex eigenvalue (Im > 0) nearest to iω on
 * the imaginary axis, ω the frequency of the critical pair at the bracket's end. It is smooth along
 * the branch and zero exactly where that pair crosses the imaginary axis (Kuznetsov, 3rd ed.,
 * §10.2.2); NaN when no complex eigenvalue is left (the pair became real: not a Hopf point).
 * Nearest in the plane, not in frequency alone: another pair further from the axis can have the
 * closer frequency at the far end of a long step (two pairs of a discretised reaction-diffusion
 * model, ω 1.038 and 1.063, with the crossing pair at 1.053 a step before).
 */
import type { Eigenvalue } from '../types.js';

export function pairRealPart(values: readonly Eigenvalue[], omega: number): number {
  let best: Eigenvalue | null = null;
  let bestDistance = Infinity;
  for (const v of values) {
    if (!(v.im > 0)) continue;
    const d = Math.hypot(v.re, v.im - omega);
    if (d < bestDistance) {
      bestDistance = d;
      best = v;
    }
  }
  return best === null ? NaN : best.re;
}
