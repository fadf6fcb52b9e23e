/**
 * The first point of a branch: an equilibrium z with its unit tangent, the null vector of F_z.
 * The tangent comes from the bordered system with row e_λ (Keller 1977, §3) or, when that is
 * singular (z is a fold), with a fixed irregular row; one more solve with the tangent itself as
 * the row makes the result well conditioned. Orientation: t·`toward` ≥ 0.
 */
import type { ExtendedSystem } from './extendedSystem.js';
import { rawPoint, type RawPoint } from './rawPoint.js';
import { tangentAt } from './tangentAt.js';
import { dot } from '../linalg/vector.js';
import type { Workspace } from './workspace.js';

export function startPoint(
  ext: ExtendedSystem, z: Float64Array, toward: Float64Array, work: Workspace,
  diag: { residual: number; iterations: number },
): RawPoint | null {
  const { m } = ext;
  const t = new Float64Array(m);
  const row = new Float64Array(m);
  row[m - 1] = 1;
  let tangent = tangentAt(ext, z, row, t, work);
  if (!tangent.ok) {
    for (let j = 0; j < m; j++) row[j] = 1 + (0.618 * (j + 1)) % 1;
    tangent = tangentAt(ext, z, row, t, work);
  }
  if (!tangent.ok) return null;
  if (dot(t, toward) < 0) for (let j = 0; j < m; j++) t[j] = -t[j]!;
  row.set(t);
  tangent = tangentAt(ext, z, row, t, work);
  if (!tangent.ok) return null;
  return rawPoint(ext, z, t, tangent, { ...diag, step: 0, s: 0 });
}
