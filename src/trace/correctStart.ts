/**
 * A start equilibrium made exact: Newton's method at its fixed parameter value λ (usually `from`)
 * (src/solve/newton.ts), then the first branch point with its tangent oriented toward `to`
 * (startPoint.ts). Returns a warning text when either step fails. A start on a branch point has
 * no unique direction: it moves TRACE.startNudge of the range toward `to` (with a note when it was
 * an end of the range: the branches that cross there are then not switched to from this start).
 */
import { NEWTON, TRACE } from '../defaults.js';
import { message } from '../errors.js';
import type { NewtonResult, TraceSettings } from '../types.js';
import type { ExtendedSystem } from './extendedSystem.js';
import type { RawPoint } from './rawPoint.js';
import { solveAt } from './solveAt.js';
import { startPoint } from './startPoint.js';
import type { Workspace } from './workspace.js';

export function correctStart(
  ext: ExtendedSystem, work: Workspace, x0: Float64Array, lambda: number, settings: TraceSettings, name: string,
): { point: RawPoint; note?: string } | string {
  const { from, to } = settings;
  const newtonOpts = { absTol: settings.absTol, maxIter: NEWTON.maxIter };
  const solved = solveAt(ext, x0, lambda, newtonOpts);
  if (solved.status !== 'converged') {
    return message.traceStartFailed(name, lambda, solved.status, solved.residual, solved.iterations);
  }
  const toward = new Float64Array(ext.m);
  toward[ext.n] = to >= from ? 1 : -1;
  const first = (r: NewtonResult, at: number) =>
    startPoint(ext, ext.unknownOf(r.x, at), toward, work, { residual: r.residual, iterations: r.iterations });
  const start = first(solved, lambda);
  if (start !== null) return { point: start };
  // Derivatives that are not finite there (a power of a negative state with the varied exponent, a
  // logarithm at 0): the equilibrium cannot be followed, and nudging would not help.
  if (!ext.jacobian(ext.unknownOf(solved.x, lambda), work.a)) {
    const states = ext.system.info.states.map((q, i) => `${q.name} = ${solved.x[i]}`).join(', ');
    return message.traceStartNotFinite(name, lambda, states);
  }
  // No unique direction: the start is a branch point. Start a little further into the range
  // instead (a branch point inside the range is then found as usual, from both sides).
  const nudged = lambda + TRACE.startNudge * (to - from);
  const moved = solveAt(ext, solved.x, nudged, newtonOpts);
  const point = moved.status === 'converged' ? first(moved, nudged) : null;
  if (point === null) return message.traceNoTangent(name, lambda);
  const atEnd = lambda === from || lambda === to;
  return atEnd ? { point, note: message.traceBoundBranchPoint(name, lambda) } : { point };
}
