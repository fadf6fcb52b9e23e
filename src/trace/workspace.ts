/** Buffers shared by the corrector, the tangent solve and the locators: allocated once per trace. */
import type { LuFactors } from '../linalg/lu.js';
import { distance, segmentDistance } from '../linalg/vector.js';

export interface Workspace {
  /** Extended residual (F, arclength equation), length m. */
  f: Float64Array;
  /** Bordered matrix [F_z; rowᵀ], m×m row-major. */
  a: Float64Array;
  lu: LuFactors;
  /** Newton step or tangent solution, length m. */
  dz: Float64Array;
  /** The unit vector e_m (right-hand side of the tangent solve). */
  em: Float64Array;
}

export function makeWorkspace(m: number): Workspace {
  const em = new Float64Array(m);
  em[m - 1] = 1;
  return {
    f: new Float64Array(m),
    a: new Float64Array(m * m),
    lu: { n: m, lu: new Float64Array(m * m), perm: new Int32Array(m), permSign: 1, singular: false },
    dz: new Float64Array(m),
    em,
  };
}

/**
 * Whether z lies within a quarter of |b − a| of the segment [a, b]: a point already located is
 * inside the bracket between two consecutive branch points (the quarter allows for curvature).
 */
export function nearSegment(z: Float64Array, a: Float64Array, b: Float64Array): boolean {
  return segmentDistance(z, a, b) <= 0.25 * distance(a, b);
}
