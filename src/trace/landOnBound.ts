/**
 * The last point of a branch that leaves the parameter range: Newton's method on f(x, λ_b) = 0 with
 * λ fixed at the bound λ_b, started from the linear interpolation of the last point inside and the
 * first point outside, so the stored point lies exactly on the bound.
 */
import type { NewtonResult } from '../types.js';
import type { ExtendedSystem } from './extendedSystem.js';
import { solveAt } from './solveAt.js';

export function landOnBound(
  ext: ExtendedSystem, inside: Float64Array, outside: Float64Array, bound: number,
  opts: { absTol: number; maxIter: number },
): { z: Float64Array; result: NewtonResult } {
  const { n } = ext;
  const li = inside[n]!;
  const lo = outside[n]!;
  const theta = (bound - li) / (lo - li);
  const guess = new Float64Array(ext.m);
  for (let j = 0; j < ext.m; j++) guess[j] = inside[j]! + theta * (outside[j]! - inside[j]!);
  const result = solveAt(ext, ext.stateOf(guess), bound, opts);
  return { z: ext.unknownOf(result.x, bound), result };
}
