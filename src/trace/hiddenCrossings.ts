/**
 * Whether a step between two consecutive points holds more changes of the eigenvalues than the
 * sign-change tests can tell apart, so that the walker should shorten it:
 *
 *  - Two real eigenvalues crossing the imaginary axis in one step (two branch points or folds) leave
 *    det [F_z; tᵀ] with its sign; two complex pairs leave the Hopf test with its sign. The count of
 *    unstable eigenvalues still tells: one real crossing changes it by 1, one complex pair by 2 (with
 *    the count of unstable complex eigenvalues). So: a change by 3 or more, or by 2 while the unstable
 *    complex count stays (two real crossings).
 *  - A complex pair that turns into two real eigenvalues (or back) does not change the unstable
 *    count, and no single crossing changes the number of complex eigenvalues. Both together in one
 *    step mean a collision beside a crossing: next to a Bogdanov–Takens point a Hopf pair crosses,
 *    turns real and a fold follows within a tiny stretch, and seen from the ends of the step the
 *    Hopf point has vanished.
 *  - One complex pair crosses, but the step moved the eigenvalues about as far as they lie apart, so
 *    which eigenvalue after the step is which before cannot be told (two pairs 0.003 apart, each
 *    moving 0.005): the crossing would be followed from one pair to the other. Unambiguous when the
 *    crossing match (matchComplex) is at most half as long as any other pairing of either end.
 *
 * Common practice: counting eigenvalues as a check on the test functions.
 */
import { IMAG_TOL, TRACE } from '../defaults.js';
import { matchComplex } from '../detect/hopfTest.js';
import type { Eigenvalue } from '../types.js';

/** A crossing match must be at most this share of any other pairing of its ends. Common practice. */
const CLEAR_MATCH = 0.5;

function imagTolOf(values: readonly Eigenvalue[]): number {
  let size = 1;
  for (const v of values) size = Math.max(size, Math.hypot(v.re, v.im));
  return IMAG_TOL * (1 + size);
}

function counts(values: readonly Eigenvalue[]): { unstable: number; unstableComplex: number; complex: number } {
  let size = 1;
  for (const v of values) size = Math.max(size, Math.hypot(v.re, v.im));
  const threshold = TRACE.stabilityTol * size;
  const imagTol = IMAG_TOL * (1 + size);
  let unstable = 0;
  let unstableComplex = 0;
  let complex = 0;
  for (const v of values) {
    const isComplex = Math.abs(v.im) > imagTol;
    if (isComplex) complex++;
    if (!(v.re > threshold)) continue;
    unstable++;
    if (isComplex) unstableComplex++;
  }
  return { unstable, unstableComplex, complex };
}

/**
 * 'crossings': more crossings than the tests can see; 'collision': a pair turning real (or complex)
 * beside a crossing; 'ambiguous': one pair crosses but cannot be followed over the step; null: the
 * step is fine. Only the first is worth a warning when even the smallest step cannot part them (a
 * collision is not a special point, and the crossing beside it is found; an ambiguous crossing is
 * still located, on the nearest match).
 */
export function hiddenCrossings(
  before: readonly Eigenvalue[], after: readonly Eigenvalue[],
): 'crossings' | 'collision' | 'ambiguous' | null {
  const a = counts(before);
  const b = counts(after);
  const change = Math.abs(b.unstable - a.unstable);
  if (change >= 3 || (change === 2 && b.unstableComplex === a.unstableComplex)) return 'crossings';
  if (change > 0 && b.complex !== a.complex) return 'collision';
  if (change === 2 && !clearCrossing(before, after)) return 'ambiguous';
  return null;
}

/** Some complex eigenvalue changes the sign of its real part over the step along a clear match. */
function clearCrossing(before: readonly Eigenvalue[], after: readonly Eigenvalue[]): boolean {
  const tol = Math.max(imagTolOf(before), imagTolOf(after));
  const gap = (v: Eigenvalue, w: Eigenvalue) => Math.hypot(w.re - v.re, w.im - v.im);
  return matchComplex(before, after, tol).some(([v, w]) => {
    if (!(v.re * w.re < 0)) return false;
    const d = gap(v, w);
    const others = [
      ...after.filter((x) => x !== w && x.im > tol).map((x) => gap(v, x)),
      ...before.filter((x) => x !== v && x.im > tol).map((x) => gap(x, w)),
    ];
    return others.every((o) => d <= CLEAR_MATCH * o);
  });
}
