/**
 * Jacobians against an independent reference computation: mathjs' symbolic `derivative` evaluated
 * with mathjs' own `evaluate`, on a pool of expressions at random points (fast-check, fixed generator start).
 * mathjs does not differentiate min/max, so they are left out of this pool (see oneSided.test.ts).
 */
import fc from 'fast-check';
import { derivative, parse } from 'mathjs';
import { describe, it } from 'vitest';
import { compileModel } from '../../src/compile/compileModel.js';
import { expectClose } from '../helpers/close.js';
import { modelFromText } from './modelFromText.js';
import { repeatable } from '../helpers/repeatable.js';

const POOL = [
  'x*y + sin(x)*exp(y)',
  'log(x^2 + y^2)',
  'sqrt(x*y + 1) / (1 + x^2)',
  'tanh(x - y)^3',
  'x^y',
  'cosh(x)*sinh(y) - tan(x/3)',
  'abs(x - 2.5) * y',
  'pow(x, 3) - pow(2, y)',
  '(x - 2*y)^2 / (1 + exp(-x))',
  '-x / (y + 3) + e^(x*y) - pi*y',
  'exp(-1.5/x) * y^2 - cos(x*y)^2',
];

describe('Jacobian against mathjs derivative', () => {
  for (const text of POOL) {
    it(`the Jacobian of ${text} matches mathjs' derivative at random points`, () => {
      const system = compileModel(modelFromText({ states: { x: 1, y: 1 }, equations: { x: text, y: '0' } }));
      const dx = derivative(parse(text), 'x').compile();
      const dy = derivative(parse(text), 'y').compile();
      const out = new Float64Array(4);
      fc.assert(
        fc.property(fc.double({ min: 0.2, max: 2, noNaN: true }), fc.double({ min: 0.2, max: 2, noNaN: true }), (x, y) => {
          system.jacobian(Float64Array.of(x, y), new Float64Array(0), out);
          expectClose(out[0]!, dx.evaluate({ x, y }) as number, { abs: 1e-12, rel: 1e-10 }, `d/dx at ${x}, ${y}`);
          expectClose(out[1]!, dy.evaluate({ x, y }) as number, { abs: 1e-12, rel: 1e-10 }, `d/dy at ${x}, ${y}`);
        }),
        repeatable(20240601, 40),
      );
    });
  }

  it('the chain rule through nested definitions matches mathjs on the substituted expression', () => {
    // r1 = exp(-a/x), r2 = r1*y^2, r3 = r2 + sin(r1)  ⇒  f = exp(-a/x)*y^2 + sin(exp(-a/x)) - x*a
    const model = modelFromText({
      states: { x: 1, y: 1 },
      parameters: { a: 1.3 },
      definitions: [['r1', 'exp(-a/x)'], ['r2', 'r1*y^2'], ['r3', 'r2 + sin(r1)']],
      equations: { x: 'r3 - x*a', y: 'r2 * r1' },
    });
    const system = compileModel(model);
    const f0 = 'exp(-a/x)*y^2 + sin(exp(-a/x)) - x*a';
    const f1 = '(exp(-a/x)*y^2) * exp(-a/x)';
    const refs = [f0, f1].map((f) => ['x', 'y', 'a'].map((v) => derivative(parse(f), v).compile()));
    const jac = new Float64Array(4);
    const dfda = new Float64Array(2);
    for (const [x, y] of [[0.5, 1.2], [1.7, 0.3], [2.2, 2.5]] as const) {
      const scope = { x, y, a: 1.3 };
      system.jacobian(Float64Array.of(x, y), Float64Array.of(1.3), jac);
      system.paramDerivative(Float64Array.of(x, y), Float64Array.of(1.3), 0, dfda);
      refs.forEach(([rx, ry, ra], i) => {
        expectClose(jac[i * 2]!, rx!.evaluate(scope) as number, { abs: 1e-13, rel: 1e-11 }, `∂f${i}/∂x`);
        expectClose(jac[i * 2 + 1]!, ry!.evaluate(scope) as number, { abs: 1e-13, rel: 1e-11 }, `∂f${i}/∂y`);
        expectClose(dfda[i]!, ra!.evaluate(scope) as number, { abs: 1e-13, rel: 1e-11 }, `∂f${i}/∂a`);
      });
    }
  });
});
