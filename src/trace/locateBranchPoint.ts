/**
 * Locates a branch point between two consecutive branch points a and b, where the test function
 * τ_bp = det [F_z; tᵀ] changes sign (detectEvents.ts).
 *
 * Two stages. First the bracket is narrowed on the branch (locateOnBranch.ts) only to a fraction
 * TRACE.branchPointStartTol of its arclength: closer to the branch point the corrector's
 * hyperplane meets the two crossing branches in a nearly double root, and a corrected point is
 * fixed only to about rounding / |σ − σ*|, so the test function there is noise and the corrector
 * may fail. Then Newton's method on the regular augmented system of refineBranchPoint.ts, started
 * at that point with the left null vector of [F_z; t_aᵀ] there, converges quadratically to the
 * branch point itself. The result is accepted when it lies within the bracket; otherwise the first
 * stage is run again to the full tolerance (the located point is then as good as the corrector
 * allows, or not found).
 */
import { TRACE } from '../defaults.js';
import { borderedNullVector } from './branchDirections.js';
import type { ExtendedSystem } from './extendedSystem.js';
import { locateOnBranch, predictOnBranch, type BranchTest, type Located } from './locateOnBranch.js';
import type { RawPoint } from './rawPoint.js';
import { refineBranchPoint } from './refineBranchPoint.js';
import { tangentAt } from './tangentAt.js';
import { distance } from '../linalg/vector.js';
import type { Workspace } from './workspace.js';

export function locateBranchPoint(
  ext: ExtendedSystem, work: Workspace, a: RawPoint, b: RawPoint, test: BranchTest,
  gA: number, gB: number, opts: { absTol: number; maxIter: number; tol: number; rootMaxIter: number },
): Located {
  const { m } = ext;
  const sigmaB = along(a, b.z);
  const coarseTol = Math.max(opts.tol, TRACE.branchPointStartTol * Math.abs(sigmaB));
  const coarse = locateOnBranch(ext, work, a, b, test, gA, gB, { ...opts, tol: coarseTol });
  const corrected = coarse.status === 'converged' || coarse.status === 'max-iter';
  const z0 = corrected ? coarse.z.slice() : predictOnBranch(a, b, coarse.s, new Float64Array(m));
  const left = new Float64Array(m);
  const chord = distance(a.z, b.z);
  if (borderedNullVector(ext, work, z0, a.t, left) !== null) {
    const refined = refineBranchPoint(ext, z0, left, {
      absTol: opts.absTol, maxIter: TRACE.branchPointMaxIter, stepTol: opts.tol, maxDistance: chord,
    });
    const zb = refined.z;
    const sigma = along(a, zb);
    const margin = 1e-3 * Math.abs(sigmaB);
    const inside = sigma >= Math.min(0, sigmaB) - margin && sigma <= Math.max(0, sigmaB) + margin;
    if (refined.status === 'converged' && inside) {
      const t = new Float64Array(m);
      // Last: leaves f_x at the branch point in ext.jx for the eigenvalues.
      const tangent = tangentAt(ext, zb, a.t, t, work);
      if (!tangent.ok) t.set(corrected ? coarse.t : a.t);
      return {
        status: 'converged', z: zb, t, tangent, residual: refined.residual, s: sigma,
        iterations: coarse.iterations + refined.iterations, g: test(zb, t, tangent),
      };
    }
  }
  return locateOnBranch(ext, work, a, b, test, gA, gB, opts);
}

/** Arclength of z along a's tangent, measured from a. */
function along(a: RawPoint, z: Float64Array): number {
  let s = 0;
  for (let j = 0; j < z.length; j++) s += a.t[j]! * (z[j]! - a.z[j]!);
  return s;
}
