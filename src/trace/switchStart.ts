/**
 * The first point of a branch started by branch switching: from the branch point z* step
 * `offset` along the other branch's unit tangent d, correct on the hyperplane through that
 * prediction orthogonal to d (correctPoint.ts), and take the tangent there with d as the
 * bordering row, so it points away from z* (Keller 1977, §6; Allgower & Georg 1990, §8.2).
 * Returns the reason as text when the correction fails.
 */
import type { TraceSettings } from '../types.js';
import { correctPoint } from './correctPoint.js';
import type { ExtendedSystem } from './extendedSystem.js';
import { rawPoint, type RawPoint } from './rawPoint.js';
import { tangentAt } from './tangentAt.js';
import type { Workspace } from './workspace.js';

export function switchStart(
  ext: ExtendedSystem, work: Workspace, zStar: Float64Array, d: Float64Array, offset: number, settings: TraceSettings,
): RawPoint | string {
  const { m } = ext;
  const z = new Float64Array(m);
  const zHat = new Float64Array(m);
  for (let j = 0; j < m; j++) z[j] = zStar[j]! + offset * d[j]!;
  const c = correctPoint(ext, z, zHat, d, {
    absTol: settings.absTol, maxIter: 2 * settings.maxIter, maxDistance: offset, lengthScale: Math.abs(settings.to - settings.from),
  }, work);
  if (c.status !== 'converged') return `the corrector ended with status ${c.status}`;
  const t = new Float64Array(m);
  const tangent = tangentAt(ext, z, d, t, work);
  if (!tangent.ok) return 'the tangent of the new branch could not be computed';
  return rawPoint(ext, z, t, tangent, { residual: c.residual, iterations: c.iterations, step: 0, s: 0 });
}
