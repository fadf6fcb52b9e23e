/**
 * The Brusselator (Prigogine & Lefever 1968) with diffusion on N cells of (0, 1), h = 1/(N + 1),
 * central differences, the boundary values fixed at the homogeneous state (u, v) = (a, b/a):
 *   u_i' = d_u (u_{i−1} − 2u_i + u_{i+1}) + a − (b + 1) u_i + u_i² v_i,
 *   v_i' = d_v (v_{i−1} − 2v_i + v_{i+1}) + b u_i − u_i² v_i,     d_u = D_u/h², d_v = D_v/h²,
 * with u_0 = u_{N+1} = a and v_0 = v_{N+1} = b/a. State order (u_1..u_N, v_1..v_N), parameter b.
 *
 * Analytic special points on the homogeneous branch (u_i, v_i) ≡ (a, b/a) (an equilibrium for
 * every b: a − (b + 1)a + a²·b/a = 0 and b·a − a²·b/a = 0, and the boundary values match):
 * there f_x = I ⊗ J₀ + L ⊗ diag(D_u, D_v) with the reaction part J₀ = [[b − 1, a²], [−b, −a²]]
 * and L the Dirichlet difference Laplacian (1, −2, 1)/h². L has the sine modes
 * s_k,i = sin(kπi/(N + 1)) with eigenvalues μ_k = −4(N + 1)² sin²(kπ/(2(N + 1))), k = 1..N, so f_x
 * splits into the 2×2 mode matrices
 *   J_k = [[b − 1 + D_u μ_k, a²], [−b, −a² + D_v μ_k]].
 * A real eigenvalue crosses zero where det J_k = b·D_v μ_k + (D_u μ_k − 1)(D_v μ_k − a²) = 0:
 *   b_k = (1 − D_u μ_k)(D_v μ_k − a²) / (D_v μ_k).
 * That is a branch point of the continuation problem: the branch exists for every b, so
 * f_x·(0, 1/a) + f_b = 0 and f_b lies in the range of f_x; with the zero eigenvalue simple, the
 * n×(n+1) Jacobian [f_x | f_b] has rank n − 1 and its null space is spanned by the branch tangent
 * and (s_k ⊗ q_k, 0), q_k the null vector of J_k. A Hopf point is where trace J_k = 0 with
 * det J_k > 0: b = 1 + a² − (D_u + D_v) μ_k.
 *
 * Type, from the branching equation aα² + 2bαβ + cβ² = 0 on that null space (src/trace/
 * branchDirections.ts): the branch is a straight line in (x, b), so a = 0; the other coefficients
 * are b = ψᵀF_zz[t, φ] ≠ 0 (the eigenvalue of J_k crosses zero with nonzero speed, det J_k being
 * linear in b with slope D_v μ_k ≠ 0) and c = ψᵀF_zz[φ, φ]. The nonlinearity ±u²v acts cell by
 * cell, with second derivative (2v δu δu' + 2u(δu δv' + δv δu')) in the u-equation and minus that
 * in the v-equation, and φ_i = s_k,i q_k, ψ_i = s_k,i r_k (r_k the left null vector of J_k), so
 *   c = (r_u − r_v)(2(b/a) q_u² + 4a q_u q_v) Σ_i s_k,i³.
 * For even k the mode is odd under the reflection i ↦ N + 1 − i (s_k,N+1−i = (−1)^{k+1} s_k,i),
 * which maps the system to itself, so Σ s³ = 0, c = 0, the branching equation is 2bαβ = 0 and the
 * other branch (α = 0) leaves along φ, which has no b-component: a pitchfork. For odd k, c ≠ 0
 * (checked below) and the other branch has the nonzero slope −c/(2b): a transcritical point.
 */
import { describe, expect, it } from 'vitest';
import { traceBranches } from '../../src/trace/traceBranches.js';
import { traceSettings } from '../../src/trace/traceSettings.js';
import type { System } from '../../src/types.js';
import { makeSystem } from '../helpers/handSystem.js';
import { expectClose } from '../helpers/close.js';
import { expectAllConverged } from './expectTraced.js';

/** Common practice values for a diffusive Brusselator with patterns near b ≈ 3 (no source). */
const A = 1;
const DU = 0.01;
const DV = 0.02;

