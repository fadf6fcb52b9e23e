import { describe, expect, it } from 'vitest';
import { findEquilibria } from '../../src/equilibria/findEquilibria.js';
import { EQUILIBRIA } from '../../src/defaults.js';
import { compileModel } from '../../src/compile/compileModel.js';
import { message, UsageError } from '../../src/errors.js';
import { loadModel } from '../../src/model/loadModel.js';
import { prepare } from '../../src/setup.js';
import { makeSystem, nominalParameters } from '../helpers/handSystem.js';

function expectState(actual: Float64Array, expected: number[], tol: number): void {
  expect(actual).toHaveLength(expected.length);
  expected.forEach((v, i) => expect(Math.abs(actual[i]! - v)).toBeLessThan(tol));
}

/** Real root of u³ + p u + q = 0 when 4p³ + 27q² > 0 (Cardano's formula). */
function cardano(p: number, q: number): number {
  const s = Math.sqrt((q * q) / 4 + (p * p * p) / 27);
  return Math.cbrt(-q / 2 + s) + Math.cbrt(-q / 2 - s);
}

// Gardner, Cantor & Collins (2000), "Construction of a genetic toggle switch in Escherichia coli",
// Nature 403:339–342: u' = a1/(1 + v^β) − u, v' = a2/(1 + u^γ) − v.
const toggle = makeSystem({
  n: 2,
  states: { u: 1, v: 1 },
  parameters: { a1: 10, a2: 10 },
  rhs: (x, p, out) => {
    out[0] = p[0]! / (1 + x[1]! ** 2) - x[0]!;
    out[1] = p[1]! / (1 + x[0]! ** 2) - x[1]!;
  },
  jacobian: (x, p, out) => {
    out[0] = -1;
    out[1] = (-2 * p[0]! * x[1]!) / (1 + x[1]! ** 2) ** 2;
    out[2] = (-2 * p[1]! * x[0]!) / (1 + x[0]! ** 2) ** 2;
    out[3] = -1;
  },
});

