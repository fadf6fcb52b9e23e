/**
 * Bracketed scalar root finding for test functions along a branch, g(s) with s the arclength.
 *
 * Brent's method (R. P. Brent, Algorithms for Minimization without Derivatives, 1973, ch. 4,
 * procedure `zero`): inverse quadratic interpolation or the secant step when they stay well
 * inside the bracket and shrink it fast enough, bisection otherwise. The bracket [b, c] always
 * keeps g(b)·g(c) ≤ 0, so convergence is guaranteed for any function that changes sign, even a
 * discontinuous one; the number of evaluations is at most about (log2((b − a)/tol))².
 *
 * Stopping rule: |c − b| / 2 ≤ 2·ε·|b| + tol/2 (ε = machine epsilon), or g(b) = 0.
 */

export type RootStatus = 'converged' | 'max-iter' | 'no-bracket' | 'non-finite';

export interface RootResult {
  /** Best estimate of the root (the bracket end with the smaller |g|). */
  s: number;
  /** g at `s`. */
  g: number;
  /** Evaluations of g made here (the two end values are supplied by the caller). */
  iterations: number;
  status: RootStatus;
  /** Width of the final bracket |c − b| (0 when an end value is exactly 0). */
  bracketWidth: number;
}

export interface RootOptions {
  /** Absolute tolerance on s. */
  tol: number;
  /** Most evaluations of g. */
  maxIter: number;
}

/**
 * Root of `g` in [a, b], given ga = g(a) and gb = g(b) with opposite signs. Returns status
 * 'no-bracket' (s = the end with smaller |g|) when they have the same sign, 'non-finite' when g
 * returns NaN or ±Infinity, 'max-iter' when the budget runs out before the stopping rule holds.
 */
export function locateRoot(
  g: (s: number) => number, a: number, b: number, ga: number, gb: number, opts: RootOptions,
): RootResult {
  if (!Number.isFinite(ga) || !Number.isFinite(gb) || !Number.isFinite(a) || !Number.isFinite(b)) {
    return { s: b, g: gb, iterations: 0, status: 'non-finite', bracketWidth: Math.abs(b - a) };
  }
  if (ga === 0) return { s: a, g: 0, iterations: 0, status: 'converged', bracketWidth: 0 };
  if (gb === 0) return { s: b, g: 0, iterations: 0, status: 'converged', bracketWidth: 0 };
  if (Math.sign(ga) === Math.sign(gb)) {
    const useA = Math.abs(ga) < Math.abs(gb);
    return { s: useA ? a : b, g: useA ? ga : gb, iterations: 0, status: 'no-bracket', bracketWidth: Math.abs(b - a) };
  }
  let c = a;
  let gc = ga;
  let d = b - a;
  let e = d;
  let iterations = 0;
  for (;;) {
    if (Math.sign(gb) === Math.sign(gc)) {
      c = a;
      gc = ga;
      d = b - a;
      e = d;
    }
    if (Math.abs(gc) < Math.abs(gb)) {
      a = b;
      b = c;
      c = a;
      ga = gb;
      gb = gc;
      gc = ga;
    }
    const tol1 = 2 * Number.EPSILON * Math.abs(b) + 0.5 * opts.tol;
    const m = 0.5 * (c - b);
    if (Math.abs(m) <= tol1 || gb === 0) {
      return { s: b, g: gb, iterations, status: 'converged', bracketWidth: Math.abs(c - b) };
    }
    if (iterations >= opts.maxIter) {
      return { s: b, g: gb, iterations, status: 'max-iter', bracketWidth: Math.abs(c - b) };
    }
    if (Math.abs(e) >= tol1 && Math.abs(ga) > Math.abs(gb)) {
      // Interpolation step: secant when only two distinct points, else inverse quadratic.
      const r1 = gb / ga;
      let num: number;
      let den: number;
      if (a === c) {
        num = 2 * m * r1;
        den = 1 - r1;
      } else {
        const r2 = ga / gc;
        const r3 = gb / gc;
        num = r1 * (2 * m * r2 * (r2 - r3) - (b - a) * (r3 - 1));
        den = (r2 - 1) * (r3 - 1) * (r1 - 1);
      }
      if (num > 0) den = -den;
      else num = -num;
      if (2 * num < Math.min(3 * m * den - Math.abs(tol1 * den), Math.abs(e * den))) {
        e = d;
        d = num / den;
      } else {
        d = m;
        e = m;
      }
    } else {
      d = m;
      e = m;
    }
    a = b;
    ga = gb;
    b += Math.abs(d) > tol1 ? d : m > 0 ? tol1 : -tol1;
    gb = g(b);
    iterations++;
    if (!Number.isFinite(gb)) {
      return { s: b, g: gb, iterations, status: 'non-finite', bracketWidth: Math.abs(c - b) };
    }
  }
}
