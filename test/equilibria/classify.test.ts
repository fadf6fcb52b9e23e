import { describe, expect, it } from 'vitest';
import { classifyEquilibrium } from '../../src/equilibria/classify.js';
import { classifyPlanar } from '../../src/equilibria/classifyPlanar.js';

const origin2 = new Float64Array(2);

function classify2(j: number[]) {
  return classifyEquilibrium(Float64Array.from(j), 2, origin2, 0, 0);
}

describe('classifyPlanar', () => {
  // Common practice: the trace–determinant plane (Strogatz, Nonlinear Dynamics and Chaos, 2nd ed., §5.2),
  // with eigenvalues (τ ± √(τ² − 4Δ))/2 written beside each row.
  const table: [number, number, string, string][] = [
    [-3, 2, 'stable node', 'λ = −1, −2'],
    [3, 2, 'unstable node', 'λ = 1, 2'],
    [1, -2, 'saddle', 'λ = 2, −1'],
    [-1, -2, 'saddle', 'λ = 1, −2'],
    [-0.2, 1.01, 'stable focus', 'λ = −0.1 ± i'],
    [0.2, 1.01, 'unstable focus', 'λ = 0.1 ± i'],
    [0, 1, 'centre-type', 'λ = ± i'],
    [1e-12, 1, 'centre-type', 'Re λ = 5e-13, below the tolerance'],
    [1, 0, 'degenerate', 'λ = 0, 1 (det = 0)'],
    [0, 0, 'degenerate', 'λ = 0, 0'],
    [-2, 1, 'stable node', 'τ² = 4Δ: λ = −1 double (star or degenerate node)'],
    [2, 1, 'unstable node', 'τ² = 4Δ: λ = 1 double'],
    [-2, 1 + 1e-12, 'stable node', 'τ² − 4Δ = −4e-12, within the tolerance of the node/focus border'],
  ];
  for (const [trace, det, type, eigen] of table) {
    it(`calls trace ${trace}, determinant ${det} a ${type} (${eigen})`, () => {
      expect(classifyPlanar(trace, det, 1)).toBe(type);
    });
  }

  it('scales its tolerances with the size of the Jacobian', () => {
    // Δ = 1e-3 is far from zero for a unit-size Jacobian but rounding-level when the entries are 1e6.
    expect(classifyPlanar(-3, 1e-3, 1)).toBe('stable node');
    expect(classifyPlanar(-3e6, 1e-3, 1e6)).toBe('degenerate');
  });
});