describe('findEquilibria', () => {
  it('finds the three equilibria of the symmetric toggle switch: two stable nodes and a saddle', () => {
    // Analytic, β = γ = 2, a1 = a2 = 10. Symmetric state u = v solves u³ + u − 10 = 0 (Cardano; = 2).
    // Eliminating v gives u⁵ − 10u⁴ + 2u³ − 20u² + 101u − 10 = (u³ + u − 10)(u² − 10u + 1), so the
    // asymmetric states are u = 5 ± √24 with v = 5 ∓ √24.
    const { equilibria, diagnostics } = findEquilibria(toggle, nominalParameters(toggle));
    expect(equilibria).toHaveLength(3);
    const symmetric = cardano(1, -10);
    expect(Math.abs(symmetric - 2)).toBeLessThan(1e-12);
    const r = Math.sqrt(24);
    expectState(equilibria[0]!.state, [5 - r, 5 + r], 1e-9);
    expectState(equilibria[1]!.state, [symmetric, symmetric], 1e-9);
    expectState(equilibria[2]!.state, [5 + r, 5 - r], 1e-9);
    expect(equilibria.map((e) => e.type)).toEqual(['stable node', 'saddle', 'stable node']);
    expect(equilibria.map((e) => e.stable)).toEqual([true, false, true]);
    for (const e of equilibria) expect(e.residual).toBeLessThanOrEqual(1e-10);
    // Saddle: J = [[−1, −1.6], [−1.6, −1]] (analytic: 2a·u/(1 + u²)² = 40/25), so λ = −1 ± 1.6:
    // λ = 0.6 with eigenvector (1, −1)/√2 and λ = −2.6 with (1, 1)/√2.
    const saddle = equilibria[1]!;
    expect(Math.abs(saddle.eigenvalues[0]!.re - 0.6)).toBeLessThan(1e-9);
    expect(Math.abs(saddle.eigenvalues[1]!.re + 2.6)).toBeLessThan(1e-9);
    expectState(saddle.unstableDirections![0]!, [Math.SQRT1_2, -Math.SQRT1_2], 1e-9);
    expectState(saddle.stableDirections![0]!, [Math.SQRT1_2, Math.SQRT1_2], 1e-9);
    expect(diagnostics.budgetExhausted).toBe(false);
    expect(diagnostics.iterations).toBeLessThanOrEqual(diagnostics.iterationBudget);
  });

  it('finds the same three toggle-switch equilibria with the states in other units', () => {
    // U = k1·u, V = k2·v turn the toggle switch above into U' = k1·a1/(1 + (V/k2)²) − U,
    // V' = k2·a2/(1 + (U/k1)²) − V; its equilibria are the analytic ones above times (k1, k2).
    // The guess (k1, k2) is the unscaled (1, 1) in the new units. (States far below 1e-3 meet the
    // absolute residual tolerance of 1e-10 before this accuracy.)
    const r = Math.sqrt(24);
    for (const [k1, k2] of [[1e-3, 1e-3], [1e-3, 1e3], [1e4, 1e-2], [1e2, 1e-3]] as const) {
      const scaled = makeSystem({
        n: 2,
        states: { U: k1, V: k2 },
        parameters: { a1: 10, a2: 10 },
        rhs: (x, p, out) => {
          out[0] = (k1 * p[0]!) / (1 + (x[1]! / k2) ** 2) - x[0]!;
          out[1] = (k2 * p[1]!) / (1 + (x[0]! / k1) ** 2) - x[1]!;
        },
        jacobian: (x, p, out) => {
          out[0] = -1;
          out[1] = (-2 * k1 * p[0]! * (x[1]! / k2 ** 2)) / (1 + (x[1]! / k2) ** 2) ** 2;
          out[2] = (-2 * k2 * p[1]! * (x[0]! / k1 ** 2)) / (1 + (x[0]! / k1) ** 2) ** 2;
          out[3] = -1;
        },
      });
      const { equilibria } = findEquilibria(scaled, nominalParameters(scaled));
      expect(equilibria, `k = ${k1}, ${k2}`).toHaveLength(3);
      const expected = [[5 - r, 5 + r], [2, 2], [5 + r, 5 - r]];
      equilibria.forEach((e, j) => {
        expect(Math.abs(e.state[0]! / k1 - expected[j]![0]!), `k = ${k1}, ${k2}`).toBeLessThan(1e-9);
        expect(Math.abs(e.state[1]! / k2 - expected[j]![1]!), `k = ${k1}, ${k2}`).toBeLessThan(1e-9);
      });
      expect(equilibria.map((e) => e.type), `k = ${k1}, ${k2}`).toEqual(["stable node", "saddle", "stable node"]);
    }
  });

  it('finds all three equilibria of x\' = x − x³/s² however small s is against 1', () => {
    // Analytic: x = 0 and x = ±s. Guess 0 carries no size; the roots found give it. (Below about
    // s = 1e-8 the right-hand side falls under the residual tolerance of 1e-10 everywhere near the
    // roots, a limit of the absolute tolerance.)
    for (const s of [1, 1e-3, 1e-6]) {
      const pitchfork = makeSystem({
        n: 1,
        states: { x: 0 },
        parameters: { s },
        rhs: (x, p, out) => { out[0] = x[0]! - x[0]! ** 3 / p[0]! ** 2; },
        jacobian: (x, p, out) => { out[0] = 1 - (3 * x[0]! ** 2) / p[0]! ** 2; },
      });
      const { equilibria } = findEquilibria(pitchfork, nominalParameters(pitchfork));
      expect(equilibria.map((e) => e.state[0]! / s), `s = ${s}`).toHaveLength(3);
      equilibria.forEach((e, j) => expect(Math.abs(e.state[0]! / s - (j - 1))).toBeLessThan(1e-9));
    }
  });

  it('finds the single equilibrium of the toggle switch when it is monostable', () => {
    // Analytic: at a1 = a2 = 1 only the symmetric state exists: u³ + u − 1 = 0 (Cardano: u ≈ 0.6823);
    // the asymmetric factor u² − u + 1 (same elimination with a = 1) has no real root.
    const { equilibria } = findEquilibria(toggle, Float64Array.of(1, 1));
    expect(equilibria).toHaveLength(1);
    const u = cardano(1, -1);
    expectState(equilibria[0]!.state, [u, u], 1e-9);
    expect(equilibria[0]!.type).toBe('stable node');
  });

  it('finds the origin and both convection states of the Lorenz system, all unstable', () => {
    // Lorenz (1963), J. Atmos. Sci. 20:130, σ = 10, ρ = 28, b = 8/3. Analytic: equilibria 0 and
    // C± = (±√(b(ρ−1)), ±√(b(ρ−1)), ρ−1). At 0: λ = −b and (−(σ+1) ± √((σ+1)² + 4σ(ρ−1)))/2 = (−11 ± √1201)/2,
    // one unstable. At C±: λ³ + (σ+b+1)λ² + b(σ+ρ)λ + 2σb(ρ−1) = 0 (Strogatz 2nd ed. §9.2), with
    // ρ = 28 > ρ_H = σ(σ+b+3)/(σ−b−1) ≈ 24.74 a complex pair with positive real part: two unstable.
    const [sigma, rho, b] = [10, 28, 8 / 3];
    const lorenz = makeSystem({
      n: 3,
      states: { x: 1, y: 1, z: 1 },
      rhs: (x, _p, out) => {
        out[0] = sigma * (x[1]! - x[0]!);
        out[1] = x[0]! * (rho - x[2]!) - x[1]!;
        out[2] = x[0]! * x[1]! - b * x[2]!;
      },
      jacobian: (x, _p, out) => out.set([-sigma, sigma, 0, rho - x[2]!, -1, -x[0]!, x[1]!, x[0]!, -b]),
    });
    const box = { lo: Float64Array.of(-20, -20, -5), hi: Float64Array.of(20, 20, 40) };
    const { equilibria } = findEquilibria(lorenz, new Float64Array(0), { box });
    expect(equilibria).toHaveLength(3);
    const c = Math.sqrt(b * (rho - 1));
    expectState(equilibria[0]!.state, [-c, -c, rho - 1], 1e-8);
    expectState(equilibria[1]!.state, [0, 0, 0], 1e-8);
    expectState(equilibria[2]!.state, [c, c, rho - 1], 1e-8);
    const origin = equilibria[1]!;
    expect(origin.type).toBe('saddle (2 stable, 1 unstable)');
    expect(Math.abs(origin.eigenvalues[0]!.re - (-11 + Math.sqrt(1201)) / 2)).toBeLessThan(1e-9);
    for (const e of [equilibria[0]!, equilibria[2]!]) {
      expect(e.type).toBe('saddle (1 stable, 2 unstable; 1 complex pair)');
      expect(e.unstableDimension).toBe(2);
      for (const { re, im } of e.eigenvalues) {
        // Residual of the characteristic polynomial at λ (complex arithmetic, analytic coefficients).
        const c2 = sigma + b + 1;
        const c1 = b * (sigma + rho);
        const c0 = 2 * sigma * b * (rho - 1);
        const [r2, i2] = [re * re - im * im, 2 * re * im];
        const [r3, i3] = [r2 * re - i2 * im, r2 * im + i2 * re];
        expect(Math.hypot(r3 + c2 * r2 + c1 * re + c0, i3 + c2 * i2 + c1 * im)).toBeLessThan(1e-8 * c0);
      }
    }
    expect(equilibria.every((e) => !e.stable)).toBe(true);
  });

  it('finds all four roots of x² + y² = 5, xy = 2 by deflation', () => {
    // Analytic: (x + y)² = 9 and (x − y)² = 1 give (±1, ±2) and (±2, ±1) with equal signs.
    const circle = makeSystem({
      n: 2,
      rhs: (x, _p, out) => {
        out[0] = x[0]! ** 2 + x[1]! ** 2 - 5;
        out[1] = x[0]! * x[1]! - 2;
      },
      jacobian: (x, _p, out) => out.set([2 * x[0]!, 2 * x[1]!, x[1]!, x[0]!]),
    });
    const { equilibria } = findEquilibria(circle, new Float64Array(0), { guess: Float64Array.of(0.5, 0.5) });
    expect(equilibria).toHaveLength(4);
    const expected = [[-2, -1], [-1, -2], [1, 2], [2, 1]];
    equilibria.forEach((e, k) => expectState(e.state, expected[k]!, 1e-10));
  });

  it('finds all six roots of a product system from the guess alone by deflation', () => {
    // Analytic: ((x − 1)(x + 2)(x − 3), (y − 1)(y + 1)) vanishes on {−2, 1, 3} × {−1, 1}.
    const product = makeSystem({
      n: 2,
      rhs: (x, _p, out) => {
        out[0] = (x[0]! - 1) * (x[0]! + 2) * (x[0]! - 3);
        out[1] = (x[1]! - 1) * (x[1]! + 1);
      },
      jacobian: (x, _p, out) => {
        const u = x[0]!;
        out.set([3 * u * u - 4 * u - 5, 0, 0, 2 * x[1]!]);
      },
    });
    const { equilibria } = findEquilibria(product, new Float64Array(0), { starts: 0, guess: Float64Array.of(0.3, 0.2) });
    const expected = [[-2, -1], [-2, 1], [1, -1], [1, 1], [3, -1], [3, 1]];
    expect(equilibria.length).toBeGreaterThanOrEqual(EQUILIBRIA.solvesPerStart);
    const found = equilibria.map((e) => expected.findIndex((r) => Math.hypot(r[0]! - e.state[0]!, r[1]! - e.state[1]!) < 1e-10));
    expect(found.every((k) => k >= 0)).toBe(true);
    expect(new Set(found).size).toBe(found.length);
    const withStarts = findEquilibria(product, new Float64Array(0), { guess: Float64Array.of(0.3, 0.2) });
    expect(withStarts.equilibria).toHaveLength(6);
    withStarts.equilibria.forEach((e, k) => expectState(e.state, expected[k]!, 1e-10));
  });

  it('discards starts where the model is not finite and still finds the root', () => {
    // Analytic: −log(x) = 0 at x = 1 with f'(1) = −1 (stable); starts with x ≤ 0 give NaN or Infinity.
    const log = makeSystem({
      n: 1,
      states: { x: -1 },
      rhs: (x, _p, out) => { out[0] = -Math.log(x[0]!); },
      jacobian: (x, _p, out) => { out[0] = -1 / x[0]!; },
    });
    const { equilibria, diagnostics } = findEquilibria(log, new Float64Array(0));
    expect(equilibria).toHaveLength(1);
    expectState(equilibria[0]!.state, [1], 1e-12);
    expect(equilibria[0]!.type).toBe('stable');
    expect(diagnostics.outcomes['non-finite']).toBeGreaterThan(0);
  });

  it('drops roots outside the box but reports them in the diagnostics', () => {
    // Analytic: (x − 1)(x − 50) = 0; the default box around the start 0 is [−10, 10].
    const two = makeSystem({
      n: 1,
      rhs: (x, _p, out) => { out[0] = (x[0]! - 1) * (x[0]! - 50); },
      jacobian: (x, _p, out) => { out[0] = 2 * x[0]! - 51; },
    });
    const { equilibria, diagnostics } = findEquilibria(two, new Float64Array(0));
    expect(equilibria).toHaveLength(1);
    // Newton's last error is about absTol/|f'(1)| = 1e-10/49 (analytic); 1e-10 allows for it.
    expectState(equilibria[0]!.state, [1], 1e-10);
    expect(diagnostics.outsideBox).toBe(1);
  });

  it('keeps to the bounds the model gives a state: starts inside them, roots beyond them dropped', () => {
    // Analytic: x(1 − x)(1 + x) = 0 at −1, 0, 1; with min 0 only 0 and 1 remain.
    const model = loadModel('states: { x: { start: 0.5, min: 0 } }\nequations:\n  x: x*(1 - x)*(1 + x)\n', 'cubic.yaml');
    const { equilibria, diagnostics } = findEquilibria(compileModel(model), new Float64Array(0));
    expect(equilibria.map((e) => e.state[0]!).sort()).toEqual([0, 1]);
    expect(diagnostics.box.lo[0]).toBe(0);
    const free = findEquilibria(compileModel(loadModel('states: { x: 0.5 }\nequations:\n  x: x*(1 - x)*(1 + x)\n', 'cubic.yaml')), new Float64Array(0));
    expect(free.equilibria.map((e) => e.state[0]!).sort()).toEqual([-1, 0, 1]);
    // A start value outside the bounds is a usage error.
    expect(() => prepare(model, { start: { x: -2 } })).toThrow(new UsageError(message.startOutsideBounds('x', -2, 0, undefined)));
  });

  it('gives identical results when run twice with the same options', () => {
    const a = findEquilibria(toggle, nominalParameters(toggle), { stream: 7 });
    const b = findEquilibria(toggle, nominalParameters(toggle), { stream: 7 });
    expect(a.diagnostics.iterations).toBe(b.diagnostics.iterations);
    expect(a.equilibria.map((e) => Array.from(e.state))).toEqual(b.equilibria.map((e) => Array.from(e.state)));
  });

  it('stays within its iteration budget on a 100-state model', () => {
    // Analytic: x_i' = (i/100 − x_i) + 0.1·(x_{i+1} − x_i − 1/100)³ (cyclic indices) vanishes at x_i = i/100
    // for i < 99 and also for i = 99 only if x_0 − x_99 = 1/100, which fails; so the last state is uncoupled:
    // x_99' = 0.99 − x_99. At x_i = i/100 the cubic terms and their derivatives vanish: J = −I, λ = −1 (×100).
    const n = 100;
    const big = makeSystem({
      n,
      rhs: (x, _p, out) => {
        for (let i = 0; i < n; i++) {
          const c = i + 1 < n ? 0.1 * (x[i + 1]! - x[i]! - 1 / n) ** 3 : 0;
          out[i] = i / n - x[i]! + c;
        }
      },
      jacobian: (x, _p, out) => {
        out.fill(0);
        for (let i = 0; i < n; i++) {
          const d = i + 1 < n ? 0.3 * (x[i + 1]! - x[i]! - 1 / n) ** 2 : 0;
          out[i * n + i] = -1 - d;
          if (i + 1 < n) out[i * n + i + 1] = d;
        }
      },
    });
    const { equilibria, diagnostics } = findEquilibria(big, new Float64Array(0), { starts: 8 });
    expect(diagnostics.iterations).toBeLessThanOrEqual(diagnostics.iterationBudget);
    const target = equilibria.find((e) => e.state.every((v, i) => Math.abs(v - i / n) < 1e-9));
    expect(target?.type).toBe('stable (100 stable)');
  });
});
