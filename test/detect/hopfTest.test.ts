import { describe, expect, it } from 'vitest';
import { complexUnstableCount, criticalPair, crossingMatch, hopfBetween, hopfTest } from '../../src/detect/hopfTest.js';
import { locateRoot } from '../../src/detect/locateRoot.js';
import { eigenvalues } from '../../src/linalg/eig.js';
import type { Eigenvalue } from '../../src/types.js';

const pair = (re: number, im: number): Eigenvalue[] => [{ re, im }, { re, im: -im }];
const real = (...values: number[]): Eigenvalue[] => values.map((re) => ({ re, im: 0 }));

describe('hopfTest', () => {
  it('equals ±2μ when a pair μ ± i crosses next to a stable real eigenvalue', () => {
    // Analytic: the pair sums are 2μ, μ − 3 ± i; for small μ the smallest is |2μ|, sign(ψ) = sign(μ).
    for (const mu of [1e-3, -1e-3, 0.2, -0.2]) {
      expect(Math.abs(hopfTest([...pair(mu, 1), ...real(-3)]) - 2 * mu)).toBeLessThan(1e-15);
    }
  });

  it('stays finite and flips sign for n = 100 where the product ∏(λi + λj) overflows', () => {
    // Analytic: 49 stable pairs −k ± 1000i contribute (−1)^49; the crossing pair μ ± 2i contributes sign(μ);
    // the smallest |λi + λj| is |2μ|. The plain product has 4950 factors of size up to 4000: it overflows.
    const eigs = (mu: number) => [...pair(mu, 2), ...Array.from({ length: 49 }, (_, k) => pair(-(k + 1), 1000)).flat()];
    const above = hopfTest(eigs(1e-4));
    const below = hopfTest(eigs(-1e-4));
    expect(Math.abs(above - -2e-4)).toBeLessThan(1e-15);
    expect(Math.abs(below - 2e-4)).toBeLessThan(1e-15);
  });

  it('is 1 for a single eigenvalue', () => {
    expect(hopfTest(real(-2))).toBe(1);
  });

  it('locates the Brusselator Hopf point b = 1 + a² from eigenvalues along b', () => {
    // Prigogine & Lefever 1968; analytic: J = [[b − 1, a²], [−b, −a²]] at (a, b/a), trace b − 1 − a².
    const a = 1.7;
    const g = (b: number) => hopfTest(eigenvalues(Float64Array.of(b - 1, a * a, -b, -a * a), 2));
    const r = locateRoot(g, 3, 5, g(3), g(5), { tol: 1e-12, maxIter: 100 });
    expect(r.status).toBe('converged');
    expect(Math.abs(r.s - (1 + a * a))).toBeLessThan(1e-11);
  });
});

describe('Hopf detection between branch points', () => {
  it('reports a pair crossing the imaginary axis', () => {
    const before = [...pair(-0.01, 2), ...real(-1)];
    const after = [...pair(0.01, 2), ...real(-1)];
    expect(complexUnstableCount(before, 1e-8)).toBe(0);
    expect(complexUnstableCount(after, 1e-8)).toBe(2);
    expect(hopfBetween(before, after, 1e-8)).toBe(true);
  });

  it('does not report a neutral saddle λ, −λ where the test function also changes sign', () => {
    // Analytic: real eigenvalues 2 and −2 ± 0.01 add to ±0.01; the sign of ψ flips, the complex count stays 0.
    const before = real(2, -2.01);
    const after = real(2, -1.99);
    expect(Math.sign(hopfTest(before))).not.toBe(Math.sign(hopfTest(after)));
    expect(hopfBetween(before, after, 1e-8)).toBe(false);
  });

  it('does not report two unstable real eigenvalues merging into a complex pair', () => {
    // Analytic: 1, 2 → 1.5 ± 0.1i keeps every pair sum positive; the complex unstable count goes 0 → 2.
    const before = real(1, 2);
    const after = pair(1.5, 0.1);
    expect(complexUnstableCount(after, 1e-8) - complexUnstableCount(before, 1e-8)).toBe(2);
    expect(hopfBetween(before, after, 1e-8)).toBe(false);
  });

  it('reports a pair crossing the imaginary axis next to a real saddle', () => {
    // Analytic: the pair sums are 2μ (sign flips with μ = ∓0.01), 1 − 4 = −3 and complex ones;
    // the complex unstable count goes 0 → 2.
    const before = [...pair(-0.01, 3), ...real(1, -4)];
    const after = [...pair(0.01, 3), ...real(1, -4)];
    expect(hopfBetween(before, after, 1e-8)).toBe(true);
  });

  it('picks the complex eigenvalue closest to the imaginary axis as the critical pair', () => {
    const eigs = [...pair(-2, 5), ...pair(1e-9, 0.7), ...real(0)];
    expect(criticalPair(eigs, 1e-8)).toEqual({ re: 1e-9, im: 0.7 });
    expect(criticalPair(real(1, 2), 1e-8)).toBeNull();
  });

  it('sees the crossing pair when it lies as far from its next value as from a damped mode beside it', () => {
    // The step over the Hopf point λ = 0 of an oscillator (λ ± 1.9757i) beside a damped mode
    // (−0.001 ± 2i) that a random property run met: −0.0328 + 1.9757i moves to 0.0072 + 1.9757i,
    // 0.04 away, and the damped mode's next value is 0.03999999999999992 away from it (0.0318² + 0.0243²
    // = 0.04², to rounding), so matching each eigenvalue with its nearest missed the crossing. The
    // damped mode's own match (1e-15 away) comes first, so the crossing pair keeps its next value.
    const before = [...pair(-0.001, 2), ...pair(-0.03279999999999967, 1.9757356228186245)];
    const after = [...pair(0.007200000000000331, 1.9757356228186245), ...pair(-0.0010000000000000005, 1.9999999999999991)];
    expect(crossingMatch(before, after, 1e-8)).toEqual([before[2], after[0]]);
    expect(hopfBetween(before, after, 1e-8)).toBe(true);
    // A pair nearer the axis that does not cross is passed over (analytic: only the second pair changes sign).
    expect(crossingMatch([...pair(-1e-6, 3), ...pair(-0.5, 1)], [...pair(-1e-6, 3), ...pair(0.5, 1)], 1e-8)).toEqual([{ re: -0.5, im: 1 }, { re: 0.5, im: 1 }]);
  });
});
