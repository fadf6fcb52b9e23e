/**
 * Balancing of a dense real matrix (Parlett & Reinsch 1969, "Balancing a matrix for calculation
 * of eigenvalues and eigenvectors", Numer. Math. 13:293–304; the EISPACK routine `balanc` without
 * the permutation step). A diagonal similarity D⁻¹AD with powers of two (so exact in floating
 * point) makes row and column norms comparable; eigenvalues are unchanged, and the QR iteration's
 * rounding errors, which scale with ‖A‖, shrink for badly scaled models.
 */

const RADIX = 2;
const RADIX_SQUARED = RADIX * RADIX;
/** A sweep stops when no row/column pair improves by more than 5% (Parlett & Reinsch's 0.95). */
const IMPROVEMENT = 0.95;
/** Sweeps are bounded; each sweep changes scale factors by powers of two only. */
const MAX_SWEEPS = 100;

/** Balance the n×n row-major matrix in place. */
export function balanceInPlace(a: Float64Array, n: number): void {
  for (let sweep = 0; sweep < MAX_SWEEPS; sweep++) {
    let changed = false;
    for (let i = 0; i < n; i++) {
      let c = 0;
      let r = 0;
      for (let j = 0; j < n; j++) {
        if (j === i) continue;
        c += Math.abs(a[j * n + i]!);
        r += Math.abs(a[i * n + j]!);
      }
      if (c === 0 || r === 0) continue;
      const s = c + r;
      let f = 1;
      let g = r / RADIX;
      while (c < g) {
        f *= RADIX;
        c *= RADIX_SQUARED;
      }
      g = r * RADIX;
      while (c > g) {
        f /= RADIX;
        c /= RADIX_SQUARED;
      }
      if ((c + r) / f < IMPROVEMENT * s) {
        changed = true;
        const inv = 1 / f;
        for (let j = 0; j < n; j++) a[i * n + j]! *= inv;
        for (let j = 0; j < n; j++) a[j * n + i]! *= f;
      }
    }
    if (!changed) return;
  }
}
