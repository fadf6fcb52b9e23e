/**
 * A start equilibrium made exact: Newton's method at its fixed parameter value λ (usually `from`)
 * (src/solve/newton.ts), then the first branch point with its tangent oriented toward `to`
 * (startPoint.ts). Returns a warning text when either step fails.
 */
import { NEWTON } from '../defaults.js';
import { message } from '../errors.js';
import { newton } from '../solve/newton.js';
import type { TraceSettings } from '../types.js';
import type { ExtendedSystem } from './extendedSystem.js';
import type { RawPoint } from './rawPoint.js';
import { startPoint } from './startPoint.js';
import type { Workspace } from './workspace.js';

export function correctStart(
  ext: ExtendedSystem, work: Workspace, x0: Float64Array, lambda: number, settings: TraceSettings, name: string,
): RawPoint | string {
  const { from, to } = settings;
  const p = ext.p.slice();
  p[ext.k] = lambda;
  const result = newton(
    (x, out) => ext.system.rhs(x, p, out),
    (x, out) => ext.system.jacobian(x, p, out),
    x0,
    { absTol: settings.absTol, maxIter: NEWTON.maxIter },
  );
  if (result.status !== 'converged') {
    return message.traceStartFailed(name, lambda, result.status, result.residual, result.iterations);
  }
  const toward = new Float64Array(ext.m);
  toward[ext.n] = to >= from ? 1 : -1;
  const z = ext.unknownOf(result.x, lambda);
  const start = startPoint(ext, z, toward, work, { residual: result.residual, iterations: result.iterations });
  return start ?? message.traceNoTangent(name, lambda);
}
