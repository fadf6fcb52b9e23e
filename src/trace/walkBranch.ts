/**
 * One direction of pseudo-arclength continuation (Keller 1977; Allgower & Georg 1990, ch. 2):
 * Euler predictor z + ds·t, corrector on the hyperplane orthogonal to t (correctPoint.ts), new
 * tangent from the bordered system (tangentAt.ts).
 *
 * Step control (common practice): halve ds when the corrector fails or the tangent turns by more
 * than maxTurnDegrees (keeps the predictor error, about κ·ds²/2, small against the branch
 * spacing), or when the step hides eigenvalue crossings (hiddenCrossings.ts: two crossings, a
 * crossing beside a pair turning real, which the test functions cannot tell, or a crossing pair
 * that cannot be told from another one after the step, or the largest real part of the eigenvalues
 * may cross zero and back within the step: hiddenExcursion.ts; halving stops at dsMin); grow it by
 * growFactor after a correction of at most easyIterations Newton steps; clamp to [dsMin, dsMax],
 * where dsMax grows with the size a state has reached far beyond its typical size (TRACE.farFrom:
 * a branch running off to infinity is followed in steps proportional to that size, and stops as
 * 'unbounded' beyond TRACE.unboundedFactor).
 *
 * Corners: a turn larger than maxTurnDegrees is accepted over a step of at most TRACE.cornerStep of
 * the range when [f_x f_λ] jumps across it (an abs, min or max switching, corner.ts); where no step
 * can turn (the branch bends back), the walk restarts on the piece beyond the switch (pastCorner,
 * the corner kept on that point for detectEvents), or stops with 'corner' when that fails.
 *
 * Stops: 'left range' (last point landed exactly on the bound, landOnBound.ts), 'state bound' (a
 * state reached a bound the model gives it, the last point landed on it: stateBound.ts), 'closed loop'
 * (back within 2·ds of the first point, tangent aligned, after having been at least four times
 * as far; the first point is appended again to close the curve), 'point budget',
 * 'unbounded', 'corner', 'step too small', 'non-finite', 'interrupted'.
 */
import { TRACE } from '../defaults.js';
import { message } from '../errors.js';
import type { StopReason, TraceSettings } from '../types.js';
import { correctPoint } from './correctPoint.js';
import { cornerScratch, cornerStep, jacobianJumps, pastCorner } from './corner.js';
import type { ExtendedSystem } from './extendedSystem.js';
import { hiddenCrossings } from './hiddenCrossings.js';
import { hiddenExcursion } from './hiddenExcursion.js';
import { landOnBound } from './landOnBound.js';
import { rawPoint, type OnBranch, type RawPoint } from './rawPoint.js';
import { firstCrossing, landOnStateBound, scaledBounds, type BoundCrossing } from './stateBound.js';
import { hermiteTangent } from './hermite.js';
import { tangentAt } from './tangentAt.js';
import { normInf } from '../linalg/norm.js';
import { distance, dot } from '../linalg/vector.js';
import type { Workspace } from './workspace.js';

export interface WalkContext {
  ext: ExtendedSystem;
  work: Workspace;
  settings: TraceSettings;
  /** Parameter range [lo, hi]. */
  lo: number;
  hi: number;
  /** Name of the varied parameter (for warnings). */
  name: string;
  /** Called after every point; returns true to stop ('interrupted'). */
  tick: (points: number, parameter: number) => boolean;
  warnings: string[];
}

export interface Walk {
  points: RawPoint[];
  stopped: StopReason;
}

