/**
 * User-facing failures of the compile stage: non-finite values name the equation or Jacobian
 * entry with where it is written and the state and parameter values; bad trees name the place.
 */
import { describe, expect, it } from 'vitest';
import { assertFiniteAt } from '../../src/compile/assertFiniteAt.js';
import { compileModel } from '../../src/compile/compileModel.js';
import { rhsKernel } from '../../src/compile/kernels.js';
import { lowerModel } from '../../src/compile/lower.js';
import { message, ModelError } from '../../src/errors.js';
import type { Model } from '../../src/types.js';
import { modelFromText } from './modelFromText.js';

describe('non-finite values', () => {
  // modelFromText places states on lines 1.., parameters next, then definitions, then equations, column 5.
  const model = modelFromText({ states: { c: 1, T: 2 }, parameters: { k: 3 }, equations: { c: 'k - c', T: 'log(T) + sqrt(c)' } });
  const system = compileModel(model);

  it('log(T) at T = −1 names the equation for T, where it is written, and all values', () => {
    // Analytic: log(−1) is NaN.
    expect(() => assertFiniteAt(system, Float64Array.of(1, -1), Float64Array.of(3))).toThrow(
      new ModelError(message.nonFiniteEquation('test.yaml:5:5', 'T', NaN, 'c = 1, T = -1, k = 3')),
    );
  });

  it('sqrt(c) at c = 0 is finite but its derivative is named as the non-finite Jacobian entry', () => {
    // Analytic: d sqrt(c)/dc = 1/(2 sqrt c) = Infinity at c = 0.
    expect(() => assertFiniteAt(system, Float64Array.of(0, 1), Float64Array.of(3))).toThrow(
      new ModelError(message.nonFiniteJacobian('test.yaml:5:5', 'T', 'c', Infinity, 'c = 0, T = 1, k = 3')),
    );
  });

  it('finite values pass without an error and leave the system usable', () => {
    expect(() => assertFiniteAt(system, Float64Array.of(1, 2), Float64Array.of(3))).not.toThrow();
    const out = new Float64Array(2);
    system.rhs(Float64Array.of(1, 2), Float64Array.of(3), out);
    expect(out[0]).toBe(2); // analytic: k − c = 3 − 1
  });

  it('an overflowing constant stays in the code and shows up at run time instead of being folded', () => {
    const big = compileModel(modelFromText({ states: { x: 0 }, equations: { x: 'exp(1000) * x' } }));
    expect(() => assertFiniteAt(big, Float64Array.of(1), new Float64Array(0))).toThrow(
      new ModelError(message.nonFiniteEquation('test.yaml:2:5', 'x', Infinity, 'x = 1')),
    );
  });
});

describe('trees the compile stage refuses', () => {
  const base = modelFromText({ states: { x: 1 }, equations: { x: 'x' } });
  const withExpr = (expr: Model['equations'][number]['expr']): Model => ({
    ...base,
    equations: [{ ...base.equations[0]!, expr }],
  });

  it('an unknown name is reported with its column inside the expression', () => {
    const model = withExpr({ kind: 'sym', name: 'zz', pos: { offset: 4 } });
    // The equation is at column 5; offset 4 (1-based) puts the name at column 5 + 4 − 1 = 8.
    expect(() => compileModel(model)).toThrow(new ModelError(message.compileUnknownName('test.yaml:2:8', 'zz')));
  });

  it('a non-finite number is refused', () => {
    expect(() => compileModel(withExpr({ kind: 'num', value: Infinity }))).toThrow(
      new ModelError(message.compileNonFiniteNumber('test.yaml:2:5', Infinity)),
    );
  });

  it('a function with the wrong number of arguments is refused', () => {
    const model = withExpr({ kind: 'call', fn: 'exp', args: [{ kind: 'num', value: 1 }, { kind: 'num', value: 2 }] });
    expect(() => compileModel(model)).toThrow(new ModelError(message.compileArgumentCount('test.yaml:2:5', 'exp', '1', 2)));
  });
});

describe('shared definitions', () => {
  it('a definition used by two equations is evaluated once per call', () => {
    const model = modelFromText({
      states: { a: 1, b: 1 },
      definitions: [['r', 'exp(a*b)']],
      equations: { a: 'r - a', b: 'r*b' },
    });
    const { source } = rhsKernel(lowerModel(model));
    expect(source.match(/Math\.exp/g)).toHaveLength(1);
  });
});
