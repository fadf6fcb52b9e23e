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
