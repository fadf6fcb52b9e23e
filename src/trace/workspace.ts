/** Buffers shared by the corrector, the tangent solve and the locators: allocated once per trace. */
import type { LuFactors } from '../linalg/lu.js';

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

export function dot(u: Float64Array, v: Float64Array): number {
  let s = 0;
  for (let i = 0; i < u.length; i++) s += u[i]! * v[i]!;
  return s;
}

export function distance(u: Float64Array, v: Float64Array): number {
  let s = 0;
  for (let i = 0; i < u.length; i++) {
    const d = u[i]! - v[i]!;
    s += d * d;
  }
  return Math.sqrt(s);
}

/** Euclidean distance from z to the segment [a, b]. */
export function segmentDistance(z: Float64Array, a: Float64Array, b: Float64Array): number {
  let ab = 0;
  let az = 0;
  for (let j = 0; j < z.length; j++) {
    const d = b[j]! - a[j]!;
    ab += d * d;
    az += d * (z[j]! - a[j]!);
  }
  const s = ab > 0 ? Math.min(1, Math.max(0, az / ab)) : 0;
  let r = 0;
  for (let j = 0; j < z.length; j++) r += (z[j]! - a[j]! - s * (b[j]! - a[j]!)) ** 2;
  return Math.sqrt(r);
}

/**
 * Whether z lies within a quarter of |b − a| of the segment [a, b]: a point already located is
 * inside the bracket between two consecutive branch points (the quarter allows for curvature).
 */
export function nearSegment(z: Float64Array, a: Float64Array, b: Float64Array): boolean {
  return segmentDistance(z, a, b) <= 0.25 * distance(a, b);
}
