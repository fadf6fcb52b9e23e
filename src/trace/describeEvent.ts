/**
 * What a located special point is, beyond its location:
 *   fold        → quadratic normal-form coefficient a (src/detect/foldCoefficient.ts);
 *   Hopf        → first Lyapunov coefficient l1, criticality (l1 < 0 supercritical, l1 > 0
 *                 subcritical, |l1| at rounding level degenerate), frequency ω and period 2π/ω
 *                 (src/detect/hopfCoefficient.ts);
 *   branch point → transcritical or pitchfork from the branching equation, with the direction of
 *                 the other branch (branchDirections.ts); 'branch-point' when that fails.
 */
import { foldCoefficient } from '../detect/foldCoefficient.js';
import { lyapunovCoefficient } from '../detect/hopfCoefficient.js';
import type { Criticality, EventType } from '../types.js';
import { branchDirections } from './branchDirections.js';
import type { FoundEvent } from './detectEvents.js';
import type { ExtendedSystem } from './extendedSystem.js';
import type { Workspace } from './workspace.js';

export interface EventDescription {
  type: EventType;
  foldCoefficient?: number;
  lyapunov?: number;
  criticality?: Criticality;
  frequency?: number;
  period?: number;
  /** Branch points: unit tangent of the other branch (scaled coordinates), when found. */
  direction?: Float64Array;
}

/**
 * `tBefore` is the unit tangent at the branch point before the event: at a located branch point
 * the tangent solve is singular, so `found.located.t` means nothing there.
 */
export function describeEvent(ext: ExtendedSystem, work: Workspace, found: FoundEvent, tBefore: Float64Array): EventDescription {
  const { z } = found.located;
  ext.load(z);
  const x = ext.x.slice();
  const p = ext.p.slice();
  if (found.type === 'fold') {
    const fold = foldCoefficient(ext.system, x, p);
    return Number.isFinite(fold.a) ? { type: 'fold', foldCoefficient: fold.a } : { type: 'fold' };
  }
  if (found.type === 'hopf') {
    const hopf = lyapunovCoefficient(ext.system, x, p);
    const out: EventDescription = { type: 'hopf' };
    if (Number.isFinite(hopf.omega)) {
      out.frequency = hopf.omega;
      out.period = hopf.period;
    }
    if (Number.isFinite(hopf.l1)) {
      out.lyapunov = hopf.l1;
      out.criticality = hopf.criticality;
    }
    return out;
  }
  const split = branchDirections(ext, work, z, tBefore);
  return split.direction === null ? { type: split.kind } : { type: split.kind, direction: split.direction };
}
