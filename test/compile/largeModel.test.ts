/**
 * A dense 50-state network, x' = −x + g·tanh(W x) (common practice test model, no source):
 * large enough that generated functions are split in chunks and that third derivatives exceed
 * the symbolic term limit. Checked against direct evaluation and finite differences.
 */
import { describe, expect, it } from 'vitest';
import { checkJacobian } from '../../src/compile/checkJacobian.js';
import { compileModel } from '../../src/compile/compileModel.js';
import { jacobianKernel, rhsKernel } from '../../src/compile/kernels.js';
import { lowerModel } from '../../src/compile/lower.js';
import { expectClose } from '../helpers/close.js';
import { modelFromText, startOf } from './modelFromText.js';

const N = 50;
const weight = (i: number, j: number) => Math.sin(1 + 3 * i + 7 * j) * 0.4;

function network() {
  const states: Record<string, number> = {};
  const equations: Record<string, string> = {};
  const definitions: [string, string][] = [];
  for (let i = 0; i < N; i++) {
    states[`x${i}`] = Math.cos(i);
    definitions.push([`s${i}`, Array.from({ length: N }, (_, j) => `${weight(i, j)}*x${j}`).join(' + ')]);
    equations[`x${i}`] = `-x${i} + g*tanh(s${i})`;
  }
  return modelFromText({ states, parameters: { g: 1.7 }, definitions, equations });
}

describe('a large dense model', () => {
  const model = network();
  const system = compileModel(model);
  const { x, p } = startOf(model);

  it('is compiled into several generated functions that share a scratch array', () => {
    const lowered = lowerModel(model);
    expect(rhsKernel(lowered).source).toMatch(/const t = new Float64Array\(\d+\);\nfunction c0\(/);
    expect(jacobianKernel(lowered).source).toMatch(/function c1\(/);
  });

  it('evaluates the right-hand side as written', () => {
    const out = new Float64Array(N);
    system.rhs(x, p, out);
    for (let i = 0; i < N; i++) {
      let s = 0;
      for (let j = 0; j < N; j++) s += weight(i, j) * x[j]!;
      expectClose(out[i]!, -x[i]! + 1.7 * Math.tanh(s), { abs: 1e-13, rel: 1e-13 }, `f_${i}`);
    }
  });

  it('has a Jacobian that agrees with central differences', () => {
    expect(checkJacobian(system, x, p).maxRelError).toBeLessThan(1e-6);
  });

  it('computes third derivatives by finite differences past the term limit, close to differences of B', () => {
    const u = Float64Array.from({ length: N }, (_, i) => Math.sin(i));
    const v = Float64Array.from({ length: N }, (_, i) => Math.cos(2 * i));
    const w = Float64Array.from({ length: N }, (_, i) => Math.sin(3 * i + 1));
    const c = new Float64Array(N);
    system.thirdDerivative(x, p, u, v, w, c);
    const h = 1e-5;
    const bp = new Float64Array(N);
    const bm = new Float64Array(N);
    system.secondDerivative(x.map((xi, j) => xi + h * w[j]!), p, u, v, bp);
    system.secondDerivative(x.map((xi, j) => xi - h * w[j]!), p, u, v, bm);
    c.forEach((ci, i) => expectClose(ci, (bp[i]! - bm[i]!) / (2 * h), { abs: 1e-4, rel: 1e-4 }, `C_${i}`));
    // 50 rows × C(52, 3) candidate third-order terms > SYMBOLIC_TERM_LIMIT; 50 × C(51, 2) second-order ones are not.
    expect(system.derivativeMethod).toEqual({ second: 'symbolic', third: 'finite differences of the exact Jacobian' });
  });
});
