/**
 * Bounds the model gives its states (`min`, `max`: a concentration or a population cannot be
 * negative, an angle stays within one turn). A branch ends where a state reaches one, with its
 * last point exactly on the bound, as it does on the ends of the parameter range: what lies beyond
 * has no meaning for the model (a chemostat's biomass below zero after washout) and can run off to
 * infinity. The point is located on the step that crosses the bound like a special point, as the
 * zero of the test function z_i − w_i·bound along the branch (locateOnBranch.ts). Fixing z_i and
 * solving for the rest would be ill-posed exactly where it matters most: a bound such as x = 0 is
 * often itself a branch of equilibria (washout, extinction) that the branch meets at a branch point.
 */
import { stateBounds } from '../equilibria/startPoints.js';
import type { ExtendedSystem } from './extendedSystem.js';
import { locateOnBranch, type Located } from './locateOnBranch.js';
import type { OnBranch } from './rawPoint.js';
import type { Workspace } from './workspace.js';

/** The bounds in scaled coordinates (z_i = w_i x_i), ±Infinity where the model gives none. */
export interface ScaledBounds {
  lo: Float64Array;
  hi: Float64Array;
  /** A state beyond its bound by no more than this (scaled) is still on it: rounding. */
  slack: number;
}

export interface BoundCrossing {
  /** The state, its bound in scaled coordinates, and how far along the step from inside it lies (0..1). */
  index: number;
  value: number;
  fraction: number;
}

/** Rounding allowance, as a fraction of the sweep range (scaled states are of that size: stateWeights.ts). */
const SLACK = 1e-10;

/** null when the model bounds no state. */
export function scaledBounds(ext: ExtendedSystem, range: number): ScaledBounds | null {
  const { lo, hi } = stateBounds(ext.system.info.states);
  if (lo.every((v) => v === -Infinity) && hi.every((v) => v === Infinity)) return null;
  return { lo: lo.map((v, i) => v * ext.w[i]!), hi: hi.map((v, i) => v * ext.w[i]!), slack: SLACK * range };
}

/** Whether z lies beyond a bound (by more than rounding). */
export function beyondBounds(bounds: ScaledBounds, z: Float64Array): boolean {
  for (let i = 0; i < bounds.lo.length; i++) {
    if (z[i]! < bounds.lo[i]! - bounds.slack || z[i]! > bounds.hi[i]! + bounds.slack) return true;
  }
  return false;
}

/** The bound the step from `a` to `b` crosses first, or null when `b` is within every bound. */
export function firstCrossing(bounds: ScaledBounds, a: Float64Array, b: Float64Array): BoundCrossing | null {
  let first: BoundCrossing | null = null;
  for (let i = 0; i < bounds.lo.length; i++) {
    const value = b[i]! < bounds.lo[i]! - bounds.slack ? bounds.lo[i]! : b[i]! > bounds.hi[i]! + bounds.slack ? bounds.hi[i]! : null;
    if (value === null) continue;
    const fraction = Math.min(1, Math.max(0, (value - a[i]!) / (b[i]! - a[i]!)));
    if (first === null || fraction < first.fraction) first = { index: i, value, fraction };
  }
  return first;
}

/** The point where the step from `inside` to `outside` reaches the bound: located on the branch between them. */
export function landOnStateBound(
  ext: ExtendedSystem, work: Workspace, inside: OnBranch, outside: OnBranch, crossing: BoundCrossing,
  opts: { absTol: number; maxIter: number; tol: number; rootMaxIter: number },
): Located {
  const i = crossing.index;
  const test = (z: Float64Array) => z[i]! - crossing.value;
  return locateOnBranch(ext, work, inside, outside, test, test(inside.z), test(outside.z), opts);
}