export function walkBranch(ctx: WalkContext, start: RawPoint, budget: number): Walk {
  const { ext, work, settings, lo, hi } = ctx;
  const { n, m } = ext;
  const points: RawPoint[] = [start];
  const z = new Float64Array(m);
  const zHat = new Float64Array(m);
  const tNew = new Float64Array(m);
  const minTurnCos = Math.cos((TRACE.maxTurnDegrees * Math.PI) / 180);
  let cur = start;
  let ds = settings.ds;
  let farthest = 0;
  let sawNonFinite = false;
  const range = Math.abs(settings.to - settings.from);
  const cornerLength = cornerStep(range);
  const scratch = cornerScratch(ext);
  const probe = new Float64Array(m);
  const turnOpts = { absTol: settings.absTol, maxIter: settings.maxIter, lengthScale: range };
  const bounds = scaledBounds(ext, range);
  /**
   * The corrected point z lies past a switch of the model and its tangent leads further away from
   * it (at a corner where the branch turns back, the tangent oriented along the old one points back
   * over the switch: pastCorner handles that). Leaves ext.jx at z.
   */
  const beyondCorner = (z: Float64Array): boolean => {
    for (let j = 0; j < m; j++) probe[j] = z[j]! + cornerLength * tNew[j]!;
    return jacobianJumps(ext, cur.z, probe, scratch) && jacobianJumps(ext, cur.z, z, scratch);
  };
  /** Why steps of every length failed at `q`: a corner just ahead, or not. */
  const stuckAt = (q: RawPoint): StopReason => {
    for (let j = 0; j < m; j++) probe[j] = q.z[j]! + cornerLength * q.t[j]!;
    return jacobianJumps(ext, q.z, probe, scratch) ? 'corner' : 'step too small';
  };
  for (;;) {
    if (points.length >= budget) return { points, stopped: 'point budget' };
    if (ctx.tick(points.length, cur.z[n]!)) return { points, stopped: 'interrupted' };
    for (let j = 0; j < m; j++) z[j] = cur.z[j]! + ds * cur.t[j]!;
    const c = correctPoint(ext, z, zHat, cur.t, {
      absTol: settings.absTol, maxIter: settings.maxIter, maxDistance: ds, lengthScale: range,
    }, work);
    const tangent = c.status === 'converged' ? tangentAt(ext, z, cur.t, tNew, work) : undefined;
    const found = tangent !== undefined && tangent.ok;
    const turned = found && dot(cur.t, tNew) < minTurnCos;
    if (!found || (turned && !(ds <= cornerLength && beyondCorner(z)))) {
      sawNonFinite ||= c.status === 'non-finite';
      ds *= TRACE.shrinkFactor;
      if (ds >= settings.dsMin) continue;
      const stop = sawNonFinite ? 'non-finite' : stuckAt(cur);
      const past = stop === 'corner' ? pastCorner(ext, work, cur, cornerLength, scratch, turnOpts) : null;
      if (past === null || past.point.z[n]! < lo || past.point.z[n]! > hi) return { points, stopped: stop };
      past.point.corner = past.corner;
      points.push(past.point);
      cur = past.point;
      ds = settings.ds;
      continue;
    }
    sawNonFinite = false;
    const step = distance(z, cur.z);
    const lambda = z[n]!;
    const crossing = bounds === null ? null : firstCrossing(bounds, cur.z, z);
    // A state bound crossed before the parameter leaves its range ends the branch there.
    const leaves = lambda < lo || lambda > hi;
    if (bounds !== null && crossing !== null && (!leaves || crossing.fraction <= rangeFraction(cur.z[n]!, lambda, lo, hi))) {
      landOnState(ctx, cur, { z, t: tNew }, crossing, bounds.slack, points);
      return { points, stopped: 'state bound' };
    }
    if (lambda < lo || lambda > hi) {
      const bound = lambda < lo ? lo : hi;
      if (cur.z[n] !== bound) landPoint(ctx, cur, z, bound, points);
      return { points, stopped: 'left range' };
    }
    const point = rawPoint(ext, z, tNew, tangent, { residual: c.residual, iterations: c.iterations, step, s: cur.s + step });
    const hidden = hiddenCrossings(cur.eigenvalues, point.eigenvalues);
    if (hidden !== null) {
      if (ds * TRACE.shrinkFactor >= settings.dsMin) {
        ds *= TRACE.shrinkFactor;
        continue;
      }
      if (hidden === 'crossings') ctx.warnings.push(message.traceHiddenCrossings(ctx.name, cur.z[n]!, lambda));
    }
    const prev = points.length >= 2 ? points[points.length - 2]! : undefined;
    if (hidden === null && prev !== undefined && hiddenExcursion(prev, cur, point)) {
      if (ds * TRACE.shrinkFactor >= settings.dsMin) {
        ds *= TRACE.shrinkFactor;
        continue;
      }
      ctx.warnings.push(message.traceNarrowWindow(ctx.name, cur.z[n]!, lambda));
    }
    points.push(point);
    cur = point;
    const fromFirst = distance(z, start.z);
    farthest = Math.max(farthest, fromFirst);
    const radius = 2 * Math.max(ds, step);
    if (farthest > 4 * radius && fromFirst <= radius && dot(tNew, start.t) > 0.7) {
      points.push({ ...start, step: fromFirst, s: cur.s + fromFirst });
      return { points, stopped: 'closed loop' };
    }
    const size = scaledSize(z, n);
    if (size > TRACE.unboundedFactor * range) return { points, stopped: 'unbounded' };
    const cap = Math.max(settings.dsMax, TRACE.farStepShare * (size - TRACE.farFrom * range));
    if (c.iterations <= TRACE.easyIterations) ds = Math.min(ds * TRACE.growFactor, cap);
  }
}

