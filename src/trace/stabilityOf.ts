/**
 * Linear stability of an equilibrium from the eigenvalues of f_x: stable when every real part is
 * below tol·max(1, max|μ|) (a zero eigenvalue at a fold counts as not unstable); unstableCount
 * counts real parts above that threshold. The relative threshold is common practice.
 */
import type { Eigenvalue } from '../types.js';

export function stabilityOf(
  values: readonly Eigenvalue[], tol: number,
): { stable: boolean; unstableCount: number; maxRealPart: number } {
  let size = 1;
  let maxRealPart = -Infinity;
  for (const v of values) {
    size = Math.max(size, Math.hypot(v.re, v.im));
    maxRealPart = Math.max(maxRealPart, v.re);
  }
  const threshold = tol * size;
  let unstableCount = 0;
  for (const v of values) if (v.re > threshold) unstableCount++;
  return { stable: unstableCount === 0, unstableCount, maxRealPart };
}
