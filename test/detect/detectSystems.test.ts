/**
 * The hand-written derivatives of the test systems agree with central differences of the
 * next-lower derivative (a general-purpose reference computation; error O(h²) with h = 1e-5).
 */
import { describe, expect, it } from 'vitest';
import type { System } from '../../src/types.js';
import { nominalParameters } from '../helpers/handSystem.js';
import { brusselator, coupledHopf, hopfNormalForm, linearChange, lorenz } from './detectSystems.js';

const H = 1e-5;

function vec(n: number, phase: number): Float64Array {
  return Float64Array.from({ length: n }, (_, i) => Math.sin(1.3 * i + phase) + 0.2);
}

function shifted(x: Float64Array, d: Float64Array, h: number): Float64Array {
  return x.map((t, i) => t + h * d[i]!);
}

function maxDiff(a: Float64Array, b: Float64Array): number {
  return a.reduce((m, t, i) => Math.max(m, Math.abs(t - b[i]!)), 0);
}

function checkDerivatives(system: System): { jac: number; second: number; third: number } {
  const n = system.n;
  const p = nominalParameters(system);
  const [x, u, v, w] = [vec(n, 0.4), vec(n, 1.1), vec(n, 2.5), vec(n, 3.7)];
  const fPlus = new Float64Array(n);
  const fMinus = new Float64Array(n);
  const jac = new Float64Array(n * n);
  // J u versus (f(x + hu) − f(x − hu)) / 2h.
  system.rhs(shifted(x, u, H), p, fPlus);
  system.rhs(shifted(x, u, -H), p, fMinus);
  system.jacobian(x, p, jac);
  const ju = Float64Array.from({ length: n }, (_, i) => u.reduce((s, uj, j) => s + jac[i * n + j]! * uj, 0));
  const jd = fPlus.map((t, i) => (t - fMinus[i]!) / (2 * H));
  // B(u, v) versus (J(x + hv) u − J(x − hv) u) / 2h.
  const jv = (xx: Float64Array): Float64Array => {
    system.jacobian(xx, p, jac);
    return Float64Array.from({ length: n }, (_, i) => u.reduce((s, uj, j) => s + jac[i * n + j]! * uj, 0));
  };
  const jp = jv(shifted(x, v, H));
  const jm = jv(shifted(x, v, -H));
  const b = new Float64Array(n);
  system.secondDerivative(x, p, u, v, b);
  // C(u, v, w) versus (B(x + hw)(u, v) − B(x − hw)(u, v)) / 2h.
  const bp = new Float64Array(n);
  const bm = new Float64Array(n);
  system.secondDerivative(shifted(x, w, H), p, u, v, bp);
  system.secondDerivative(shifted(x, w, -H), p, u, v, bm);
  const c = new Float64Array(n);
  system.thirdDerivative(x, p, u, v, w, c);
  return {
    jac: maxDiff(ju, jd),
    second: maxDiff(b, jp.map((t, i) => (t - jm[i]!) / (2 * H))),
    third: maxDiff(c, bp.map((t, i) => (t - bm[i]!) / (2 * H))),
  };
}

const systems: [string, System][] = [
  ['the Hopf normal form', hopfNormalForm(-1.5, 2)],
  ['the Hopf normal form in sheared coordinates', linearChange(hopfNormalForm(1, 1.3), [2, 0.5, -0.7, 1.2])],
  ['the coupled three-dimensional Hopf system', coupledHopf(1.5, 0.8, -1.2, 2)],
  ['the Brusselator', brusselator(1.3, 2.1)],
  ['the Lorenz system', lorenz(10, 8 / 3, 24)],
];

describe('hand-written derivatives of the detection test systems', () => {
  for (const [name, system] of systems) {
    it(`match central differences for ${name}`, () => {
      const d = checkDerivatives(system);
      expect(d.jac).toBeLessThan(1e-7);
      expect(d.second).toBeLessThan(1e-7);
      expect(d.third).toBeLessThan(1e-7);
    });
  }
});
