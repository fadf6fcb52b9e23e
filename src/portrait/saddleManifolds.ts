/**
 * Stable and unstable manifolds of saddles, one curve per eigenvector side: start at
 * x* ± ε v for each unit eigenvector v of a real eigenvalue λ (the linear approximation of the
 * manifold, whose error is O(ε²)), and follow the unstable ones forward and the stable ones
 * backward in time. ε = offset · (smaller window side). A planar saddle gives four curves; each
 * polyline begins at the saddle itself, then the start point, then the integrated points.
 *
 * The time limit of each curve is raised to at least (ln(1/offset) + 10)/|λ| (the time to grow from
 * ε to the window size at rate λ, with room to spare), with λ = v·J v (exact for a unit eigenvector).
 */
import type { Equilibrium, System } from '../types.js';
import { followCurve, type CurveLimits } from './followCurve.js';
import type { PlaneFrame } from './plane.js';
import type { PortraitCurve } from './trajectories.js';

export interface ManifoldOptions {
  /** Start offset ε as a fraction of the smaller window side. */
  offset: number;
  limits: CurveLimits;
}

/** v·J v for a unit vector v. */
function rayleighRate(system: System, x: Float64Array, p: Float64Array, v: Float64Array): number {
  const n = system.n;
  const jac = new Float64Array(n * n);
  system.jacobian(x, p, jac);
  let s = 0;
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) s += v[i]! * jac[i * n + j]! * v[j]!;
  return s;
}

export function saddleManifolds(system: System, p: Float64Array, frame: PlaneFrame, equilibria: Equilibrium[],
  opts: ManifoldOptions): PortraitCurve[] {
  const { window: w, ix, iy } = frame;
  const eps = opts.offset * Math.min(w.x[1] - w.x[0], w.y[1] - w.y[0]);
  const curves: PortraitCurve[] = [];
  equilibria.forEach((e, saddle) => {
    const families = [
      { kind: 'unstable manifold' as const, directions: e.unstableDirections ?? [], direction: 1 as const },
      { kind: 'stable manifold' as const, directions: e.stableDirections ?? [], direction: -1 as const },
    ];
    if (families[0]!.directions.length === 0 || families[1]!.directions.length === 0) return;
    for (const { kind, directions, direction } of families) {
      for (const v of directions) {
        const rate = Math.abs(rayleighRate(system, e.state, p, v));
        const growth = (Math.log(1 / opts.offset) + 10) / rate;
        const limits: CurveLimits = { ...opts.limits, maxTime: Math.max(opts.limits.maxTime, Number.isFinite(growth) ? growth : 0) };
        for (const side of [1, -1] as const) {
          const start = e.state.slice();
          for (let i = 0; i < start.length; i++) start[i] = start[i]! + side * eps * v[i]!;
          const curve = followCurve(system, p, frame, equilibria, start, direction, limits, saddle);
          curves.push({
            ...curve,
            points: [{ x: e.state[ix]!, y: e.state[iy]! }, ...curve.points],
            kind, time: direction === 1 ? 'forward' : 'backward',
            start: { x: start[ix]!, y: start[iy]! }, saddle, side,
          });
        }
      }
    }
  });
  return curves;
}
