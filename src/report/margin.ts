import type { Branch, Margin, MarginSide, SpecialPoint, Trace } from '../types.js';

export interface MarginOptions {
  parameter: string;
  nominal: number;
  warnMargin: number;
  failMargin: number;
  operatingState?: Float64Array;
}

/** Where a branch passes the nominal value: between points k and k+1, at fraction t. */
interface Crossing {
  branch: Branch;
  /** k + t, a fractional point index along the branch. */
  position: number;
  state: Float64Array;
}

/**
 * The design margin: how far the nominal value of the varied parameter is from the nearest special
 * points on the branch the plant runs on.
 *
 * - Operating branch: with `operatingState`, the crossing of λ = nominal (states interpolated linearly
 *   between neighbouring points) nearest to it in the scaled distance Σ((x_i − o_i)/max(|o_i|, 1))²,
 *   over all branches. Without it, the first crossing in arclength order on the first branch that
 *   started from an equilibrium (origin "start") and spans the nominal value.
 * - Sides: walking along that branch from the operating point, the first special point in each
 *   direction. A special point found on another branch counts where this branch passes through it
 *   (a branch point, seen from the branch switched to, or a branch that ends on a state bound
 *   exactly where it meets the washout branch there). Between special points the parameter moves
 *   monotonically (folds are special points), so the two lie on opposite sides of the nominal value;
 *   each is filed as below or above by its parameter (should both fall on one side, the nearer is kept).
 * - distance = |λ_special − nominal|, relative = distance/|nominal| (distance itself when nominal = 0).
 * - status: "fail" if the smaller relative distance < failMargin, "warn" if < warnMargin, else "ok";
 *   "nominal outside range" when no traced branch passes the nominal value; "no special point" when
 *   the operating branch has none.
 */
export function computeMargin(trace: Trace, opts: MarginOptions): Margin {
  const base = {
    parameter: opts.parameter, nominal: opts.nominal, warnMargin: opts.warnMargin, failMargin: opts.failMargin,
  };
  const crossing = operatingCrossing(trace, opts);
  if (crossing === null) {
    return {
      ...base, branch: null, operatingStable: null, operatingUnstableCount: null, below: null, above: null,
      nearestRelative: null, status: 'nominal outside range',
    };
  }
  const { below, above } = nearestSides(crossing, trace, opts.nominal);
  const sides = [below, above].filter((s): s is MarginSide => s !== null);
  const nearestRelative = sides.length === 0 ? null : Math.min(...sides.map((s) => s.relative));
  const status: Margin['status'] = nearestRelative === null ? 'no special point'
    : nearestRelative < opts.failMargin ? 'fail'
      : nearestRelative < opts.warnMargin ? 'warn' : 'ok';
  // Stability at the crossing: the less stable of the two points around it (common practice: a point
  // between an unstable and a stable one is next to a special point and counts as unstable).
  const k = Math.floor(crossing.position);
  const around = [crossing.branch.points[k], crossing.branch.points[Math.min(k + 1, crossing.branch.points.length - 1)]]
    .filter((q) => q !== undefined);
  const operatingUnstableCount = Math.max(...around.map((q) => q.unstableCount));
  const operatingStable = around.every((q) => q.stable);
  return { ...base, branch: crossing.branch.id, operatingStable, operatingUnstableCount, below, above, nearestRelative, status };
}

function operatingCrossing(trace: Trace, opts: MarginOptions): Crossing | null {
  const lo = Math.min(trace.settings.from, trace.settings.to);
  const hi = Math.max(trace.settings.from, trace.settings.to);
  if (!(opts.nominal >= lo && opts.nominal <= hi)) return null;
  const target = opts.operatingState;
  if (target === undefined) {
    for (const b of trace.branches) {
      if (b.origin.kind !== 'start') continue;
      const first = crossings(b, opts.nominal)[0];
      if (first !== undefined) return first;
    }
    return null;
  }
  let best: Crossing | null = null;
  let bestDistance = Infinity;
  for (const b of trace.branches) {
    for (const c of crossings(b, opts.nominal)) {
      const d = scaledDistance(c.state, target);
      if (d < bestDistance) {
        bestDistance = d;
        best = c;
      }
    }
  }
  return best;
}

