/**
 * Deflation (Farrell, Birkisson & Funke 2015, "Deflation techniques for finding distinct
 * solutions of nonlinear partial differential equations", SIAM J. Sci. Comput. 37(4):A2026–A2045,
 * eqs. 2.3 and 3.1): with known roots x_k, solve G(x) = M(x)·F(x) = 0 where
 *   M(x) = Π_k m_k(x),   m_k(x) = 1/‖d_k‖₂^p + α,   d_k = S⁻¹(x − x_k),  S = diag(scale).
 * G keeps every other root of F but no longer vanishes at the x_k. Its Jacobian (product rule):
 *   J_G = M·J_F + F·(∇M)ᵀ,   ∇M = M·Σ_k ∇m_k/m_k,   ∇m_k = −p·‖d‖^(−p−2)·S⁻¹d.
 * The distances are measured in units of a typical size of each state (the scale): with plain
 * distances and α = 1, roots much closer together than 1 (states of size 1e-3, say) leave |G| a
 * minimum that is no root at a distance of about 1 from them, where Newton stalls, so the other
 * roots are not found; with much larger states deflation reaches too short a way.
 */
import type { VectorFunction } from '../solve/newton.js';

export interface DeflationSettings {
  power: number;
  shift: number;
}

/** Write M(x) into the return value and ∇M into `grad`. */
function deflationFactor(
  x: Float64Array, roots: readonly Float64Array[], s: DeflationSettings, scale: Float64Array, grad: Float64Array,
): number {
  const n = x.length;
  grad.fill(0);
  let M = 1;
  for (const root of roots) {
    let d2 = 0;
    for (let i = 0; i < n; i++) d2 += ((x[i]! - root[i]!) / scale[i]!) ** 2;
    const inv = d2 ** (-s.power / 2);
    const m = inv + s.shift;
    M *= m;
    // ∇m/m = −p·‖d‖^(−p−2)·S⁻¹d / m
    const c = (-s.power * inv) / d2 / m;
    for (let i = 0; i < n; i++) grad[i]! += (c * (x[i]! - root[i]!)) / scale[i]! ** 2;
  }
  for (let i = 0; i < n; i++) grad[i]! *= M;
  return M;
}

/**
 * The deflated residual G and its Jacobian for Newton, given F, J_F, the roots found so far and a
 * typical size of each state (positive).
 */
export function deflate(
  F: VectorFunction,
  J: VectorFunction,
  roots: readonly Float64Array[],
  settings: DeflationSettings,
  scale: Float64Array,
): { G: VectorFunction; JG: VectorFunction } {
  const G: VectorFunction = (x, out) => {
    F(x, out);
    if (roots.length === 0) return;
    const M = deflationFactor(x, roots, settings, scale, new Float64Array(x.length));
    for (let i = 0; i < out.length; i++) out[i]! *= M;
  };
  const JG: VectorFunction = (x, out) => {
    J(x, out);
    if (roots.length === 0) return;
    const n = x.length;
    const grad = new Float64Array(n);
    const M = deflationFactor(x, roots, settings, scale, grad);
    const f = new Float64Array(n);
    F(x, f);
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) out[i * n + j] = M * out[i * n + j]! + f[i]! * grad[j]!;
  };
  return { G, JG };
}