function brusselator(cells: number): System {
  const inv = (cells + 1) ** 2;
  const du = DU * inv;
  const dv = DV * inv;
  const n = 2 * cells;
  const states: Record<string, number> = {};
  for (let i = 1; i <= cells; i++) states[`u${i}`] = A;
  for (let i = 1; i <= cells; i++) states[`v${i}`] = 2 / A;
  return makeSystem({
    n,
    states,
    parameters: { b: 2 },
    rhs: (x, p, out) => {
      const b = p[0]!;
      for (let i = 0; i < cells; i++) {
        const u = x[i]!;
        const v = x[cells + i]!;
        const uL = i > 0 ? x[i - 1]! : A;
        const uR = i < cells - 1 ? x[i + 1]! : A;
        const vL = i > 0 ? x[cells + i - 1]! : b / A;
        const vR = i < cells - 1 ? x[cells + i + 1]! : b / A;
        out[i] = du * (uL - 2 * u + uR) + A - (b + 1) * u + u * u * v;
        out[cells + i] = dv * (vL - 2 * v + vR) + b * u - u * u * v;
      }
    },
    jacobian: (x, p, out) => {
      const b = p[0]!;
      out.fill(0);
      for (let i = 0; i < cells; i++) {
        const u = x[i]!;
        const v = x[cells + i]!;
        const ru = i * n;
        const rv = (cells + i) * n;
        out[ru + i] = -2 * du - (b + 1) + 2 * u * v;
        out[ru + cells + i] = u * u;
        out[rv + i] = b - 2 * u * v;
        out[rv + cells + i] = -2 * dv - u * u;
        if (i > 0) {
          out[ru + i - 1] = du;
          out[rv + cells + i - 1] = dv;
        }
        if (i < cells - 1) {
          out[ru + i + 1] = du;
          out[rv + cells + i + 1] = dv;
        }
      }
    },
    paramDerivative: (x, _p, _k, out) => {
      for (let i = 0; i < cells; i++) {
        const ends = (i === 0 ? 1 : 0) + (i === cells - 1 ? 1 : 0);
        out[i] = -x[i]!;
        out[cells + i] = x[i]! + (dv * ends) / A;
      }
    },
    secondDerivative: (x, _p, s, w, out) => {
      for (let i = 0; i < cells; i++) {
        const u = x[i]!;
        const v = x[cells + i]!;
        const q = 2 * v * s[i]! * w[i]! + 2 * u * (s[i]! * w[cells + i]! + s[cells + i]! * w[i]!);
        out[i] = q;
        out[cells + i] = -q;
      }
    },
    mixedDerivative: (_x, _p, _k, w, out) => {
      for (let i = 0; i < cells; i++) {
        out[i] = -w[i]!;
        out[cells + i] = w[i]!;
      }
    },
  });
}

interface ModeCrossing { k: number; b: number; type: 'pitchfork' | 'transcritical'; c: number }

/** The analytic branch points b_k in [lo, hi], with the type and the coefficient c derived above. */
function analyticBranchPoints(cells: number, lo: number, hi: number): ModeCrossing[] {
  const found: ModeCrossing[] = [];
  for (let k = 1; k <= cells; k++) {
    const mu = -4 * (cells + 1) ** 2 * Math.sin((k * Math.PI) / (2 * (cells + 1))) ** 2;
    const b = ((1 - DU * mu) * (DV * mu - A * A)) / (DV * mu);
    if (b < lo || b > hi) continue;
    // J_k = [[j11, A²], [−b, j22]] is singular: right null vector q = (A², −j11), left r = (b, j11)
    // (rᵀJ_k = (b·j11 − j11·b, b·A² + j11·j22) = (0, det J_k)).
    const j11 = b - 1 + DU * mu;
    const [qu, qv] = [A * A, -j11];
    const [rU, rV] = [b, j11];
    let cubes = 0;
    for (let i = 1; i <= cells; i++) cubes += Math.sin((k * Math.PI * i) / (cells + 1)) ** 3;
    const c = (rU - rV) * (2 * (b / A) * qu * qu + 4 * A * qu * qv) * cubes;
    found.push({ k, b, type: k % 2 === 0 ? 'pitchfork' : 'transcritical', c });
  }
  return found.sort((x, y) => x.b - y.b);
}

describe('traceBranches on the discretised Brusselator', () => {
  for (const [cells, lo, hi] of [[4, 2.5, 3.5], [5, 2.5, 3.5], [6, 2.5, 3.5]] as const) {
    it(`locates and classifies every branch point of the homogeneous branch on ${cells} cells`, () => {
      const expected = analyticBranchPoints(cells, lo, hi);
      expect(expected.length).toBeGreaterThanOrEqual(3);
      // The derivation's claim, checked: c vanishes for even k (to rounding) and not for odd k.
      for (const e of expected) {
        if (e.type === 'pitchfork') expect(Math.abs(e.c)).toBeLessThan(1e-12);
        else expect(Math.abs(e.c)).toBeGreaterThan(1e-3);
      }
      const start = new Float64Array(2 * cells);
      start.fill(A, 0, cells);
      start.fill(lo / A, cells);
      const trace = traceBranches(brusselator(cells), Float64Array.of(2), traceSettings(0, lo, hi), [start]);
      expect(trace.warnings).toEqual([]);
      expectAllConverged(trace);
      const onTrivial = trace.events
        .filter((e) => e.branch === 1 && (e.type === 'pitchfork' || e.type === 'transcritical' || e.type === 'branch-point'))
        .sort((x, y) => x.parameter - y.parameter);
      expect(onTrivial.map((e) => e.type)).toEqual(expected.map((e) => e.type));
      onTrivial.forEach((e, i) => {
        const want = expected[i]!;
        expectClose(e.parameter, want.b, { rel: 1e-10 }, `branch point of mode ${want.k} (analytic b_k)`);
        for (let j = 0; j < cells; j++) {
          expectClose(e.state[j]!, A, { rel: 1e-10 }, 'u on the homogeneous branch (analytic a)');
          expectClose(e.state[cells + j]!, want.b / A, { rel: 1e-10 }, 'v on the homogeneous branch (analytic b/a)');
        }
      });
    });
  }
});
