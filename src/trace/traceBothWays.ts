/**
 * A whole branch through a start point: walk forward, then (unless the branch closed into a loop)
 * backward, and join the two walks into one list in arclength order: the backward walk reversed,
 * then the forward walk, arclength shifted to start at 0. The forward walk gets the share
 * `forwardShare` of the point budget; the backward walk gets what is left.
 */
import type { StopReason } from '../types.js';
import { reversedPoint, type RawPoint } from './rawPoint.js';
import { walkBranch, type WalkContext } from './walkBranch.js';

/** Which stop to report for a branch walked both ways: the less ordinary one. */
export const STOP_RANK: Record<StopReason, number> = {
  'left range': 0, 'state bound': 1, 'closed loop': 2, unbounded: 3, 'point budget': 4, corner: 5, 'step too small': 6,
  'non-finite': 7, interrupted: 8,
};

export interface WalkedBranch {
  points: RawPoint[];
  stopped: StopReason;
  /** Per direction, for warnings: [backward, forward]. */
  stops: [StopReason | null, StopReason];
  /** A branch walked away from a branch point on both sides: that point, between the two walks. */
  centre?: RawPoint;
}

export function traceBothWays(ctx: WalkContext, start: RawPoint, maxPoints: number, forwardShare = 1): WalkedBranch {
  const forward = walkBranch(ctx, start, Math.max(2, Math.ceil(forwardShare * maxPoints)));
  if (forward.stopped === 'closed loop' || forward.stopped === 'interrupted') {
    return { points: forward.points, stopped: forward.stopped, stops: [null, forward.stopped] };
  }
  const back = reversedPoint(start);
  const backward = leavesAtOnce(ctx, back)
    ? { points: [back], stopped: 'left range' as const }
    : walkBranch(ctx, back, maxPoints - forward.points.length + 1);
  const points: RawPoint[] = [];
  for (let i = backward.points.length - 1; i >= 1; i--) points.push(reversedPoint(backward.points[i]!));
  points.push(...forward.points);
  const s = points.map((q) => q.s);
  for (let i = 0; i < points.length; i++) {
    // After reversal a point's `step` led to its successor; store the one from its predecessor.
    points[i] = { ...points[i]!, s: s[i]! - s[0]!, step: i === 0 ? 0 : s[i]! - s[i - 1]! };
  }
  const stopped = STOP_RANK[backward.stopped] > STOP_RANK[forward.stopped] ? backward.stopped : forward.stopped;
  return { points, stopped, stops: [backward.stopped, forward.stopped] };
}

/** A start on a range end whose tangent points out of the range (the usual start at `from`). */
function leavesAtOnce(ctx: WalkContext, q: RawPoint): boolean {
  const n = ctx.ext.n;
  const lambda = q.z[n]!;
  const tl = q.t[n]!;
  return (lambda <= ctx.lo && tl < 0) || (lambda >= ctx.hi && tl > 0);
}
