/**
 * A branch found by switching at a branch point z*, walked away from z* on both sides: one walk
 * starts at z* + offset·d, the other at z* − offset·d (switchStart.ts), and the branch is the
 * second walk reversed, then z* itself, then the first walk. Walking away from z* on each side,
 * instead of through it, keeps the walker off the branch it came from: next to z* both branches
 * are close, and a step across z* could land on either (seen where the states and the parameter
 * range differ in size by ten or more). A side whose first point lies beyond a bound the model
 * gives a state (stateBound.ts) is not walked: the branch ends at z* there (a branch meeting the
 * washout branch x = 0 at a transcritical point goes on only where x > 0).
 */
import { TRACE } from '../defaults.js';
import type { StopReason } from '../types.js';
import type { ExtendedSystem } from './extendedSystem.js';
import { rawPoint, reversedPoint, type RawPoint } from './rawPoint.js';
import { beyondBounds, scaledBounds } from './stateBound.js';
import { switchStart } from './switchStart.js';
import { STOP_RANK, traceBothWays, type WalkedBranch } from './traceBothWays.js';
import { normInf } from '../linalg/norm.js';
import { distance } from '../linalg/vector.js';
import { walkBranch, type WalkContext } from './walkBranch.js';

export interface Switched {
  /** The first point on the + side (to check whether the branch is traced already). */
  first: RawPoint;
  /** Walks the branch; `budget` is shared by the two sides. */
  walk: (budget: number) => WalkedBranch;
}

/** The + side's first point and a walker for the whole branch, or the reason the switch failed. */
export function switchBothWays(ctx: WalkContext, zStar: Float64Array, d: Float64Array): Switched | string {
  const { ext, work, settings } = ctx;
  const offset = TRACE.switchOffset * settings.ds;
  const bounds = scaledBounds(ext, Math.abs(settings.to - settings.from));
  const side = (dir: Float64Array): RawPoint | string | 'beyond' => {
    const start = switchStart(ext, work, zStar, dir, offset, settings);
    return typeof start !== 'string' && bounds !== null && beyondBounds(bounds, start.z) ? 'beyond' : start;
  };
  let dir = d;
  let plus = side(dir);
  let minus = side(d.map((v) => -v));
  if (plus === 'beyond' && typeof minus !== 'string') {
    // Only the − side lies within the bounds: walk it as the + side.
    dir = d.map((v) => -v);
    [plus, minus] = [minus, plus];
  }
  if (plus === 'beyond') return 'the new branch leaves the bounds the model gives its states on both sides';
  if (typeof plus === 'string') return plus;
  const first = plus;
  return {
    first,
    walk: (budget) => {
      const mid = centre(ext, zStar, dir);
      if (minus === 'beyond') {
        const one = walkBranch(ctx, first, budget);
        return join([], mid, one.points, 'state bound', one.stopped);
      }
      // Without a start on the − side, walk through z* as before.
      if (typeof minus === 'string') return traceBothWays(ctx, first, budget, 0.5);
      const one = walkBranch(ctx, first, Math.max(2, Math.ceil(budget / 2)));
      // A closed loop came back through z* already: nothing is left for the other side.
      if (one.stopped === 'interrupted' || one.stopped === 'closed loop') return join([], mid, one.points, null, one.stopped);
      const other = walkBranch(ctx, minus, Math.max(2, budget - one.points.length));
      return join(other.points, mid, one.points, other.stopped, one.stopped);
    },
  };
}

/** z* as a point of the new branch: direction d, no branch-point test value (it is singular there). */
function centre(ext: ExtendedSystem, zStar: Float64Array, d: Float64Array): RawPoint {
  const f = new Float64Array(ext.n);
  ext.residual(zStar, f);
  ext.jacobian(zStar, new Float64Array(ext.m * ext.m)); // leaves f_x at z* in ext.jx for the eigenvalues
  return rawPoint(ext, zStar, d, { ok: true, singular: true, detSign: 0, detLog: -Infinity }, {
    residual: normInf(f), iterations: 0, step: 0, s: 0,
  });
}

function join(
  back: readonly RawPoint[], mid: RawPoint, forward: readonly RawPoint[], backStop: StopReason | null, forwardStop: StopReason,
): WalkedBranch {
  const points: RawPoint[] = [...[...back].reverse().map(reversedPoint), mid, ...forward];
  let s = 0;
  for (let i = 0; i < points.length; i++) {
    const step = i === 0 ? 0 : distance(points[i]!.z, points[i - 1]!.z);
    s += step;
    points[i] = { ...points[i]!, s, step };
  }
  const stopped = backStop !== null && STOP_RANK[backStop] > STOP_RANK[forwardStop] ? backStop : forwardStop;
  return { points, stopped, stops: [backStop, forwardStop], centre: points[back.length]! };
}
