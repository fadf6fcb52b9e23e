import { EigenvalueDecomposition, Matrix } from 'ml-matrix';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { eigenvalues, eigenvaluesWithDiagnostics, NonFiniteMatrixError } from '../../src/linalg/eig.js';
import { luDeterminant, luFactor } from '../../src/linalg/lu.js';
import type { Eigenvalue } from '../../src/types.js';
import { repeatable } from '../helpers/repeatable.js';

/** fast-check run number, fixed so failures reproduce. */
const RUN = 20260;

/** Reference computation: ml-matrix's EigenvalueDecomposition (EISPACK hqr2 port). */
function reference(a: Float64Array, n: number): Eigenvalue[] {
  const m = new Matrix(n, n);
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) m.set(i, j, a[i * n + j]!);
  const e = new EigenvalueDecomposition(m, { assumeSymmetric: false });
  return e.realEigenvalues.map((re, i) => ({ re, im: e.imaginaryEigenvalues[i]! }));
}

/** Largest distance from an expected eigenvalue to its nearest unused computed one. */
function mismatch(actual: Eigenvalue[], expected: Eigenvalue[]): number {
  const used = new Set<number>();
  let worst = 0;
  for (const e of expected) {
    let best = Infinity;
    let at = -1;
    actual.forEach((a, k) => {
      const dist = Math.hypot(a.re - e.re, a.im - e.im);
      if (!used.has(k) && dist < best) {
        best = dist;
        at = k;
      }
    });
    used.add(at);
    worst = Math.max(worst, best);
  }
  return worst;
}

function randomMatrix(n: number, stream: number): Float64Array {
  let s = stream;
  return new Float64Array(n * n).map(() => {
    s = (s * 16807) % 2147483647; // Park & Miller 1988 minimal standard generator
    return 2 * (s / 2147483647) - 1;
  });
}

/** Dense random matrices with entries uniform in [−1, 1): eigenvalues are well conditioned there. */
const denseArb = fc.record({ n: fc.integer({ min: 1, max: 20 }), stream: fc.integer({ min: 1, max: 2147483646 }) })
  .map(({ n, stream }) => ({ n, a: randomMatrix(n, stream) }));

/** Any finite entries, with fast-check's bias towards zeros and extremes (sparse, nilpotent-like cases). */
const matrixArb = fc.integer({ min: 1, max: 12 }).chain((n) =>
  fc.array(fc.double({ min: -10, max: 10, noNaN: true }), { minLength: n * n, maxLength: n * n })
    .map((v) => ({ n, a: Float64Array.from(v) })));

function frobenius(a: Float64Array): number {
  return Math.sqrt(a.reduce((s, v) => s + v * v, 0));
}

