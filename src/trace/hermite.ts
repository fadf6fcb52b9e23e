import type { OnBranch } from './rawPoint.js';

/**
 * The cubic Hermite curve through two branch points a and b with end slopes h·t (h the chord
 * length), at u ∈ [0, 1] (clamped): a local model of the branch between them, third-order
 * accurate in h (common practice for dense output of continuation).
 */
export function hermite(a: OnBranch, b: OnBranch, h: number, u: number, out: Float64Array): void {
  const v = Math.min(1, Math.max(0, u));
  const v2 = v * v;
  const v3 = v2 * v;
  const h00 = 2 * v3 - 3 * v2 + 1;
  const h10 = v3 - 2 * v2 + v;
  const h01 = -2 * v3 + 3 * v2;
  const h11 = v3 - v2;
  for (let j = 0; j < out.length; j++) out[j] = h00 * a.z[j]! + h10 * h * a.t[j]! + h01 * b.z[j]! + h11 * h * b.t[j]!;
}
