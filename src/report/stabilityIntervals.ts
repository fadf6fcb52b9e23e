import type { Branch, ReportBranch, SpecialPoint } from '../types.js';

export type StabilityInterval = ReportBranch['stability'][number];

/**
 * Maximal runs of equal stability and equal number of unstable eigenvalues along a branch, in
 * arclength order (so the saddle part between two folds and the unstable part beyond them are
 * separate runs). Where stability changes between
 * points k and k+1, the boundary is the parameter of a special point located between them (if the
 * trace found one), else the parameter of point k+1. `from`/`to` follow arclength, so `from > to`
 * on a part of the branch that runs backwards after a fold. `unstableCount` is the number of
 * unstable eigenvalues in the run.
 */
export function stabilityIntervals(branch: Branch, events: readonly SpecialPoint[]): StabilityInterval[] {
  const points = branch.points;
  const first = points[0];
  if (first === undefined) return [];
  const runs: StabilityInterval[] = [];
  let current: StabilityInterval = {
    stable: first.stable, from: first.parameter, to: first.parameter, unstableCount: first.unstableCount,
  };
  for (let k = 1; k < points.length; k++) {
    const p = points[k]!;
    if (p.stable === current.stable && p.unstableCount === current.unstableCount) {
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