describe('eigenvalues (Hessenberg + Francis double-shift QR)', () => {
  it('agrees with the ml-matrix reference computation on random matrices', () => {
    fc.assert(fc.property(denseArb, ({ n, a }) => {
      const scale = Math.max(1, frobenius(a));
      expect(mismatch(eigenvalues(a, n), reference(a, n))).toBeLessThan(1e-7 * scale);
    }), repeatable(RUN, 200));
  });

  it('gives eigenvalues that sum to the trace and multiply to the determinant', () => {
    fc.assert(fc.property(matrixArb, ({ n, a }) => {
      const values = eigenvalues(a, n);
      const scale = Math.max(1, frobenius(a));
      let trace = 0;
      for (let i = 0; i < n; i++) trace += a[i * n + i]!;
      const sumRe = values.reduce((s, v) => s + v.re, 0);
      const sumIm = values.reduce((s, v) => s + v.im, 0);
      expect(Math.abs(sumRe - trace)).toBeLessThan(1e-10 * n * scale);
      expect(Math.abs(sumIm)).toBeLessThan(1e-10 * n * scale);
      // Product of eigenvalues (complex), compared with det from LU (Golub & Van Loan Alg. 3.4.1).
      let pr = 1;
      let pi = 0;
      for (const v of values) [pr, pi] = [pr * v.re - pi * v.im, pr * v.im + pi * v.re];
      const det = luDeterminant(luFactor(a, n));
      const detValue = det.sign * Math.exp(det.logAbs);
      // |δ det| ≲ ε·n·Π‖A‖ (Hadamard bound ‖A‖_F^n bounds the size of all partial products).
      expect(Math.abs(pr - detValue)).toBeLessThan(1e-9 * scale ** n);
      expect(Math.abs(pi)).toBeLessThan(1e-9 * scale ** n);
    }), repeatable(RUN, 200));
  });

  it('returns complex eigenvalues in exactly conjugate pairs, sorted by decreasing real then imaginary part', () => {
    fc.assert(fc.property(matrixArb, ({ n, a }) => {
      const values = eigenvalues(a, n);
      for (let k = 1; k < values.length; k++) {
        const prev = values[k - 1]!;
        const cur = values[k]!;
        expect(prev.re > cur.re || (prev.re === cur.re && prev.im >= cur.im)).toBe(true);
      }
      for (const v of values.filter((x) => x.im !== 0)) {
        expect(values.some((w) => w.re === v.re && w.im === -v.im)).toBe(true);
      }
    }), repeatable(RUN, 200));
  });

  it('finds the roots of a polynomial from its companion matrix', () => {
    // Analytic: (z − 1)(z − 2)(z + 3)(z² + 2z + 5) has roots 1, 2, −3, −1 ± 2i.
    // Expanded: z⁵ + 2z⁴ − 2z³ − 8z² − 23z + 30 (checked by multiplying out).
    const c = [2, -2, -8, -23, 30]; // z⁵ + c1 z⁴ + … + c5
    const n = 5;
    const a = new Float64Array(n * n);
    for (let j = 0; j < n; j++) a[j] = -c[j]!; // first row: −c1 … −c5
    for (let i = 1; i < n; i++) a[i * n + i - 1] = 1; // subdiagonal ones
    const expected = [{ re: 2, im: 0 }, { re: 1, im: 0 }, { re: -1, im: 2 }, { re: -1, im: -2 }, { re: -3, im: 0 }];
    const values = eigenvalues(a, n);
    values.forEach((v, k) => {
      expect(Math.abs(v.re - expected[k]!.re)).toBeLessThan(1e-10);
      expect(Math.abs(v.im - expected[k]!.im)).toBeLessThan(1e-10);
    });
  });

  it('finds the roots of unity from the companion matrix of z⁸ − 1', () => {
    // Analytic: roots exp(2πik/8), k = 0 … 7.
    const n = 8;
    const a = new Float64Array(n * n);
    a[n - 1] = 1;
    for (let i = 1; i < n; i++) a[i * n + i - 1] = 1;
    const expected = Array.from({ length: n }, (_, k) => ({ re: Math.cos((2 * Math.PI * k) / n), im: Math.sin((2 * Math.PI * k) / n) }));
    expect(mismatch(eigenvalues(a, n), expected)).toBeLessThan(1e-12);
  });

  it('returns the eigenvalue of a defective Jordan block to the accuracy perturbation theory allows', () => {
    // Analytic: a 4×4 Jordan block with eigenvalue 3 has the single eigenvalue 3 (multiplicity 4);
    // a perturbation of size ε moves it by about ε^(1/4) (Golub & Van Loan §7.2.2), ≈ 1.2e-4 for ε = 2.2e-16.
    const n = 4;
    const a = new Float64Array(n * n);
    for (let i = 0; i < n; i++) a[i * n + i] = 3;
    for (let i = 0; i + 1 < n; i++) a[i * n + i + 1] = 1;
    const r = eigenvaluesWithDiagnostics(a, n);
    expect(r.converged).toBe(true);
    for (const v of r.values) expect(Math.hypot(v.re - 3, v.im)).toBeLessThan(1e-3);
    expect(r.values.reduce((s, v) => s + v.re, 0)).toBeCloseTo(12, 12);
  });

  it('handles a 100×100 random matrix, matching the reference and the trace', () => {
    const n = 100;
    const a = randomMatrix(n, 12345);
    const r = eigenvaluesWithDiagnostics(a, n);
    expect(r.converged).toBe(true);
    expect(r.values).toHaveLength(n);
    expect(mismatch(r.values, reference(a, n))).toBeLessThan(1e-9);
    let trace = 0;
    for (let i = 0; i < n; i++) trace += a[i * n + i]!;
    expect(Math.abs(r.values.reduce((s, v) => s + v.re, 0) - trace)).toBeLessThan(1e-10);
  });

  it('is accurate on a badly scaled matrix thanks to balancing', () => {
    // Analytic: D·T·D⁻¹ with D = diag(1, 1e6, 1e-6) has the eigenvalues of the triangular T: 1, 2, 3.
    const d = [1, 1e6, 1e-6];
    const t = [1, 5, 7, 0, 2, 4, 0, 0, 3];
    const a = new Float64Array(9).map((_, k) => (t[k]! * d[Math.floor(k / 3)]!) / d[k % 3]!);
    const values = eigenvalues(a, 3);
    expect(mismatch(values, [{ re: 3, im: 0 }, { re: 2, im: 0 }, { re: 1, im: 0 }])).toBeLessThan(1e-9);
  });

  it('refuses NaN and Infinity with NonFiniteMatrixError instead of hanging', () => {
    expect(() => eigenvalues(Float64Array.of(1, NaN, 0, 1), 2)).toThrow(NonFiniteMatrixError);
    expect(() => eigenvalues(Float64Array.of(1, 0, Infinity, 1), 2)).toThrow(NonFiniteMatrixError);
  });

  it('returns no eigenvalues for an empty matrix and the entry for a 1×1 matrix', () => {
    expect(eigenvalues(new Float64Array(0), 0)).toEqual([]);
    expect(eigenvalues(Float64Array.of(-2.5), 1)).toEqual([{ re: -2.5, im: 0 }]);
  });
});
