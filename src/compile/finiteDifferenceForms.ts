/**
 * Fallback multilinear forms by central differences of the exact Jacobian, for models whose
 * symbolic second or third derivatives would have too many terms:
 *
 *   B(u, v)    ≈ [J(x + a·u) − J(x − a·u)] v / 2a                              error O(a²)
 *   C(u, v, w) ≈ [J(x+a·u+b·v) − J(x+a·u−b·v) − J(x−a·u+b·v) + J(x−a·u−b·v)] w / 4ab
 *
 * with a = h·max(1, ‖x‖∞)/‖u‖∞ (b likewise with v), h = ε^(1/3) for B and ε^(1/4) for C (the
 * steps that balance truncation against rounding, common practice). Scratch space is allocated
 * once, so calls allocate nothing.
 */
import { normInf } from '../linalg/norm.js';
import type { VectorFn } from './kernels.js';

export interface FiniteDifferenceForms {
  second(x: Float64Array, p: Float64Array, u: Float64Array, v: Float64Array, out: Float64Array): void;
  third(x: Float64Array, p: Float64Array, u: Float64Array, v: Float64Array, w: Float64Array, out: Float64Array): void;
}

const H_SECOND = Math.cbrt(Number.EPSILON);
const H_THIRD = Math.sqrt(Math.sqrt(Number.EPSILON));

export function finiteDifferenceForms(jacobian: VectorFn, n: number): FiniteDifferenceForms {
  const shifted = new Float64Array(n);
  const jac = new Float64Array(n * n);

  /** out += sign · J(x + a·u + b·v) w (u, v may be null for no shift). */
  function addJw(
    x: Float64Array, p: Float64Array, a: number, u: Float64Array, b: number, v: Float64Array | null,
    w: Float64Array, sign: number, out: Float64Array,
  ): void {
    for (let j = 0; j < n; j++) shifted[j] = x[j]! + a * u[j]! + (v ? b * v[j]! : 0);
    jacobian(shifted, p, jac);
    for (let i = 0; i < n; i++) {
      let s = 0;
      for (let j = 0; j < n; j++) s += jac[i * n + j]! * w[j]!;
      out[i]! += sign * s;
    }
  }

  function step(h: number, x: Float64Array, dir: Float64Array): number {
    const size = normInf(dir);
    return size === 0 ? 0 : (h * Math.max(1, normInf(x))) / size;
  }

  return {
    second(x, p, u, v, out) {
      out.fill(0);
      const a = step(H_SECOND, x, u);
      if (a === 0) return;
      addJw(x, p, a, u, 0, null, v, 1, out);
      addJw(x, p, -a, u, 0, null, v, -1, out);
      for (let i = 0; i < n; i++) out[i]! /= 2 * a;
    },
    third(x, p, u, v, w, out) {
      out.fill(0);
      const a = step(H_THIRD, x, u);
      const b = step(H_THIRD, x, v);
      if (a === 0 || b === 0) return;
      addJw(x, p, a, u, b, v, w, 1, out);
      addJw(x, p, a, u, -b, v, w, -1, out);
      addJw(x, p, -a, u, b, v, w, -1, out);
      addJw(x, p, -a, u, -b, v, w, 1, out);
      for (let i = 0; i < n; i++) out[i]! /= 4 * a * b;
    },
  };
}
