/**
 * The continuation stage: every equilibrium branch through the start equilibria, with its
 * special points, and the branches that cross them (one queue, no recursion).
 *
 *   starts ─correctStart→ first point ─traceBothWays→ branch ─detectEvents→ located events
 *          ─describeEvent→ fold / Hopf coefficients, branch-point type and the other direction
 *          ─switchStart→ first point of a new branch → back into the queue
 *
 * Coordinates are scaled (stateWeights.ts). A start or switched branch whose first point lies on
 * an already traced branch is skipped (onTracedBranch.ts); a branch point seen again from the
 * branch started there is not reported twice. Events are sorted by branch, then arclength, and
 * numbered in that order. `hooks.shouldStop` ends the trace: the running branch is kept with
 * stop 'interrupted' and everything finished before it is returned.
 */
import { TRACE } from '../defaults.js';
import { message } from '../errors.js';
import { normInf } from '../linalg/norm.js';
import { distance } from '../linalg/vector.js';
import type { Branch, SpecialPoint, System, Trace, TraceHooks, TraceSettings } from '../types.js';
import { atCorner, cornerScratch } from './corner.js';
import { correctStart } from './correctStart.js';
import { describeEvent } from './describeEvent.js';
import { detectEvents, type FoundEvent } from './detectEvents.js';
import { makeExtendedSystem } from './extendedSystem.js';
import { onTracedBranch } from './onTracedBranch.js';
import { reportStops } from './reportStops.js';
import { tracePoint, type RawPoint } from './rawPoint.js';
import { alreadyFound, pendingEvent, type PendingEvent } from './specialPoint.js';
import { stateWeights } from './stateWeights.js';
import { switchBothWays, type Switched } from './switchBothWays.js';
import { traceBothWays } from './traceBothWays.js';
import type { WalkContext } from './walkBranch.js';
import { makeWorkspace, nearSegment } from './workspace.js';

/** A start equilibrium: a state at λ = settings.from, or a state with the parameter value it belongs to. */
export type StartEquilibrium = Float64Array | { state: Float64Array; parameter: number };

type Job = { kind: 'start'; x: Float64Array; parameter: number } | { kind: 'switch'; event: PendingEvent; z: Float64Array; d: Float64Array };

/**
 * Same-point tolerance TRACE.samePoint is generous: on a branch that turns at a branch point the
 * state is only found to about the square root of the parameter accuracy.
 */

/** Which kind a corner is reported as when several test functions jump there. */
const CORNER_RANK: Record<FoundEvent['type'], number> = { fold: 0, hopf: 1, 'branch-point': 2 };

