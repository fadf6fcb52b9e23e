/**
 * One solution curve of dx/dt = f(x, p) drawn in the plotting plane: integrated (forward or
 * backward in time) with `integrate` until the first of
 *   'left window'       the plane point leaves the window enlarged by `margin` on each side;
 *   'near equilibrium'  it comes within `nearRadius` (window fractions, in the plane) of an
 *                       equilibrium; the curve's own saddle (`origin`) counts only once the curve
 *                       has been farther than 2·nearRadius from it;
 *   'length limit'      its length in the plane exceeds `maxLength` window fractions (closed orbits);
 *   'time limit'        |t| reached `maxTime`;
 * or an integrator status ('max-steps', 'non-finite', 'step too small').
 * Long chords are filled in by cubic Hermite interpolation between accepted steps (the
 * derivatives are f at both ends), so polylines look smooth even where the steps are long.
 */
import type { Equilibrium, System } from '../types.js';
import { integrate, type IntegrateStatus } from './integrate.js';
import { insideWindow, planeDistance, type PlaneFrame, type Point2 } from './plane.js';

export type CurveEnd = 'left window' | 'near equilibrium' | 'length limit' | 'time limit'
  | Exclude<IntegrateStatus, 'done' | 'stopped'>;

export interface CurveLimits {
  maxTime: number;
  maxSteps: number;
  relTol: number;
  /** Absolute tolerance, as a fraction of the smaller window side. */
  absTolFraction: number;
  margin: number;
  nearRadius: number;
  maxLength: number;
  /** Longest chord between drawn points, in window fractions. */
  maxChord: number;
}

export interface FollowedCurve {
  points: Point2[];
  end: CurveEnd;
  /** Index of the equilibrium approached when end is 'near equilibrium'. */
  reached?: number;
  /** Time integrated (signed: negative backward). */
  duration: number;
  steps: number;
  rejected: number;
}

export function followCurve(system: System, p: Float64Array, frame: PlaneFrame, equilibria: Equilibrium[],
  start: Float64Array, direction: 1 | -1, limits: CurveLimits, origin?: number): FollowedCurve {
  const { window: w, ix, iy } = frame;
  const dist = (y: Float64Array, e: Equilibrium): number => planeDistance(w, y[ix]!, y[iy]!, e.state[ix]!, e.state[iy]!);
  let length = 0;
  let prev = start;
  let leftOrigin = origin === undefined;
  let end: CurveEnd | undefined;
  let reached: number | undefined;
  const stopWhen = (y: Float64Array): boolean => {
    length += planeDistance(w, y[ix]!, y[iy]!, prev[ix]!, prev[iy]!);
    prev = y.slice();
    if (!insideWindow(w, y[ix]!, y[iy]!, limits.margin)) end = 'left window';
    else if (length > limits.maxLength) end = 'length limit';
    else {
      if (!leftOrigin && dist(y, equilibria[origin!]!) > 2 * limits.nearRadius) leftOrigin = true;
      const k = equilibria.findIndex((e, i) => (i !== origin || leftOrigin) && dist(y, e) < limits.nearRadius);
      if (k >= 0) {
        end = 'near equilibrium';
        reached = k;
      }
    }
    return end !== undefined;
  };
  const absTol = limits.absTolFraction * Math.min(w.x[1] - w.x[0], w.y[1] - w.y[0]);
  const f = (_t: number, y: Float64Array, dy: Float64Array): void => system.rhs(y, p, dy);
  const r = integrate(f, start, 0, direction * limits.maxTime,
    { relTol: limits.relTol, absTol, maxSteps: limits.maxSteps, stopWhen });
  const finalEnd: CurveEnd = r.status === 'stopped' ? end! : r.status === 'done' ? 'time limit' : r.status;
  return {
    points: densify(system, p, frame, r.t, r.y, limits.maxChord),
    end: finalEnd,
    ...(finalEnd === 'near equilibrium' ? { reached: reached! } : {}),
    duration: r.t[r.t.length - 1]!,
    steps: r.steps,
    rejected: r.rejected,
  };
}

/** Plane points of the solution, with cubic Hermite points inserted in chords longer than maxChord. */
function densify(system: System, p: Float64Array, frame: PlaneFrame, t: number[], y: Float64Array[],
  maxChord: number): Point2[] {
  const { window: w, ix, iy } = frame;
  const f0 = new Float64Array(system.n);
  const f1 = new Float64Array(system.n);
  const out: Point2[] = [{ x: y[0]![ix]!, y: y[0]![iy]! }];
  for (let k = 1; k < y.length; k++) {
    const a = y[k - 1]!, b = y[k]!;
    const chord = planeDistance(w, a[ix]!, a[iy]!, b[ix]!, b[iy]!);
    const pieces = Math.min(64, Math.ceil(chord / maxChord));
    if (pieces > 1) {
      const h = t[k]! - t[k - 1]!;
      system.rhs(a, p, f0);
      system.rhs(b, p, f1);
      for (let m = 1; m < pieces; m++) {
        const s = m / pieces;
        // Cubic Hermite basis on [0, 1].
        const h00 = (1 + 2 * s) * (1 - s) ** 2, h10 = s * (1 - s) ** 2, h01 = s * s * (3 - 2 * s), h11 = s * s * (s - 1);
        const at = (i: number): number => h00 * a[i]! + h10 * h * f0[i]! + h01 * b[i]! + h11 * h * f1[i]!;
        out.push({ x: at(ix), y: at(iy) });
      }
    }
    out.push({ x: b[ix]!, y: b[iy]! });
  }
  return out;
}
