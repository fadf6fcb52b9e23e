/**
 * A located event as a `SpecialPoint` (without its id, which is given once all branches are
 * done and the events are sorted), plus what the orchestrator needs to sort and compare events.
 */
import type { SpecialPoint } from '../types.js';
import type { EventDescription } from './describeEvent.js';
import type { FoundEvent } from './detectEvents.js';
import type { ExtendedSystem } from './extendedSystem.js';
import type { RawPoint } from './rawPoint.js';
import { distance } from '../linalg/vector.js';

export interface PendingEvent {
  point: Omit<SpecialPoint, 'id'>;
  /** Which test function found it ('branch-point' covers transcritical and pitchfork). */
  found: FoundEvent['type'];
  /** Scaled location, for recognising the same point seen from another branch. */
  z: Float64Array;
  /** Arclength along its branch (sort key). */
  s: number;
}

export function pendingEvent(
  ext: ExtendedSystem, branch: number, points: readonly RawPoint[], found: FoundEvent, what: EventDescription,
): PendingEvent {
  const { z, residual, iterations } = found.located;
  const before = points[found.between[0]]!;
  const point: Omit<SpecialPoint, 'id'> = {
    type: what.type,
    branch,
    parameter: z[ext.n]!,
    state: ext.stateOf(z),
    eigenvalues: found.eigenvalues,
    between: found.between,
    testBefore: found.testBefore,
    testAfter: found.testAfter,
    residual,
    iterations,
  };
  if (what.foldCoefficient !== undefined) point.foldCoefficient = what.foldCoefficient;
  if (what.lyapunov !== undefined) point.lyapunov = what.lyapunov;
  if (what.criticality !== undefined) point.criticality = what.criticality;
  if (what.frequency !== undefined) point.frequency = what.frequency;
  if (what.period !== undefined) point.period = what.period;
  if (found.type === 'branch-point') point.newBranches = [];
  return { point, found: found.type, z: z.slice(), s: before.s + distance(z, before.z) };
}

/** Whether an event of the same kind was already found at (numerically) the same point. */
export function alreadyFound(events: readonly PendingEvent[], found: FoundEvent['type'], z: Float64Array, tol: number): boolean {
  return events.some((e) => e.found === found && distance(e.z, z) <= tol);
}
