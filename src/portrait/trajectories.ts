/**
 * Sample trajectories for a phase portrait: start points spread over the window by the Halton
 * sequence in bases 2 and 3 (Halton 1960, a low-discrepancy sequence), each followed forward and
 * backward in time with `followCurve`. Start points closer than `nearRadius` to an equilibrium are
 * skipped (they would end at once).
 */
import { radicalInverse } from '../linalg/radicalInverse.js';
import type { Equilibrium, System } from '../types.js';
import { followCurve, type CurveLimits, type FollowedCurve } from './followCurve.js';
import { planeDistance, stateAt, windowSize, type PlaneFrame, type Point2, type PortraitWindow } from './plane.js';

export type CurveKind = 'trajectory' | 'unstable manifold' | 'stable manifold';

export interface PortraitCurve extends FollowedCurve {
  kind: CurveKind;
  time: 'forward' | 'backward';
  start: Point2;
  /** Manifolds: index of the saddle in the equilibria list, and which side of it (+ε or −ε) the curve starts on. */
  saddle?: number;
  side?: 1 | -1;
}

export interface TrajectoryOptions {
  /** Number of start points. */
  starts: number;
  limits: CurveLimits;
}

/** The first `count` Halton points (bases 2, 3; indices from 1) mapped onto the window. */
export function haltonPoints(count: number, w: PortraitWindow): Point2[] {
  const { width, height } = windowSize(w);
  return Array.from({ length: count }, (_, k) => ({
    x: w.x[0] + radicalInverse(k + 1, 2) * width,
    y: w.y[0] + radicalInverse(k + 1, 3) * height,
  }));
}

export function trajectories(system: System, p: Float64Array, frame: PlaneFrame, equilibria: Equilibrium[],
  opts: TrajectoryOptions): PortraitCurve[] {
  const { window: w, ix, iy } = frame;
  const curves: PortraitCurve[] = [];
  for (const start of haltonPoints(opts.starts, w)) {
    const nearOne = equilibria.some((e) => planeDistance(w, start.x, start.y, e.state[ix]!, e.state[iy]!) < opts.limits.nearRadius);
    if (nearOne) continue;
    const s = stateAt(frame, start.x, start.y);
    for (const direction of [1, -1] as const) {
      const curve = followCurve(system, p, frame, equilibria, s, direction, opts.limits);
      curves.push({ ...curve, kind: 'trajectory', time: direction === 1 ? 'forward' : 'backward', start });
    }
  }
  return curves;
}
