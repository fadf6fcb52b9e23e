/**
 * Second, third and mixed derivative forms: closed forms for f = x³y (analytic), and finite
 * differences of the exact Jacobian on the test models; the finite-difference fallback agrees
 * with the symbolic forms.
 */
import { describe, expect, it } from 'vitest';
import { compileModel } from '../../src/compile/compileModel.js';
import type { System } from '../../src/types.js';
import { expectClose } from '../helpers/close.js';
import { ALL_MODELS, modelFromText, REACTOR } from './models.js';
import { startOf } from './modelFromText.js';

/** Deterministic test vectors (common practice: fixed, non-special directions). */
function vector(n: number, phase: number): Float64Array {
  return Float64Array.from({ length: n }, (_, i) => Math.sin(1.7 * i + phase) + 0.3);
}

/** [J(x + h·w) − J(x − h·w)] v / 2h: reference for B(w, v). */
function differencedB(system: System, x: Float64Array, p: Float64Array, w: Float64Array, v: Float64Array): Float64Array {
  const n = system.n;
  const h = 1e-5;
  const jp = new Float64Array(n * n);
  const jm = new Float64Array(n * n);
  system.jacobian(x.map((xi, j) => xi + h * w[j]!), p, jp);
  system.jacobian(x.map((xi, j) => xi - h * w[j]!), p, jm);
  return Float64Array.from({ length: n }, (_, i) => {
    let s = 0;
    for (let j = 0; j < n; j++) s += ((jp[i * n + j]! - jm[i * n + j]!) * v[j]!) / (2 * h);
    return s;
  });
}

describe('multilinear derivative forms', () => {
  it('B and C of f = x³y match the closed forms', () => {
    const system = compileModel(modelFromText({ states: { x: 0, y: 0 }, equations: { x: 'x^3*y', y: '0' } }));
    const [x, y] = [1.3, -0.8];
    const u = Float64Array.of(0.4, 1.1);
    const v = Float64Array.of(-0.9, 0.6);
    const w = Float64Array.of(0.2, -1.5);
    const out = new Float64Array(2);
    system.secondDerivative(Float64Array.of(x, y), new Float64Array(0), u, v, out);
    // Analytic: f_xx = 6xy, f_xy = 3x², f_yy = 0 ⇒ B = 6xy u₁v₁ + 3x²(u₁v₂ + u₂v₁).
    const b = 6 * x * y * u[0]! * v[0]! + 3 * x * x * (u[0]! * v[1]! + u[1]! * v[0]!);
    expectClose(out[0]!, b, { rel: 1e-14, abs: 1e-15 }, 'B');
    expect(out[1]).toBe(0);
    system.thirdDerivative(Float64Array.of(x, y), new Float64Array(0), u, v, w, out);
    // Analytic: f_xxx = 6y, f_xxy = 6x, f_xyy = f_yyy = 0 ⇒ C = 6y u₁v₁w₁ + 6x(u₁v₁w₂ + u₁v₂w₁ + u₂v₁w₁).
    const c = 6 * y * u[0]! * v[0]! * w[0]! + 6 * x * (u[0]! * v[0]! * w[1]! + u[0]! * v[1]! * w[0]! + u[1]! * v[0]! * w[0]!);
    expectClose(out[0]!, c, { rel: 1e-14, abs: 1e-15 }, 'C');
    expect(system.derivativeMethod).toEqual({ second: 'symbolic', third: 'symbolic' });
  });

  for (const [name, text] of ALL_MODELS) {
    it(`B, C and the mixed form of ${name} agree with differences of the Jacobian`, () => {
      const model = modelFromText(text);
      const system = compileModel(model);
      const { x, p } = startOf(model);
      const n = system.n;
      const [u, v, w] = [vector(n, 0), vector(n, 1), vector(n, 2)];
      const out = new Float64Array(n);
      system.secondDerivative(x, p, u, v, out);
      const refB = differencedB(system, x, p, u, v);
      refB.forEach((r, i) => expectClose(out[i]!, r, { abs: 1e-6, rel: 1e-6 }, `B_${i}`));

      // C(u, v, w) = d/dε B(u, v) at x + εw, by central differences of the symbolic B.
      const bp = new Float64Array(n);
      const bm = new Float64Array(n);
      const h = 1e-5;
      system.secondDerivative(x.map((xi, j) => xi + h * w[j]!), p, u, v, bp);
      system.secondDerivative(x.map((xi, j) => xi - h * w[j]!), p, u, v, bm);
      system.thirdDerivative(x, p, u, v, w, out);
      out.forEach((c, i) => expectClose(c, (bp[i]! - bm[i]!) / (2 * h), { abs: 1e-5, rel: 1e-6 }, `C_${i}`));

      for (let k = 0; k < system.np; k++) {
        const jp = new Float64Array(n * n);
        const jm = new Float64Array(n * n);
        const hp = 1e-5 * Math.max(1, Math.abs(p[k]!));
        system.jacobian(x, p.map((pk, m) => (m === k ? pk + hp : pk)), jp);
        system.jacobian(x, p.map((pk, m) => (m === k ? pk - hp : pk)), jm);
        system.mixedDerivative(x, p, k, v, out);
        for (let i = 0; i < n; i++) {
          let ref = 0;
          for (let j = 0; j < n; j++) ref += ((jp[i * n + j]! - jm[i * n + j]!) * v[j]!) / (2 * hp);
          expectClose(out[i]!, ref, { abs: 1e-6, rel: 1e-6 }, `mixed_${k},${i}`);
        }
      }
    });
  }

  it('the finite-difference fallback agrees with the symbolic forms and says it is in use', () => {
    const model = modelFromText(REACTOR);
    const exact = compileModel(model);
    const fallback = compileModel(model, { termLimit: 0 });
    const { x, p } = startOf(model);
    const [u, v, w] = [vector(2, 0), vector(2, 1), vector(2, 2)];
    const a = new Float64Array(2);
    const b = new Float64Array(2);
    exact.secondDerivative(x, p, u, v, a);
    fallback.secondDerivative(x, p, u, v, b);
    a.forEach((e, i) => expectClose(b[i]!, e, { abs: 1e-6, rel: 1e-6 }, `B_${i}`));
    exact.thirdDerivative(x, p, u, v, w, a);
    fallback.thirdDerivative(x, p, u, v, w, b);
    // Second differences with h = ε^(1/4): error O(h²) ≈ 1e-8 relative, plus rounding ε/h² ≈ 1e-8.
    a.forEach((e, i) => expectClose(b[i]!, e, { abs: 1e-5, rel: 1e-5 }, `C_${i}`));
    expect(fallback.derivativeMethod).toEqual({
      second: 'finite differences of the exact Jacobian',
      third: 'finite differences of the exact Jacobian',
    });
  });

  it('a zero direction gives a zero form in the fallback too', () => {
    const model = modelFromText(REACTOR);
    const fallback = compileModel(model, { termLimit: 0 });
    const { x, p } = startOf(model);
    const out = Float64Array.of(5, 5);
    fallback.secondDerivative(x, p, new Float64Array(2), vector(2, 1), out);
    expect(Array.from(out)).toEqual([0, 0]);
  });
});
