/**
 * Dense LU factorisation with partial pivoting, PA = LU (Golub & Van Loan, Matrix Computations,
 * 4th ed., Algorithm 3.4.1), on row-major Float64Array storage. No allocation in the hot path
 * beyond the factor object.
 */

export interface LuFactors {
  n: number;
  /** L (unit lower, below the diagonal) and U (upper), packed row-major. */
  lu: Float64Array;
  /** Row i of the factors is row perm[i] of A. */
  perm: Int32Array;
  /** +1 or -1: the sign of the permutation. */
  permSign: number;
  /** True when a pivot is exactly zero or not finite (the solve would divide by it). */
  singular: boolean;
}

/** Factor a copy of the n×n row-major matrix `a`. */
export function luFactor(a: Float64Array, n: number, into?: LuFactors): LuFactors {
  const f: LuFactors = into ?? { n, lu: new Float64Array(n * n), perm: new Int32Array(n), permSign: 1, singular: false };
  const lu = f.lu;
  lu.set(a.subarray(0, n * n));
  const perm = f.perm;
  for (let i = 0; i < n; i++) perm[i] = i;
  let sign = 1;
  let singular = false;
  for (let k = 0; k < n; k++) {
    let piv = k;
    let best = Math.abs(lu[k * n + k]!);
    for (let i = k + 1; i < n; i++) {
      const v = Math.abs(lu[i * n + k]!);
      if (v > best) {
        best = v;
        piv = i;
      }
    }
    if (piv !== k) {
      for (let j = 0; j < n; j++) {
        const t = lu[k * n + j]!;
        lu[k * n + j] = lu[piv * n + j]!;
        lu[piv * n + j] = t;
      }
      const t = perm[k]!;
      perm[k] = perm[piv]!;
      perm[piv] = t;
      sign = -sign;
    }
    const d = lu[k * n + k]!;
    if (d === 0 || !Number.isFinite(d)) {
      singular = true;
      continue;
    }
    for (let i = k + 1; i < n; i++) {
      const m = lu[i * n + k]! / d;
      lu[i * n + k] = m;
      if (m === 0) continue;
      const ri = i * n;
      const rk = k * n;
      for (let j = k + 1; j < n; j++) lu[ri + j]! -= m * lu[rk + j]!;
    }
  }
  f.permSign = sign;
  f.singular = singular;
  return f;
}

/** Solve A x = b with the factors; writes x into `out` (may alias b). */
export function luSolve(f: LuFactors, b: Float64Array, out: Float64Array): Float64Array {
  const { n, lu, perm } = f;
  const y = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    let s = b[perm[i]!]!;
    const ri = i * n;
    for (let j = 0; j < i; j++) s -= lu[ri + j]! * y[j]!;
    y[i] = s;
  }
  for (let i = n - 1; i >= 0; i--) {
    let s = y[i]!;
    const ri = i * n;
    for (let j = i + 1; j < n; j++) s -= lu[ri + j]! * y[j]!;
    y[i] = s / lu[ri + i]!;
  }
  out.set(y);
  return out;
}

/** Solve Aᵀ x = b with the factors of A. */
export function luSolveTransposed(f: LuFactors, b: Float64Array, out: Float64Array): Float64Array {
  const { n, lu, perm } = f;
  // Aᵀ = Uᵀ Lᵀ P, so solve Uᵀ z = b, Lᵀ w = z, x = Pᵀ w.
  const z = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    let s = b[i]!;
    for (let j = 0; j < i; j++) s -= lu[j * n + i]! * z[j]!;
    z[i] = s / lu[i * n + i]!;
  }
  for (let i = n - 1; i >= 0; i--) {
    let s = z[i]!;
    for (let j = i + 1; j < n; j++) s -= lu[j * n + i]! * z[j]!;
    z[i] = s;
  }
  for (let i = 0; i < n; i++) out[perm[i]!] = z[i]!;
  return out;
}

/**
 * Determinant as sign and log|det| (never overflows). `sign` is 0 for a singular matrix.
 */
export function luDeterminant(f: LuFactors): { sign: number; logAbs: number } {
  let sign = f.permSign;
  let logAbs = 0;
  for (let i = 0; i < f.n; i++) {
    const d = f.lu[i * f.n + i]!;
    if (d === 0 || !Number.isFinite(d)) return { sign: 0, logAbs: -Infinity };
    if (d < 0) sign = -sign;
    logAbs += Math.log(Math.abs(d));
  }
  return { sign, logAbs };
}
