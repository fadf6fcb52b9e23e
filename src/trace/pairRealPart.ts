/**
 * Test function for locating a Hopf point: Re μ of the complex eigenvalue (Im > 0) whose frequency
 * is closest to `omega`, the frequency of the critical pair at the bracket's end. It is smooth
 * along the branch and zero exactly where that pair crosses the imaginary axis (Kuznetsov, 3rd ed.,
 * §10.2.2); NaN when no complex eigenvalue is left (the pair became real: not a Hopf point).
 */
import type { Eigenvalue } from '../types.js';

export function pairRealPart(values: readonly Eigenvalue[], omega: number): number {
  let best: Eigenvalue | null = null;
  for (const v of values) {
    if (v.im > 0 && (best === null || Math.abs(v.im - omega) < Math.abs(best.im - omega))) best = v;
  }
  return best === null ? NaN : best.re;
}
