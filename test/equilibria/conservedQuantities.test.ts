import { readdirSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { conservedQuantities, weightedSum } from '../../src/equilibria/conservedQuantities.js';
import { message, ModelError } from '../../src/errors.js';
import { equilibriaAt } from '../../src/equilibriaAt.js';
import { loadModel, readModelFile } from '../../src/model/loadModel.js';
import { prepare } from '../../src/setup.js';
import { sweep } from '../../src/sweep.js';

function found(text: string): { sums: string[]; rates: number[] } {
  const model = loadModel(text, 'conserved.yaml');
  const { system, params, guess } = prepare(model);
  const names = model.states.map((s) => s.name);
  const qs = conservedQuantities(system, params, guess);
  return { sums: qs.map((q) => weightedSum(names, q.weights)), rates: qs.map((q) => q.rate) };
}

// Kermack & McKendrick (1927) epidemic without births or deaths: the three equations sum to 0.
const SIR = 'states: { S: 0.9, I: 0.1, R: 0 }\nparameters: { beta: 0.3, gamma: 0.1 }\nequations:\n' +
  '  S: -beta*S*I\n  I: beta*S*I - gamma*I\n  R: gamma*I\n';

describe('conservedQuantities', () => {
  it('finds the closed population S + I + R of the epidemic model', () => {
    expect(found(SIR)).toEqual({ sums: ['S + I + R'], rates: [0] });
  });

  it('finds both laws of mass-action enzyme kinetics: free plus bound enzyme, and substrate in every form', () => {
    // E + S <-> ES -> E + P with mass action (Briggs & Haldane 1925): d(E + ES)/dt = 0 and
    // d(S + ES + P)/dt = 0 by adding the equations (analytic); no third law (the rank is 2).
    const { sums, rates } = found('states: { S: 1, E: 0.5, ES: 0.1, P: 0 }\nparameters: { k1: 2, km1: 1, k2: 0.5 }\nequations:\n' +
      '  S: -k1*E*S + km1*ES\n  E: -k1*E*S + (km1 + k2)*ES\n  ES: k1*E*S - (km1 + k2)*ES\n  P: k2*ES\n');
    expect(sums).toEqual(['S + ES + P', 'E + ES']);
    expect(rates).toEqual([0, 0]);
  });

  it('writes weights as whole numbers where they are fractions, and as decimals otherwise', () => {
    // By hand: with r = k A^2 B, B' = -r + C/2 and C' = 2r - C, so 2B' + C' = 0; A' + ... has no partner.
    expect(found('states: { A: 1, B: 1, C: 0.2 }\nparameters: { k: 1 }\nequations:\n' +
      '  A: -2*k*A^2*B\n  B: -k*A^2*B + 0.5*C\n  C: 2*k*A^2*B - C\n').sums).toEqual(['2*B + C']);
    // x + sqrt(2)·y is conserved (by hand): the second weight is not a fraction, so it stays a decimal.
    expect(found('states: { x: 1, y: 2 }\nparameters: { k: 1 }\nequations:\n  x: -sqrt(2)*k*x*y\n  y: k*x*y\n').sums)
      .toEqual(['x + 1.41421*y']);
  });

  it('tells a sum that drifts at a constant rate (no equilibrium at all) from a conserved one', () => {
    // (x + y)' = a + c = 1.5 at every state (analytic).
    expect(found('states: { x: 1, y: 1 }\nparameters: { a: 1, b: 2, c: 0.5 }\nequations:\n  x: a - b*x*y\n  y: b*x*y + c\n'))
      .toEqual({ sums: ['x + y'], rates: [1.5] });
  });

  it('does not report a sum that leaks slowly, a badly scaled regular model, nor anything in the bundled models', () => {
    // (x + y)' = -1e-6 y: not conserved, however small the leak.
    expect(found('states: { x: 1, y: 1 }\nparameters: { k: 1 }\nequations:\n  x: -k*x*y\n  y: k*x*y - 1e-6*y\n').sums).toEqual([]);
    // A regular Jacobian (determinant 1) with rows 1e18 apart: its singular values are 1e-18 apart, but no
    // weighted sum of the rows cancels in both columns.
    expect(found('states: { x: 1, y: 1 }\nparameters: { k: 1 }\nequations:\n  x: 1e-9*k*(y - x)\n  y: 1e9*(x - 2*y)\n').sums).toEqual([]);
    // The Brusselator (Prigogine & Lefever 1968) counted in units of 1e-9: x + y is not conserved (its rate is
    // a - x), though at states far beyond 1e-9 the x²y terms swamp that and cancel to rounding.
    expect(found('states: { x: 1e-9, y: 2e-9 }\nparameters: { a: 1, b: 1.5, k: 1e-9 }\nequations:\n' +
      '  x: k*(a - (b + 1)*(x/k) + (x/k)^2*(y/k))\n  y: k*(b*(x/k) - (x/k)^2*(y/k))\n').sums).toEqual([]);
    for (const file of readdirSync('models').filter((f) => f.endsWith('.yaml'))) {
      const model = readModelFile(`models/${file}`);
      const { system, params, guess } = prepare(model);
      expect(conservedQuantities(system, params, guess), file).toEqual([]);
    }
  });

  it('makes the equilibrium search and the sweep stop with a one-line model error that names the equation', () => {
    const model = loadModel(SIR, 'sir.yaml');
    const expected = new ModelError(message.conservedQuantity('sir.yaml:4:6', ['S + I + R']));
    expect(() => equilibriaAt(model)).toThrow(expected);
    expect(() => sweep(model, { vary: 'beta', from: 0.1, to: 0.5 })).toThrow(expected);
  });
});