export function traceBranches(
  system: System, params: Float64Array, settings: TraceSettings, starts: readonly StartEquilibrium[], hooks: TraceHooks = {},
): Trace {
  const { from, to, parameterIndex: k } = settings;
  const p = Float64Array.from(params);
  p[k] = from;
  const name = system.info.parameters[k]?.name ?? `parameter ${k}`;
  const range = Math.abs(to - from);
  // The model's own start guesses count as typical sizes too (a state absent at every start).
  const typical = Float64Array.from(system.info.states, (q) => q.start);
  const jobs: Job[] = starts.map((q) => q instanceof Float64Array
    ? { kind: 'start', x: Float64Array.from(q), parameter: from }
    : { kind: 'start', x: Float64Array.from(q.state), parameter: q.parameter });
  const startStates = jobs.map((j) => (j.kind === 'start' ? j.x : typical));
  const ext = makeExtendedSystem(system, p, k, stateWeights([...startStates, typical], system.n, from, to));
  const work = makeWorkspace(ext.m);
  const scratch = cornerScratch(ext);
  const warnings: string[] = [];
  const branches: Branch[] = [];
  const traced: RawPoint[][] = [];
  const pending: PendingEvent[] = [];
  const origins = new Map<number, PendingEvent>();
  let computed = 0;
  const ctx: WalkContext = {
    ext, work, settings, lo: Math.min(from, to), hi: Math.max(from, to), name, warnings,
    tick: (_count, parameter) => {
      computed++;
      hooks.onProgress?.({ branch: branches.length + 1, points: computed, parameter, branchesDone: branches.length });
      return hooks.shouldStop?.() ?? false;
    },
  };
  const detectOptions = {
    absTol: settings.absTol, maxIter: settings.maxIter, rootMaxIter: TRACE.locateMaxIter,
    tol: (lambda: number) => TRACE.locateRelTol * Math.max(Math.abs(lambda), 1e-3 * range),
    bounds: [from, to] as const,
  };
  const queue: Job[] = jobs;
  let interrupted = false;
  while (queue.length > 0) {
    const job = queue.shift()!;
    let start: RawPoint;
    let note: string | undefined;
    let switched: Switched | undefined;
    if (job.kind === 'start') {
      const corrected = correctStart(ext, work, job.x, job.parameter, settings, name);
      if (typeof corrected === 'string') {
        warnings.push(corrected);
        continue;
      }
      ({ point: start, note } = corrected);
    } else {
      const made = switchBothWays(ctx, job.z, job.d);
      if (typeof made === 'string') {
        warnings.push(message.traceSwitchFailed(job.event.point.branch + 1, name, job.event.point.parameter, made));
        continue;
      }
      switched = made;
      start = made.first;
    }
    // A switched start is not compared with its parent branch: the two cross there, maybe at a
    // small angle, and the parent is by construction not the other branch.
    const others = job.kind === 'start' ? traced : traced.filter((_, i) => i !== job.event.point.branch);
    if (onTracedBranch(start.z, start.t, others, (h) => TRACE.onBranch * h + 1e-9 * range)) continue;
    if (branches.length >= settings.maxBranches) {
      warnings.push(message.traceBranchLimit(settings.maxBranches));
      break;
    }
    if (note !== undefined) warnings.push(note);
    const id = branches.length;
    computed = 0;
    // A start at the range end walks one way; other starts run both ways; switched branches walk
    // away from their branch point on both sides (switchBothWays.ts).
    const atEnd = job.kind === 'start' && job.parameter === from;
    const walked = switched !== undefined ? switched.walk(settings.maxPoints) : traceBothWays(ctx, start, settings.maxPoints, atEnd ? 1 : 0.5);
    // An equilibrium on a state bound whose branch leaves the bounds on both sides at once (an angle
    // at its bound of −π, a turn away from +π) is no branch within them.
    if (walked.points.length === 1 && walked.stopped === 'state bound') continue;
    traced.push(walked.points);
    reportStops(ext, walked, id + 1, name, warnings); // messages count branches from 1
    branches.push({
      id,
      origin: job.kind === 'start' ? { kind: 'start' } : { kind: 'switch', branch: job.event.point.branch, event: -1 },
      stopped: walked.stopped,
      points: walked.points.map((q, i) => tracePoint(ext, q, i, TRACE.stabilityTol)),
    });
    if (job.kind === 'switch') {
      origins.set(id, job.event);
      job.event.point.newBranches?.push(id);
    }
    if (walked.stopped === 'interrupted') {
      interrupted = true;
      break;
    }
    // Not again: a branch point already found (seen from the crossing branch), nor a turn of a
    // switched branch at the branch point it started from (a pitchfork, not a fold).
    const centre = walked.centre;
    const skip = (type: string, a: RawPoint, b: RawPoint): boolean =>
      (type === 'branch-point' && pending.some((e) => e.found === type && nearSegment(e.z, a.z, b.z))) ||
      (type === 'fold' && centre !== undefined && (a === centre || b === centre));
    const { events, failures } = detectEvents(ext, work, walked.points, { ...detectOptions, skip });
    for (const f of failures) {
      const [a, b] = f.between.map((i) => walked.points[i]!.z[ext.n]!) as [number, number];
      warnings.push(message.traceLocateFailed(eventWords(f.type), id + 1, name, a, b, f.status));
    }
    const same = (z: Float64Array) => TRACE.samePoint * Math.max(range, normInf(z));
    const fresh = events.filter((found) => !alreadyFound(pending, found.type, found.located.z, same(found.located.z)));
    // On a switch of the model the eigenvalues jump: no normal form, no second branch to switch to.
    // Several test functions jump at one corner; it is reported once: as a fold, else a Hopf point.
    const onCorner = new Set(fresh.filter((found) => atCorner(ext, found.located.z, walked.points[found.between[0]]!.t, range, scratch)));
    const cornerFirst = (a: FoundEvent, b: FoundEvent) => CORNER_RANK[a.type] - CORNER_RANK[b.type];
    for (const found of [...fresh.filter((f) => !onCorner.has(f)), ...fresh.filter((f) => onCorner.has(f)).sort(cornerFirst)]) {
      const z = found.located.z;
      const corner = onCorner.has(found);
      if (alreadyFound(pending, found.type, z, same(z))) continue;
      if (corner && pending.some((e) => e.point.corner === true && distance(e.z, z) <= same(z))) continue;
      const what = corner ? { type: found.type } : describeEvent(ext, work, found, walked.points[found.between[0]]!.t);
      const event = pendingEvent(ext, id, walked.points, found, what);
      if (corner) event.point.corner = true;
      pending.push(event);
      if (what.direction !== undefined) queue.push({ kind: 'switch', event, z: z.slice(), d: what.direction });
      else if (found.type === 'branch-point' && !corner) {
        warnings.push(message.traceSwitchFailed(id + 1, name, event.point.parameter, 'the two branch directions could not be computed'));
      }
    }
  }
  const events = numberEvents(pending, branches, origins);
  // The same warning from several walks (both ends of a branch, a bound reached twice) is said once.
  return { settings: { ...settings }, ...countFromOne(branches, events), warnings: [...new Set(warnings)], interrupted };
}

/**
 * Branches and special points are numbered 1, 2, ... for people (reports, diagrams, messages say
 * "branch 1"); inside the trace they are array indices from 0.
 */
function countFromOne(branches: Branch[], events: SpecialPoint[]): Pick<Trace, 'branches' | 'events'> {
  return {
    branches: branches.map((b) => ({
      ...b,
      id: b.id + 1,
      origin: b.origin.kind === 'start' ? b.origin : { kind: 'switch', branch: b.origin.branch + 1, event: b.origin.event + 1 },
    })),
    events: events.map((e) => ({
      ...e,
      id: e.id + 1,
      branch: e.branch + 1,
      ...(e.newBranches !== undefined && { newBranches: e.newBranches.map((b) => b + 1) }),
    })),
  };
}

/** Sorts by branch, then arclength; numbers from 0; points switched branches at their event. */
function numberEvents(pending: PendingEvent[], branches: Branch[], origins: Map<number, PendingEvent>): SpecialPoint[] {
  const sorted = [...pending].sort((a, b) => a.point.branch - b.point.branch || a.s - b.s);
  const ids = new Map(sorted.map((e, id) => [e, id]));
  for (const [branch, event] of origins) {
    const origin = branches[branch]!.origin;
    if (origin.kind === 'switch') origin.event = ids.get(event)!;
  }
  return sorted.map((e, id) => ({ id, ...e.point }));
}

function eventWords(type: string): string {
  return type === 'hopf' ? 'Hopf point' : type === 'fold' ? 'fold' : 'branch point';
}
