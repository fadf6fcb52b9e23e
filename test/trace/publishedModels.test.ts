/**
 * Continuation of published models against their published or analytic special points.
 */
import { describe, expect, it } from 'vitest';
import { traceBranches } from '../../src/trace/traceBranches.js';
import { traceSettings } from '../../src/trace/traceSettings.js';
import { expectClose } from '../helpers/close.js';
import { expectAllConverged } from './expectTraced.js';
import { modelSystem, parameterIndex } from './modelFile.js';

describe('traceBranches on published models', () => {
  it('finds the Brusselator Hopf point at b = 1 + a² (a = 1.5) to 1e-10 relative', () => {
    // Prigogine & Lefever (1968), J. Chem. Phys. 48:1695: the steady state (a, b/a) has
    // J = [[b − 1, a²], [−b, −a²]], trace b − 1 − a², det a² > 0, so a Hopf point at b = 1 + a²
    // with ω = √det = a (analytic).
    const a = 1.5;
    const { system, params } = modelSystem('brusselator.yaml', { a });
    const k = parameterIndex(system, 'b');
    const trace = traceBranches(system, params, traceSettings(k, 1, 4), [Float64Array.of(a, 1 / a)]);
    expect(trace.events.map((e) => e.type)).toEqual(['hopf']);
    const hopf = trace.events[0]!;
    expectClose(hopf.parameter, 1 + a * a, { rel: 1e-10 }, 'Hopf b (Prigogine & Lefever 1968: b = 1 + a²)');
    expectClose(hopf.frequency!, a, { rel: 1e-8 }, 'frequency ω = a (analytic, √det)');
    expectClose(hopf.state[0]!, a, { rel: 1e-8 }, 'x = a (analytic)');
    expectClose(hopf.state[1]!, (1 + a * a) / a, { rel: 1e-8 }, 'y = b/a (analytic)');
    expect(trace.warnings).toEqual([]);
    expectAllConverged(trace);
  });

  it('finds the Lorenz pitchfork at ρ = 1 and the subcritical Hopf points at ρ = σ(σ+β+3)/(σ−β−1)', () => {
    // Lorenz (1963), J. Atmos. Sci. 20:130, with σ = 10, β = 8/3: the origin loses stability at
    // ρ = 1 where the pair C± = (±√(β(ρ−1)), ±√(β(ρ−1)), ρ−1) branches off (a pitchfork, by the
    // symmetry (X, Y, Z) ↦ (−X, −Y, Z)). At C± the characteristic polynomial is
    // μ³ + (σ+β+1)μ² + β(σ+ρ)μ + 2σβ(ρ−1); a pair μ = ±iω needs a2·a1 = a0, i.e.
    // (σ+β+1)(σ+ρ) = 2σ(ρ−1), so ρ_H = σ(σ+β+3)/(σ−β−1) = 470/19 (analytic; the same critical
    // value as Lorenz 1963, equation number not checked). The loss of stability is subcritical
    // (l1 > 0), as stated by Lorenz 1963 for these values (from memory).
    const { system, params } = modelSystem('lorenz-convection.yaml');
    const sigma = 10;
    const beta = 8 / 3;
    const k = parameterIndex(system, 'rho');
    const trace = traceBranches(system, params, traceSettings(k, 0, 30), [new Float64Array(3)]);
    expect(trace.events.map((e) => e.type)).toEqual(['pitchfork', 'hopf', 'hopf']);
    const [pitchfork, h1, h2] = trace.events as [typeof trace.events[0], typeof trace.events[0], typeof trace.events[0]];
    expectClose(pitchfork.parameter, 1, { rel: 1e-10 }, 'pitchfork ρ = 1 (Lorenz 1963)');
    expect(pitchfork.newBranches).toEqual([2]);
    const rhoH = (sigma * (sigma + beta + 3)) / (sigma - beta - 1);
    for (const hopf of [h1, h2]) {
      expect(hopf.branch).toBe(2);
      expectClose(hopf.parameter, rhoH, { rel: 1e-10 }, 'Hopf ρ (Lorenz 1963: σ(σ+β+3)/(σ−β−1))');
      expect(hopf.criticality).toBe('subcritical');
      expect(hopf.lyapunov!).toBeGreaterThan(0);
      // On C±: X = ±√(β(ρ−1)), Z = ρ − 1 (analytic).
      expectClose(Math.abs(hopf.state[0]!), Math.sqrt(beta * (rhoH - 1)), { rel: 1e-8 }, '|X| on C± (analytic)');
      expectClose(hopf.state[2]!, rhoH - 1, { rel: 1e-8 }, 'Z on C± (analytic)');
    }
    expect(Math.sign(h1.state[0]!)).toBe(-Math.sign(h2.state[0]!));
    // Swept from ρ = 30 down to 0 from the origin: the same special points.
    const reversed = traceBranches(system, params, traceSettings(k, 30, 0), [new Float64Array(3)]);
    const key = (t: typeof trace): [string, number][] =>
      t.events.map((e) => [e.type, e.parameter] as [string, number]).sort((p, q) => p[1] - q[1]);
    expect(key(reversed).map((e) => e[0])).toEqual(key(trace).map((e) => e[0]));
    key(trace).forEach((e, i) => expectClose(key(reversed)[i]![1], e[1], { rel: 1e-10 }, `reversed sweep, event ${i}`));
    expectAllConverged(reversed);
    expect(trace.warnings).toEqual([]);
    expectAllConverged(trace);
  });
});

