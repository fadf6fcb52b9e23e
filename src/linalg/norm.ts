/** ‖v‖∞ = max |v_i| (NaN if any entry is NaN; 0 for an empty vector). */
export function normInf(v: Float64Array): number {
  let m = 0;
  for (let i = 0; i < v.length; i++) {
    const a = Math.abs(v[i]!);
    if (!(a <= m)) m = a;
  }
  return m;
}

/** True when every entry is finite. */
export function allFinite(v: Float64Array): boolean {
  for (let i = 0; i < v.length; i++) if (!Number.isFinite(v[i]!)) return false;
  return true;
}

/** Per component, the largest finite |x_i| over the given vectors (0 where there is none). */
export function largestMagnitudes(vectors: readonly Float64Array[], n: number): Float64Array {
  const out = new Float64Array(n);
  for (const x of vectors) {
    for (let i = 0; i < n; i++) {
      const v = Math.abs(x[i]!);
      if (Number.isFinite(v) && v > out[i]!) out[i] = v;
    }
  }
  return out;
}
