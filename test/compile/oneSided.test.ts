/**
 * abs, min and max: derivatives away from where they switch (analytic) and the documented
 * one-sided convention at the switch (differentiate.ts): abs'(0) = +1, and min/max take the first
 * argument's derivative on a tie.
 */
import { describe, expect, it } from 'vitest';
import { compileModel } from '../../src/compile/compileModel.js';
import { modelFromText } from './modelFromText.js';

function jacobianAt(text: string, x: number, y: number): [number, number, number, number] {
  const system = compileModel(modelFromText({ states: { x: 0, y: 0 }, equations: { x: text, y: '0' } }));
  const out = new Float64Array(4);
  system.jacobian(Float64Array.of(x, y), new Float64Array(0), out);
  return [out[0]!, out[1]!, out[2]!, out[3]!];
}

describe('one-sided derivatives of abs, min and max', () => {
  it('abs(x − y) has derivatives ±1 away from x = y and the +branch derivative at x = y', () => {
    // Analytic: ∂|x − y|/∂x = sign(x − y), ∂/∂y = −sign(x − y); at x = y the branch +(x − y).
    expect(jacobianAt('abs(x - y)', 2, 1).slice(0, 2)).toEqual([1, -1]);
    expect(jacobianAt('abs(x - y)', 1, 2).slice(0, 2)).toEqual([-1, 1]);
    expect(jacobianAt('abs(x - y)', 1.5, 1.5).slice(0, 2)).toEqual([1, -1]);
  });

  it('min(x, y) follows the smaller argument and the first one on a tie', () => {
    // Analytic: ∂min/∂x = 1 when x < y, 0 when x > y.
    expect(jacobianAt('min(x, y)', 1, 2).slice(0, 2)).toEqual([1, 0]);
    expect(jacobianAt('min(x, y)', 3, 2).slice(0, 2)).toEqual([0, 1]);
    expect(jacobianAt('min(x, y)', 2, 2).slice(0, 2)).toEqual([1, 0]);
    expect(jacobianAt('min(y, x)', 2, 2).slice(0, 2)).toEqual([0, 1]);
  });

  it('max(x, y) follows the larger argument and the first one on a tie', () => {
    expect(jacobianAt('max(x, y)', 1, 2).slice(0, 2)).toEqual([0, 1]);
    expect(jacobianAt('max(x, y)', 3, 2).slice(0, 2)).toEqual([1, 0]);
    expect(jacobianAt('max(x, y)', 2, 2).slice(0, 2)).toEqual([1, 0]);
    expect(jacobianAt('max(y, x)', 2, 2).slice(0, 2)).toEqual([0, 1]);
  });

  it('min of three arguments differentiates through the smallest', () => {
    // min(x, y, 5) = min(min(x, y), 5); analytic: the derivative of whichever is smallest.
    expect(jacobianAt('min(x, y, 5)', 1, 2).slice(0, 2)).toEqual([1, 0]);
    expect(jacobianAt('min(x, y, 5)', 7, 6).slice(0, 2)).toEqual([0, 0]);
  });

  it('the derivative of min(2x², y) is 4x below the switch and 0 above it', () => {
    // Analytic: d(2x²)/dx = 4x.
    expect(jacobianAt('min(2*x^2, y)', 0.5, 3)[0]).toBe(2);
    expect(jacobianAt('min(2*x^2, y)', 3, 0.5)[0]).toBe(0);
  });

  it('a NaN argument makes the derivative NaN rather than picking a side', () => {
    // select(l, r, …) is NaN when l or r is NaN (ir.ts); log(−1) is NaN.
    expect(jacobianAt('min(log(x), y)', -1, 0)[1]).toBeNaN();
  });
});
