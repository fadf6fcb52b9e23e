import type { Branch, ReportBranch, SpecialPoint } from '../types.js';

export type StabilityInterval = ReportBranch['stability'][number];

/**
 * Maximal runs of equal stability and equal number of unstable eigenvalues along a branch, in
 * arclength order, each monotone in the parameter: a run also ends where the branch turns back
 * (at a fold, or where a switched branch turns at its pitchfork), so that "from … to" always
 * describes the run (and the saddle part between two folds is not merged with the part beyond).
 * Where stability changes between points k and k+1, the boundary is the parameter of a special
 * point located between them (if the trace found one), else the parameter of point k+1; where the
 * branch turns at point k, the boundary is point k. `from`/`to` follow arclength, so `from > to`
 * on a part of the branch that runs backwards. `unstableCount` is the number of unstable
 * eigenvalues in the run.
 */
export function stabilityIntervals(branch: Branch, events: readonly SpecialPoint[]): StabilityInterval[] {
  const points = branch.points;
  const first = points[0];
  if (first === undefined) return [];
  const runs: StabilityInterval[] = [];
  let current: StabilityInterval = {
    stable: first.stable, from: first.parameter, to: first.parameter, unstableCount: first.unstableCount,
  };
  let direction = 0;
  for (let k = 1; k < points.length; k++) {
    const p = points[k]!;
    const step = Math.sign(p.parameter - points[k - 1]!.parameter);
    // A fold of this branch is a special point there and changes the stability count anyway.
    const turned = step !== 0 && direction !== 0 && step !== direction && !eventNear(branch.id, k, events);
    if (step !== 0) direction = step;
    if (p.stable === current.stable && p.unstableCount === current.unstableCount) {
      if (turned) {
        current.to = turnParameter(branch, k - 1, events);
        runs.push(current);
        current = { ...current, from: current.to };
      }
      current.to = p.parameter;
      continue;
    }
    const boundary = boundaryParameter(branch.id, k - 1, events) ?? p.parameter;
    current.to = boundary;
    runs.push(current);
    current = { stable: p.stable, from: boundary, to: p.parameter, unstableCount: p.unstableCount };
  }
  runs.push(current);
  return runs;
}

function boundaryParameter(branch: number, left: number, events: readonly SpecialPoint[]): number | undefined {
  return events.find((e) => e.branch === branch && e.between[0] === left && Number.isFinite(e.parameter))?.parameter;
}

/** A special point of this branch between points k − 2 and k + 1. */
function eventNear(branch: number, k: number, events: readonly SpecialPoint[]): boolean {
  return events.some((e) => e.branch === branch && e.between[0] >= k - 2 && e.between[0] <= k);
}

/**
 * Where the branch turns at point k: the branch point it was switched at, when the turn lies within
 * one step of it (a switched branch turns at its pitchfork), else the parameter of point k.
 */
function turnParameter(branch: Branch, k: number, events: readonly SpecialPoint[]): number {
  const points = branch.points;
  const at = points[k]!.parameter;
  if (branch.origin.kind !== 'switch') return at;
  const originEvent = branch.origin.event;
  const origin = events.find((e) => e.id === originEvent);
  const step = Math.max(Math.abs(at - (points[k - 1]?.parameter ?? at)), Math.abs(at - (points[k + 1]?.parameter ?? at)));
  return origin !== undefined && Math.abs(origin.parameter - at) <= step ? origin.parameter : at;
}
