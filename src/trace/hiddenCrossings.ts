/**
 * Whether more eigenvalues crossed the imaginary axis between two consecutive points than the
 * sign-change tests can show. Two real eigenvalues crossing in one step (two branch points or folds)
 * leave det [F_z; tᵀ] with its sign; two complex pairs leave the Hopf test with its sign. The count of
 * unstable eigenvalues still tells: one real crossing changes it by 1, one complex pair by 2 (with the
 * count of unstable complex eigenvalues). So a step is too long when the count changes by 3 or more,
 * or by 2 while the unstable complex count stays (two real crossings). A complex pair turning into two
 * real eigenvalues on one side of the axis leaves the unstable count as it is. Common practice:
 * counting eigenvalues as a check on the test functions.
 */
import { IMAG_TOL, TRACE } from '../defaults.js';
import type { Eigenvalue } from '../types.js';

function unstableCounts(values: readonly Eigenvalue[]): { all: number; complex: number } {
  let size = 1;
  for (const v of values) size = Math.max(size, Math.hypot(v.re, v.im));
  const threshold = TRACE.stabilityTol * size;
  const imagTol = IMAG_TOL * (1 + size);
  let all = 0;
  let complex = 0;
  for (const v of values) {
    if (!(v.re > threshold)) continue;
    all++;
    if (Math.abs(v.im) > imagTol) complex++;
  }
  return { all, complex };
}

export function hiddenCrossings(before: readonly Eigenvalue[], after: readonly Eigenvalue[]): boolean {
  const a = unstableCounts(before);
  const b = unstableCounts(after);
  const change = Math.abs(b.all - a.all);
  return change >= 3 || (change === 2 && b.complex === a.complex);
}
