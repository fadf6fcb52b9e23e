import { describe, expect, it } from 'vitest';
import { innerProduct } from '../../src/detect/complexAlgebra.js';
import { criticalVectors } from '../../src/detect/criticalVectors.js';

/**
 * An n×n upper block-triangular matrix with the block [[μ, −ω], [ω, μ]] at the top left, diagonal
 * entries −1 − k/4 below it and deterministic pseudo-random entries above the diagonal. Analytic: its
 * eigenvalues are μ ± iω and the diagonal entries (block-triangular), and it is far from normal.
 */
function blockTriangular(n: number, mu: number, omega: number): Float64Array {
  const a = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++) a[i * n + j] = Math.sin(3.1 * i + 1.7 * j);
    if (i >= 2) a[i * n + i] = -1 - i / 4;
  }
  a.set([mu, -omega], 0);
  a.set([omega, mu], n);
  return a;
}

describe('criticalVectors', () => {
  it('finds unit right and left eigenvectors for the pair iω of a 60×60 non-normal matrix', () => {
    const n = 60;
    const r = criticalVectors(blockTriangular(n, 0, 1.3), n, { re: 0, im: 1.3 });
    expect(r.status).toBe('converged');
    // Bounds in this test: common practice (rounding level with a margin for n = 60), not from a source.
    expect(r.residual).toBeLessThan(1e-12);
    expect(r.adjointResidual).toBeLessThan(1e-12);
    const pq = innerProduct(r.p, r.q);
    expect(Math.hypot(pq.re - 1, pq.im)).toBeLessThan(1e-12);
    const qq = innerProduct(r.q, r.q);
    expect(Math.abs(qq.re - 1)).toBeLessThan(1e-14);
    // Analytic: q lies in the first two coordinates, q ∝ (1, −i) for [[0, −ω], [ω, 0]].
    expect(Math.abs(r.q.re[0]! - Math.SQRT1_2)).toBeLessThan(1e-13);
    expect(Math.abs(r.q.im[1]! + Math.SQRT1_2)).toBeLessThan(1e-13);
    for (let i = 2; i < n; i++) expect(Math.hypot(r.q.re[i]!, r.q.im[i]!)).toBeLessThan(1e-14);
  });

  it('converges at an eigenvalue with a small nonzero real part, as at a located Hopf point', () => {
    const n = 12;
    const r = criticalVectors(blockTriangular(n, 3e-9, 0.4), n, { re: 3e-9, im: 0.4 });
    expect(r.status).toBe('converged');
    // Bounds: common practice (rounding level with a margin), not from a source.
    expect(r.residual).toBeLessThan(1e-13);
    expect(r.normalisationError).toBeLessThan(1e-13);
  });

  it('returns real vectors (up to rounding) for a real zero eigenvalue', () => {
    const n = 8;
    const a = blockTriangular(n, 0, 0);
    // Block [[0, 0], [0, 0]]: a double zero; make it simple by putting −2 in the second diagonal slot.
    a[n + 1] = -2;
    const r = criticalVectors(a, n, { re: 0, im: 0 });
    expect(r.status).toBe('converged');
    // Bounds: common practice (rounding level), not from a source.
    expect(Math.max(...r.q.im.map(Math.abs))).toBeLessThan(1e-15);
    expect(Math.abs(r.q.re[0]! - 1)).toBeLessThan(1e-14);
  });
});