function crossings(branch: Branch, nominal: number): Crossing[] {
  const pts = branch.points;
  const out: Crossing[] = [];
  if (pts.length === 1 && pts[0]!.parameter === nominal) out.push({ branch, position: 0, state: pts[0]!.state });
  for (let k = 0; k + 1 < pts.length; k++) {
    const a = pts[k]!;
    const b = pts[k + 1]!;
    if ((a.parameter - nominal) * (b.parameter - nominal) > 0) continue;
    if (b.parameter === nominal && k + 2 < pts.length) continue; // counted as the start of the next segment
    const t = a.parameter === b.parameter ? 0 : (nominal - a.parameter) / (b.parameter - a.parameter);
    const state = new Float64Array(a.state.length);
    for (let i = 0; i < state.length; i++) state[i] = (1 - t) * a.state[i]! + t * (b.state[i] ?? a.state[i]!);
    out.push({ branch, position: k + t, state });
  }
  return out;
}

function scaledDistance(x: Float64Array, o: Float64Array): number {
  let sum = 0;
  for (let i = 0; i < o.length; i++) sum += ((x[i]! - o[i]!) / Math.max(Math.abs(o[i]!), 1)) ** 2;
  return sum;
}

/** Fractional index of a special point along its branch. */
function eventPosition(e: SpecialPoint, branch: Branch): number {
  const [k] = e.between;
  const a = branch.points[k]?.parameter;
  const b = branch.points[k + 1]?.parameter;
  if (a === undefined || b === undefined || a === b) return k + 0.5;
  return k + Math.min(1, Math.max(0, (e.parameter - a) / (b - a)));
}

function nearestSides(
  crossing: Crossing, trace: Trace, nominal: number,
): { below: MarginSide | null; above: MarginSide | null } {
  let forward: { e: SpecialPoint; gap: number } | null = null;
  let backward: { e: SpecialPoint; gap: number } | null = null;
  const passes = throughPoints(trace);
  for (const e of trace.events) {
    if (!Number.isFinite(e.parameter)) continue;
    const position = e.branch === crossing.branch.id ? eventPosition(e, crossing.branch) : passes(e, crossing.branch);
    if (position === null) continue;
    const gap = position - crossing.position;
    if (gap >= 0 && (forward === null || gap < forward.gap)) forward = { e, gap };
    if (gap < 0 && (backward === null || -gap < backward.gap)) backward = { e, gap: -gap };
  }
  let below: MarginSide | null = null;
  let above: MarginSide | null = null;
  for (const found of [forward, backward]) {
    if (found === null) continue;
    const side = marginSide(found.e, nominal);
    if (found.e.parameter < nominal) {
      if (below === null || side.distance < below.distance) below = side;
    } else if (above === null || side.distance < above.distance) {
      above = side;
    }
  }
  return { below, above };
}

/**
 * Where a branch passes through a special point found on another branch: the index of its point
 * at the special point (parameter within 1e-7 of max(|λ|, a thousandth of the range), every state
 * within 1e-6 of its largest size over the trace: both are located to about 1e-10), or null.
 */
function throughPoints(trace: Trace): (e: SpecialPoint, branch: Branch) => number | null {
  const range = Math.abs(trace.settings.to - trace.settings.from);
  const n = trace.branches[0]?.points[0]?.state.length ?? 0;
  const size = new Float64Array(n);
  for (const b of trace.branches) {
    for (const q of b.points) for (let i = 0; i < n; i++) size[i] = Math.max(size[i]!, Math.abs(q.state[i]!));
  }
  return (e, branch) => {
    const pts = branch.points;
    for (let k = 0; k < pts.length; k++) {
      const q = pts[k]!;
      if (Math.abs(q.parameter - e.parameter) > 1e-7 * Math.max(Math.abs(e.parameter), 1e-3 * range)) continue;
      let same = true;
      for (let i = 0; i < n && same; i++) same = Math.abs(q.state[i]! - e.state[i]!) <= 1e-6 * (size[i]! || 1);
      if (same) return k;
    }
    return null;
  };
}

function marginSide(e: SpecialPoint, nominal: number): MarginSide {
  const distance = Math.abs(e.parameter - nominal);
  return {
    event: e.id, type: e.type, parameter: e.parameter, distance,
    relative: nominal === 0 ? distance : distance / Math.abs(nominal),
  };
}
