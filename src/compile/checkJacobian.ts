/**
 * Compare a system's exact Jacobian with central finite differences of its right-hand side:
 * column j ≈ [f(x + h_j e_j) − f(x − h_j e_j)] / 2h_j with h_j = ε^(1/3)·max(1, |x_j|) (the step
 * that balances truncation O(h²) against rounding O(ε/h); common practice).
 */
import type { System } from '../types.js';

export interface JacobianCheck {
  maxAbsError: number;
  /** Largest |exact − differenced| / max(1, |exact|). */
  maxRelError: number;
  /** The entry with the largest relative error (row: equation, col: state). */
  worst: { row: number; col: number };
}

export function checkJacobian(system: System, x: Float64Array, p: Float64Array): JacobianCheck {
  const { n } = system;
  const exact = new Float64Array(n * n);
  system.jacobian(x, p, exact);
  const shifted = Float64Array.from(x);
  const plus = new Float64Array(n);
  const minus = new Float64Array(n);
  const result: JacobianCheck = { maxAbsError: 0, maxRelError: 0, worst: { row: 0, col: 0 } };
  for (let j = 0; j < n; j++) {
    const h = Math.cbrt(Number.EPSILON) * Math.max(1, Math.abs(x[j]!));
    shifted[j] = x[j]! + h;
    system.rhs(shifted, p, plus);
    shifted[j] = x[j]! - h;
    system.rhs(shifted, p, minus);
    shifted[j] = x[j]!;
    const step = (x[j]! + h) - (x[j]! - h);
    for (let i = 0; i < n; i++) {
      const e = exact[i * n + j]!;
      const abs = Math.abs(e - (plus[i]! - minus[i]!) / step);
      const rel = abs / Math.max(1, Math.abs(e));
      result.maxAbsError = Math.max(result.maxAbsError, abs);
      if (!(rel <= result.maxRelError)) {
        result.maxRelError = rel;
        result.worst = { row: i, col: j };
      }
    }
  }
  return result;
}
