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

/** The unit tangent of the same curve at u ∈ [0, 1] (its derivative in u, normalised). */
export function hermiteTangent(a: OnBranch, b: OnBranch, h: number, u: number, out: Float64Array): void {
  const v = Math.min(1, Math.max(0, u));
  const d00 = 6 * v * v - 6 * v;
  const d10 = 3 * v * v - 4 * v + 1;
  const d01 = -d00;
  const d11 = 3 * v * v - 2 * v;
  let norm = 0;
  for (let j = 0; j < out.length; j++) {
    out[j] = d00 * a.z[j]! + d10 * h * a.t[j]! + d01 * b.z[j]! + d11 * h * b.t[j]!;
    norm += out[j]! * out[j]!;
  }
  norm = Math.sqrt(norm);
  for (let j = 0; j < out.length; j++) out[j]! /= norm;
}