describe('classifyEquilibrium', () => {
  it('calls x\' = x, y\' = −y a saddle with the axes as unstable and stable directions', () => {
    // Analytic: J = diag(1, −1); eigenvectors e1 (λ = 1) and e2 (λ = −1).
    const eq = classify2([1, 0, 0, -1]);
    expect(eq.type).toBe('saddle');
    expect(eq.stable).toBe(false);
    expect(eq.unstableDimension).toBe(1);
    expect(Array.from(eq.unstableDirections![0]!)).toEqual([1, 0]);
    expect(Array.from(eq.stableDirections![0]!)).toEqual([0, 1]);
  });

  it('gives unit saddle directions with the largest component positive', () => {
    // Analytic: J = [[0, 1], [1, 0]] has λ = 1 with (1, 1)/√2 and λ = −1 with (1, −1)/√2 (sign-normalised).
    const eq = classify2([0, 1, 1, 0]);
    const u = eq.unstableDirections![0]!;
    const s = eq.stableDirections![0]!;
    expect(Math.abs(u[0]! - Math.SQRT1_2)).toBeLessThan(1e-12);
    expect(Math.abs(u[1]! - Math.SQRT1_2)).toBeLessThan(1e-12);
    expect(Math.abs(Math.hypot(s[0]!, s[1]!) - 1)).toBeLessThan(1e-12);
    expect(Math.abs(Math.abs(s[0]!) - Math.SQRT1_2)).toBeLessThan(1e-12);
    expect(s[0]! * s[1]!).toBeLessThan(0);
    expect(Math.max(...s)).toBeGreaterThan(0);
  });

  it('calls x\' = −x, y\' = −2y a stable node and x\' = x, y\' = 2y an unstable node', () => {
    // Analytic: eigenvalues are the diagonal entries.
    const stable = classify2([-1, 0, 0, -2]);
    expect(stable.type).toBe('stable node');
    expect(stable.stable).toBe(true);
    expect(stable.eigenvalues).toEqual([{ re: -1, im: 0 }, { re: -2, im: 0 }]);
    const unstable = classify2([1, 0, 0, 2]);
    expect(unstable.type).toBe('unstable node');
    expect(unstable.unstableDimension).toBe(2);
  });

  it('calls x\' = −0.1x − y, y\' = x − 0.1y a stable focus turning counterclockwise', () => {
    // Analytic: λ = −0.1 ± i; at (1, 0) the velocity is (−0.1, 1), pointing up: counterclockwise.
    const eq = classify2([-0.1, -1, 1, -0.1]);
    expect(eq.type).toBe('stable focus');
    expect(eq.rotation).toBe('counterclockwise');
    expect(Math.abs(eq.eigenvalues[0]!.re + 0.1)).toBeLessThan(1e-14);
    expect(Math.abs(eq.eigenvalues[0]!.im - 1)).toBeLessThan(1e-14);
    expect(eq.stableDirections).toBeUndefined();
  });

  it('calls x\' = −0.1x + y, y\' = −x − 0.1y a stable focus turning clockwise', () => {
    // Analytic: λ = −0.1 ± i; at (1, 0) the velocity is (−0.1, −1), pointing down: clockwise.
    const eq = classify2([-0.1, 1, -1, -0.1]);
    expect(eq.type).toBe('stable focus');
    expect(eq.rotation).toBe('clockwise');
  });

  it('calls x\' = 0.5x − 2y, y\' = 2x + 0.5y an unstable focus turning counterclockwise', () => {
    // Analytic: λ = 0.5 ± 2i; ∂f2/∂x1 = 2 > 0.
    const eq = classify2([0.5, -2, 2, 0.5]);
    expect(eq.type).toBe('unstable focus');
    expect(eq.unstableDimension).toBe(2);
    expect(eq.rotation).toBe('counterclockwise');
  });

  it('calls the interior point of the Lotka–Volterra system centre-type', () => {
    // Lotka 1925 / Volterra 1926: x' = a x − b x y, y' = −c y + d x y; at (c/d, a/b)
    // J = [[0, −b c/d], [d a/b, 0]] with eigenvalues ±i√(ac) (analytic).
    const [a, b, c, d] = [1.5, 1, 3, 1];
    const eq = classifyEquilibrium(Float64Array.of(0, (-b * c) / d, (d * a) / b, 0), 2, Float64Array.of(c / d, a / b), 0, 0);
    expect(eq.type).toBe('centre-type');
    expect(eq.stable).toBe(false);
    expect(eq.unstableDimension).toBe(0);
    expect(Math.abs(eq.eigenvalues[0]!.im - Math.sqrt(a * c))).toBeLessThan(1e-12);
    expect(Math.abs(eq.eigenvalues[0]!.re)).toBeLessThan(1e-12);
  });

  it('gives the same type whatever the units of the states and of time', () => {
    // Analytic: new state units x → Dx turn J into DJD⁻¹ and a new time unit turns it into cJ; both
    // keep the eigenvalues (up to the factor c), so the type must not change.
    const cases: [number[], string][] = [
      [[-1, -1.6, -1.6, -1], 'saddle'], // λ = 0.6, −2.6
      [[-1, 0.5, 0.2, -2], 'stable node'], // λ = (−3 ± √1.4)/2
      [[-0.1, -1, 1, -0.1], 'stable focus'], // λ = −0.1 ± i
      [[0, -1, 1, 0], 'centre-type'], // λ = ± i
      [[0, 1, 0, -1], 'degenerate'], // λ = 0, −1
    ];
    for (const [j, type] of cases) {
      for (const [d1, d2] of [[1, 1], [1e-3, 1e3], [1e4, 1e-2]] as const) {
        for (const c of [1, 1e-9, 1e6]) {
          const scaled = [c * j[0]!, (c * j[1]! * d1) / d2, (c * j[2]! * d2) / d1, c * j[3]!];
          expect(classify2(scaled).type, `${type}, D = diag(${d1}, ${d2}), c = ${c}`).toBe(type);
        }
      }
    }
  });

  it('calls one-dimensional equilibria stable, unstable or degenerate by the sign of f\'', () => {
    const at = (d: number) => classifyEquilibrium(Float64Array.of(d), 1, Float64Array.of(0), 0, 0).type;
    expect(at(-2)).toBe('stable');
    expect(at(3)).toBe('unstable');
    expect(at(0)).toBe('degenerate');
  });

  it('describes a three-dimensional saddle with its counts and complex pairs', () => {
    // Analytic: block-diagonal J = [[1, −2, 0], [2, 1, 0], [0, 0, −3]] has λ = 1 ± 2i and −3.
    const eq = classifyEquilibrium(Float64Array.of(1, -2, 0, 2, 1, 0, 0, 0, -3), 3, new Float64Array(3), 0, 0);
    expect(eq.type).toBe('saddle (1 stable, 2 unstable; 1 complex pair)');
    expect(eq.unstableDimension).toBe(2);
    expect(eq.unstableDirections).toHaveLength(0);
    expect(Array.from(eq.stableDirections![0]!)).toEqual([0, 0, 1]);
  });

  it('describes three-dimensional stable, unstable, centre-type and degenerate equilibria', () => {
    const diag = (a: number, b: number, c: number, extra: number[] = [0, 0]) =>
      classifyEquilibrium(Float64Array.of(a, extra[0]!, 0, extra[1]!, b, 0, 0, 0, c), 3, new Float64Array(3), 0, 0).type;
    // Analytic eigenvalues in each comment.
    expect(diag(-1, -1, -2, [-1, 1])).toBe('stable (3 stable; 1 complex pair)'); // −1 ± i, −2
    expect(diag(1, 2, 3)).toBe('unstable (3 unstable)'); // 1, 2, 3
    expect(diag(0, 0, -1, [-1, 1])).toBe('centre-type'); // ± i, −1
    expect(diag(0, 0, 1, [-1, 1])).toBe('unstable (1 unstable, 2 on the imaginary axis; 1 complex pair)'); // ± i, 1
    expect(diag(0, -1, -2)).toBe('degenerate'); // 0, −1, −2
  });
});
