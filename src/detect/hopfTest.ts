/**
 * Hopf test functions on eigenvalue lists (Kuznetsov, Elements of Applied Bifurcation Theory,
 * 3rd ed., §10.2: the bialternate-product test function ψ = ∏_{i<j} (λ_i + λ_j)).
 *
 * ψ vanishes when a complex pair λ, λ̄ sits on the imaginary axis (λ + λ̄ = 2 Re λ = 0) — a Hopf
 * point — but also when two real eigenvalues λ, −λ add to zero: a neutral saddle, which is NOT a
 * Hopf point. Its sign is ∏_{pairs} sign(Re λ) · ∏_{real i<j} sign(λ_i + λ_j), because every other
 * factor comes with its complex conjugate and contributes |·|² > 0. The product itself over- and
 * underflows for n in the tens; `hopfTest` returns sign(ψ) · min_{i<j} |λ_i + λ_j| instead. That
 * is continuous in the matrix (its sign can only flip where some factor, hence the minimum, is 0)
 * and it has the same zeros and sign changes as ψ, without overflow for any n.
 *
 * How src/trace/detectEvents.ts uses these between consecutive branch points P0, P1 (eigenvalues
 * e0, e1):
 *  1. detect: `hopfBetween(e0, e1, tol)` — the number of complex eigenvalues with positive real
 *     part (`complexUnstableCount`) changes AND hopfTest changes sign or a complex pair is seen to
 *     cross (`crossingMatch`). A neutral saddle flips the sign without changing that count; two
 *     real unstable eigenvalues that merge into a complex pair change the count without flipping the
 *     sign or crossing. Neither is reported. (A neutral saddle inside the same step as a Hopf point
 *     cancels the sign change; the crossing pair still shows it.)
 *  2. locate: `crossingMatch` matches the complex eigenvalues at P0 with those at P1
 *     (`matchComplex`: nearest pairs first, each eigenvalue used once) and takes a matched pair whose
 *     real part changes sign (a pair nearer the axis that does not cross is passed over). The root is
 *     located along the branch on the real part of that eigenvalue, followed from its value at P0
 *     to its value at P1 (src/trace/pairRealPart.ts), which is smooth there, not on hopfTest. Without
 *     a crossing match (hopfTest flipped alone), the eigenvalue followed is the one nearest iω, ω the
 *     frequency of `criticalPair` at P0, else P1, and the bracket is dropped unless its real part
 *     changes sign between P0 and P1.
 * src/trace/describeEvent.ts then computes the first Lyapunov coefficient at the located point
 * (`lyapunovCoefficient`, hopfCoefficient.ts).
 */
import type { Eigenvalue } from '../types.js';

/** sign(ψ) · min_{i<j} |λ_i + λ_j| (see the file comment). 1 when n < 2 (no pair can cross). */
export function hopfTest(eigs: readonly Eigenvalue[]): number {
  if (eigs.length < 2) return 1;
  let sign = 1;
  let smallest = Infinity;
  for (let i = 0; i < eigs.length; i++) {
    const a = eigs[i]!;
    if (a.im > 0) sign *= Math.sign(a.re);
    for (let j = i + 1; j < eigs.length; j++) {
      const b = eigs[j]!;
      const re = a.re + b.re;
      const im = a.im + b.im;
      if (a.im === 0 && b.im === 0) sign *= Math.sign(re);
      smallest = Math.min(smallest, Math.hypot(re, im));
    }
  }
  return sign === 0 ? 0 : sign * smallest;
}

/** Number of eigenvalues with |Im| > tol and Re > 0 (even: pairs are counted twice). */
export function complexUnstableCount(eigs: readonly Eigenvalue[], tol: number): number {
  let count = 0;
  for (const e of eigs) if (Math.abs(e.im) > tol && e.re > 0) count++;
  return count;
}

/** The eigenvalue with Im > tol and the smallest |Re| (the pair closest to the axis), or null. */
export function criticalPair(eigs: readonly Eigenvalue[], tol: number): Eigenvalue | null {
  let best: Eigenvalue | null = null;
  for (const e of eigs) {
    if (e.im > tol && (best === null || Math.abs(e.re) < Math.abs(best.re))) best = e;
  }
  return best;
}

/**
 * Matches the eigenvalues with Im > tol of two nearby matrices (the same branch a step apart): of all
 * pairs (v before, w after), the nearest first, each eigenvalue used at most once. Matching each
 * eigenvalue with its own nearest instead can give two of them the same partner, and when a crossing
 * pair lies about as far from its own next value as from a damped mode beside it (−0.0328 + 1.9757i
 * → 0.0072 + 1.9757i beside −0.001 + 2i: 0.04 either way), rounding then decided whether the
 * crossing was seen.
 */
export function matchComplex(before: readonly Eigenvalue[], after: readonly Eigenvalue[], tol: number): [Eigenvalue, Eigenvalue][] {
  const candidates: { d: number; i: number; j: number }[] = [];
  before.forEach((v, i) => {
    if (!(v.im > tol)) return;
    after.forEach((w, j) => {
      if (w.im > tol) candidates.push({ d: Math.hypot(w.re - v.re, w.im - v.im), i, j });
    });
  });
  candidates.sort((a, b) => a.d - b.d);
  const usedBefore = new Set<number>();
  const usedAfter = new Set<number>();
  const matches: [Eigenvalue, Eigenvalue][] = [];
  for (const { i, j } of candidates) {
    if (usedBefore.has(i) || usedAfter.has(j)) continue;
    usedBefore.add(i);
    usedAfter.add(j);
    matches.push([before[i]!, after[j]!]);
  }
  return matches;
}

/**
 * The complex eigenvalue that crosses the imaginary axis between two consecutive points, at both
 * (step 2 of the file comment): of the matches (matchComplex) whose real parts have opposite signs,
 * the one nearest the axis before. Null when no match crosses.
 */
export function crossingMatch(before: readonly Eigenvalue[], after: readonly Eigenvalue[], tol: number): [Eigenvalue, Eigenvalue] | null {
  let best: [Eigenvalue, Eigenvalue] | null = null;
  for (const [v, w] of matchComplex(before, after, tol)) {
    if (!(v.re * w.re < 0)) continue;
    if (best === null || Math.abs(v.re) < Math.abs(best[0].re)) best = [v, w];
  }
  return best;
}

/** The detection rule of step 1 in the file comment, for consecutive branch points. */
export function hopfBetween(before: readonly Eigenvalue[], after: readonly Eigenvalue[], tol: number): boolean {
  if (complexUnstableCount(before, tol) === complexUnstableCount(after, tol)) return false;
  const flips = Math.sign(hopfTest(before)) !== Math.sign(hopfTest(after));
  return flips || crossingMatch(before, after, tol) !== null;
}