/** The largest scaled state, max |z_i| over i < n. */
function scaledSize(z: Float64Array, n: number): number {
  let size = 0;
  for (let i = 0; i < n; i++) size = Math.max(size, Math.abs(z[i]!));
  return size;
}

/** How far along the step from λ0 (inside the range) to λ1 (outside) the range ends. */
function rangeFraction(l0: number, l1: number, lo: number, hi: number): number {
  return ((l1 < lo ? lo : hi) - l0) / (l1 - l0);
}

/**
 * Appends the point where the step from `cur` to `outside` reaches a state bound, unless `cur` is on
 * it already.
 */
function landOnState(
  ctx: WalkContext, cur: RawPoint, outside: OnBranch, crossing: BoundCrossing, slack: number, points: RawPoint[],
): void {
  const { ext, work, settings } = ctx;
  if (crossing.fraction === 0) return;
  const range = Math.abs(settings.to - settings.from);
  const located = landOnStateBound(ext, work, cur, outside, crossing, {
    absTol: settings.absTol, maxIter: settings.maxIter, rootMaxIter: TRACE.locateMaxIter,
    tol: TRACE.locateRelTol * Math.max(Math.abs(cur.z[ext.n]!), 1e-3 * range),
  });
  const state = ext.system.info.states[crossing.index]?.name ?? `#${crossing.index}`;
  if (located.status === 'not-corrected') {
    ctx.warnings.push(message.traceStateBoundFailed(state, crossing.value / ext.w[crossing.index]!, ctx.name, cur.z[ext.n]!));
    return;
  }
  // The tangent there is the derivative of the cubic through the step's two ends at the located
  // point: a tangent solve next to a branch point on the bound (where the bound is itself a branch)
  // is nearly singular and points anywhere. No branch-point test value either, for the same reason:
  // a branch point there is found on the branch the bound belongs to and counts for this one's
  // margin too (margin.ts).
  // Where the branch turns back exactly on the bound (half a pitchfork on x = 0: λ = x² has its least
  // λ there) the cubic's tangent may already point back, which would read as a fold: the branch
  // within the bounds just ends there, so the chord's direction is kept then.
  const n = ext.n;
  const sigmaB = dot(cur.t, outside.z.map((v, j) => v - cur.z[j]!));
  hermiteTangent(cur, outside, distance(cur.z, outside.z), sigmaB === 0 ? 0 : located.s / sigmaB, located.t);
  if (located.t[n]! * (located.z[n]! - cur.z[n]!) < 0) {
    const length = distance(located.z, cur.z);
    for (let j = 0; j < ext.m; j++) located.t[j] = (located.z[j]! - cur.z[j]!) / length;
  }
  const tangent = { ok: true, singular: true, detSign: 0, detLog: -Infinity };
  // Exactly on the bound where the locator left it within rounding of it (residual taken again there).
  let residual = located.residual;
  if (Math.abs(located.z[crossing.index]! - crossing.value) <= slack) {
    located.z[crossing.index] = crossing.value;
    const f = new Float64Array(ext.n);
    residual = ext.residual(located.z, f) ? normInf(f) : residual;
  }
  // rawPoint reads f_x at the point from ext.jx: evaluate it there (the locator's last solve may have been beside it).
  ext.jacobian(located.z, work.a);
  const step = distance(located.z, cur.z);
  points.push(rawPoint(ext, located.z, located.t, tangent, {
    residual, iterations: located.iterations, step, s: cur.s + step,
  }));
}

/**
 * Appends the point on the bound between `cur` (inside) and `outside`, if Newton converges there.
 * A bound that is a branch point has no unique tangent: the point keeps the direction of travel
 * (and a zero branch-point test value), and the warnings say so.
 */
function landPoint(ctx: WalkContext, cur: RawPoint, outside: Float64Array, bound: number, points: RawPoint[]): void {
  const { ext, work, settings } = ctx;
  const { z, result } = landOnBound(ext, cur.z, outside, bound, settings);
  const t = new Float64Array(ext.m);
  let tangent = result.status === 'converged' ? tangentAt(ext, z, cur.t, t, work) : undefined;
  if (tangent?.singular === true) {
    t.set(cur.t);
    tangent = { ok: true, singular: true, detSign: 0, detLog: -Infinity };
    ctx.warnings.push(message.traceBoundBranchPoint(ctx.name, bound));
  }
  if (tangent === undefined || !tangent.ok) {
    ctx.warnings.push(message.traceLandFailed(ctx.name, bound, result.status, result.residual, result.iterations));
    return;
  }
  const step = distance(z, cur.z);
  points.push(rawPoint(ext, z, t, tangent, { residual: result.residual, iterations: result.iterations, step, s: cur.s + step }));
}
