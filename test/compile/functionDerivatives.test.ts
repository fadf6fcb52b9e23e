/**
 * First, second and third derivatives of every whitelisted function against closed forms
 * (analytic, written beside each case), through the compiled System of a one-state model.
 */
import { describe, it } from 'vitest';
import { compileModel } from '../../src/compile/compileModel.js';
import { expectClose } from '../helpers/close.js';
import { modelFromText } from './modelFromText.js';

interface Case {
  text: string;
  points: number[];
  /** f', f'', f''' in closed form. */
  d1: (x: number) => number;
  d2: (x: number) => number;
  d3: (x: number) => number;
}

const sec2 = (x: number) => 1 / Math.cos(x) ** 2;
const sech2 = (x: number) => 1 / Math.cosh(x) ** 2;
const LN2 = Math.LN2;

// Analytic: standard derivative tables; the third derivatives are worked out in the comments.
const CASES: Case[] = [
  { text: 'exp(x)', points: [-2, 0, 1.5], d1: Math.exp, d2: Math.exp, d3: Math.exp },
  // log: 1/x, −1/x², 2/x³
  { text: 'log(x)', points: [0.3, 1, 4], d1: (x) => 1 / x, d2: (x) => -1 / x ** 2, d3: (x) => 2 / x ** 3 },
  // sqrt: ½x^−½, −¼x^−3/2, ⅜x^−5/2
  { text: 'sqrt(x)', points: [0.25, 2], d1: (x) => 0.5 / Math.sqrt(x), d2: (x) => -0.25 * x ** -1.5, d3: (x) => 0.375 * x ** -2.5 },
  { text: 'sin(x)', points: [-1, 0.4, 3], d1: Math.cos, d2: (x) => -Math.sin(x), d3: (x) => -Math.cos(x) },
  { text: 'cos(x)', points: [-1, 0.4, 3], d1: (x) => -Math.sin(x), d2: (x) => -Math.cos(x), d3: Math.sin },
  // tan: sec², 2sec²·tan, (2sec²·tan)' = 4sec²·tan² + 2sec⁴
  {
    text: 'tan(x)', points: [-0.7, 0.2, 1.1], d1: sec2, d2: (x) => 2 * sec2(x) * Math.tan(x),
    d3: (x) => 4 * sec2(x) * Math.tan(x) ** 2 + 2 * sec2(x) ** 2,
  },
  // tanh: sech², −2sech²·tanh, (−2sech²·tanh)' = 4sech²·tanh² − 2sech⁴
  {
    text: 'tanh(x)', points: [-1.3, 0, 0.8], d1: sech2, d2: (x) => -2 * sech2(x) * Math.tanh(x),
    d3: (x) => 4 * sech2(x) * Math.tanh(x) ** 2 - 2 * sech2(x) ** 2,
  },
  { text: 'sinh(x)', points: [-1, 0.5, 2], d1: Math.cosh, d2: Math.sinh, d3: Math.cosh },
  { text: 'cosh(x)', points: [-1, 0.5, 2], d1: Math.sinh, d2: Math.cosh, d3: Math.sinh },
  // abs away from 0: sign(x), 0, 0
  { text: 'abs(x)', points: [-2, 0.7], d1: Math.sign, d2: () => 0, d3: () => 0 },
  // power rule: 2.5x^1.5, 3.75x^0.5, 1.875x^−0.5
  { text: 'pow(x, 2.5)', points: [0.5, 3], d1: (x) => 2.5 * x ** 1.5, d2: (x) => 3.75 * x ** 0.5, d3: (x) => 1.875 * x ** -0.5 },
  // power rule at 0 with a whole exponent: 3x², 6x, 6 (no 0·log 0)
  { text: 'x^3', points: [0, -1.5], d1: (x) => 3 * x ** 2, d2: (x) => 6 * x, d3: () => 6 },
  // constant base: 2^x·ln2, 2^x·ln²2, 2^x·ln³2
  { text: '2^x', points: [-1, 0.5, 3], d1: (x) => 2 ** x * LN2, d2: (x) => 2 ** x * LN2 ** 2, d3: (x) => 2 ** x * LN2 ** 3 },
  // x^x with g = ln x + 1: x^x·g, x^x(g² + 1/x), x^x(g³ + 3g/x − 1/x²)
  {
    text: 'x^x', points: [0.4, 1.7],
    d1: (x) => x ** x * (Math.log(x) + 1),
    d2: (x) => x ** x * ((Math.log(x) + 1) ** 2 + 1 / x),
    d3: (x) => {
      const g = Math.log(x) + 1;
      return x ** x * (g ** 3 + (3 * g) / x - 1 / x ** 2);
    },
  },
  // quotient: (1/(1+x²))' = −2x/(1+x²)², '' = (6x² − 2)/(1+x²)³, ''' = 24x(1 − x²)/(1+x²)⁴
  {
    text: '1 / (1 + x^2)', points: [-0.5, 0, 2],
    d1: (x) => (-2 * x) / (1 + x * x) ** 2, d2: (x) => (6 * x * x - 2) / (1 + x * x) ** 3,
    d3: (x) => (24 * x * (1 - x * x)) / (1 + x * x) ** 4,
  },
];

describe('derivatives of each function', () => {
  for (const c of CASES) {
    it(`the first, second and third derivatives of ${c.text} match their closed forms`, () => {
      const system = compileModel(modelFromText({ states: { x: 0 }, equations: { x: c.text } }));
      const p = new Float64Array(0);
      const one = Float64Array.of(1);
      const out = new Float64Array(1);
      for (const x0 of c.points) {
        const x = Float64Array.of(x0);
        system.jacobian(x, p, out);
        expectClose(out[0]!, c.d1(x0), { abs: 1e-14, rel: 1e-13 }, `${c.text} first at ${x0}`);
        system.secondDerivative(x, p, one, one, out);
        expectClose(out[0]!, c.d2(x0), { abs: 1e-14, rel: 1e-12 }, `${c.text} second at ${x0}`);
        system.thirdDerivative(x, p, one, one, one, out);
        expectClose(out[0]!, c.d3(x0), { abs: 1e-13, rel: 1e-12 }, `${c.text} third at ${x0}`);
      }
    });
  }
});
