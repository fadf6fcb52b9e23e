/** Dot product, Euclidean distance, and distance to a segment, for vectors of equal length. */
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
