/**
 * Pseudo-arclength corrector (Keller 1977, §3; Allgower & Georg 1990, §2.2): Newton's method on
 *
 *   G(z) = [ F(z) ; tᵀ(z − ẑ) ] = 0,   G'(z) = [ F_z(z) ; tᵀ ],
 *
 * where ẑ is the predicted point and t the unit tangent of the predictor. The solution lies on the
 * hyperplane through ẑ orthogonal to t.
 *
 * Stopping rule, checked at every iterate before a step:
 *   converged ⇔ ‖F‖∞ ≤ absTol and (the last step ‖dz‖∞ ≤ stepTol, or no step taken yet and F = 0
 *            exactly, as on a branch x = 0),
 *            or, after at least two steps, ‖F‖∞ stopped falling (not halved by the last step), the last
 *            step is at the rounding level (‖dz‖∞ ≤ 1e-13·max(1, ‖z‖∞)) and ‖F‖∞ ≤ √absTol.
 * stepTol defaults to √absTol·L, L = lengthScale (the sweep range, which the scaled coordinates
 * make the size of every state too: stateWeights.ts) or else max(1, ‖z‖∞); enough while walking,
 * where Newton converges quadratically and leaves an error of about absTol·L. Locators pass a
 * smaller one. A small residual alone says little about the position:
 * absTol is in the model's own units, so a model of tiny states (concentrations of 1e-6 changing
 * by 1e-9 per second) can have a residual below it far from the branch, and so can any model near
 * a branch point (f = λx − x³ near x = 0). The Newton step, measured in the scaled coordinates
 * (stateWeights.ts), decides.
 * Exactly at a branch point the bordered matrix is singular: a point within absTol is kept there.
 * Failures are statuses: 'non-finite', 'singular' (zero pivot), 'stalled' (a Newton step grew,
 * or the iterate moved farther than `maxDistance` from ẑ: the corrector is leaving the branch),
 * 'max-iter'.
 */
import { luFactor, luSolve } from '../linalg/lu.js';
import { normInf } from '../linalg/norm.js';
import type { SolveStatus } from '../types.js';
import type { ExtendedSystem } from './extendedSystem.js';
import { distance } from '../linalg/vector.js';
import type { Workspace } from './workspace.js';

export interface CorrectOptions {
  absTol: number;
  maxIter: number;
  /** Largest allowed distance of the corrected point from the prediction. */
  maxDistance: number;
  /** Largest last Newton step ‖dz‖∞ of a converged point; when given, at least one step is taken. */
  stepTol?: number;
  /** Size of the problem in scaled coordinates that steps are measured against (default max(1, ‖z‖∞)). */
  lengthScale?: number;
}

export interface CorrectOutcome {
  status: SolveStatus;
  iterations: number;
  /** ‖F(z)‖∞ at the returned z. */
  residual: number;
  lastStep: number;
}

/** Corrects `z` (which holds the prediction ẑ on entry, a copy is kept in `zHat`) in place. */
export function correctPoint(
  ext: ExtendedSystem, z: Float64Array, zHat: Float64Array, t: Float64Array, opts: CorrectOptions, work: Workspace,
): CorrectOutcome {
  const { n, m } = ext;
  const { f, a, lu, dz } = work;
  zHat.set(z);
  let lastStep = Infinity;
  let previousStep = Infinity;
  let previousResidual = Infinity;
  for (let it = 0; ; it++) {
    if (!ext.residual(z, f)) return { status: 'non-finite', iterations: it, residual: Infinity, lastStep };
    let c = 0;
    for (let j = 0; j < m; j++) c += t[j]! * (z[j]! - zHat[j]!);
    f[n] = c;
    const residual = normInf(f.subarray(0, n));
    const scale = opts.lengthScale ?? Math.max(1, normInf(z));
    const stepOk = it === 0 ? opts.stepTol === undefined && residual === 0 : lastStep <= (opts.stepTol ?? Math.sqrt(opts.absTol) * scale);
    // Rounding floor: only after two steps that no longer reduce ‖F‖ (a tiny step alone can still
    // be large against small components of z, e.g. near the edge of a model's domain).
    const stagnant = it >= 2 && residual >= 0.5 * previousResidual;
    const roundingFloor = stagnant && lastStep <= 1e-13 * scale && residual <= Math.sqrt(opts.absTol);
    previousResidual = residual;
    if ((residual <= opts.absTol && stepOk) || roundingFloor) {
      return { status: 'converged', iterations: it, residual, lastStep: it === 0 ? 0 : lastStep };
    }
    if (it >= opts.maxIter) return { status: 'max-iter', iterations: it, residual, lastStep };
    if (!ext.jacobian(z, a)) return { status: 'non-finite', iterations: it, residual, lastStep };
    a.set(t, n * m);
    luFactor(a, m, lu);
    if (lu.singular) {
      // Exactly at a branch point the bordered matrix is singular; within absTol that is the answer.
      const status = residual <= opts.absTol ? 'converged' : 'singular';
      return { status, iterations: it, residual, lastStep: it === 0 ? 0 : lastStep };
    }
    luSolve(lu, f, dz);
    for (let j = 0; j < m; j++) z[j] = z[j]! - dz[j]!;
    previousStep = lastStep;
    lastStep = normInf(dz);
    if (!Number.isFinite(lastStep)) return { status: 'non-finite', iterations: it + 1, residual, lastStep };
    const growing = it > 0 && lastStep > previousStep && lastStep > Math.sqrt(opts.absTol) * scale;
    if (growing || distance(z, zHat) > opts.maxDistance) {
      return { status: 'stalled', iterations: it + 1, residual, lastStep };
    }
  }
}