describe('traceBranches on the enriched predator-prey model (Rosenzweig & MacArthur 1963)', () => {
  it('finds the transcritical point where the grazer invades, switches to the coexistence branch and finds its Hopf point', () => {
    // models/predator-prey-enrichment.yaml: N' = rN(1 − N/K) − aNP/(1 + ahN), P' = c·aNP/(1 + ahN) − mP
    // with r = a = h = 1, c = 0.5, m = 0.2. Analytic: coexistence needs c·aN/(1 + ahN) = m, so
    // N* = m/(a(c − mh)) = 2/3 for every K; it meets the prey-only branch (K, 0) at K = N* = 2/3
    // (transcritical: the two branches cross, neither turns). On the coexistence branch P' = 0
    // makes J22 = 0 and det = −J12·J21 > 0, so trace = J11 = N*·∂φ/∂N with φ = r(1 − N/K) − aP/(1 + ahN):
    // zero where the prey nullcline P = (r/a)(1 − N/K)(1 + ahN) is flat, N = (K − 1/(ah))/2
    // (Rosenzweig 1971, Science 171:385, the hump criterion of the "paradox of enrichment"), so the
    // Hopf point is at K = 2N* + 1/(ah) = 7/3.
    const { system, params } = modelSystem('predator-prey-enrichment.yaml');
    const k = parameterIndex(system, 'K');
    const trace = traceBranches(system, params, traceSettings(k, 0.2, 3), [Float64Array.of(0.2, 0)]);
    expect(trace.events.map((e) => e.type)).toEqual(['transcritical', 'hopf']);
    const [bp, hopf] = trace.events as [typeof trace.events[0], typeof trace.events[0]];
    expectClose(bp.parameter, 2 / 3, { rel: 1e-10 }, 'transcritical K = N* = 2/3 (analytic)');
    expect(bp.newBranches).toEqual([2]);
    expect(hopf.branch).toBe(2);
    expectClose(hopf.parameter, 7 / 3, { rel: 1e-10 }, 'Hopf K = 2N* + 1/(ah) = 7/3 (Rosenzweig 1971 hump criterion)');
    expectClose(hopf.state[0]!, 2 / 3, { rel: 1e-10 }, 'N* = 2/3 (analytic)');
    expect(trace.branches[1]!.origin).toEqual({ kind: 'switch', branch: 1, event: 1 });
    expect(trace.warnings).toEqual([]);
    expectAllConverged(trace);
  });
});
