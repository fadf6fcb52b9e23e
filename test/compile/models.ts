/** Test models used by several compile tests (equations as written in the cited sources). */
import { modelFromText, type ModelText } from './modelFromText.js';

/**
 * Exothermic first-order reaction in a stirred tank, dimensionless (Uppal, Ray & Poore 1974,
 * Chem. Eng. Sci. 29, eqs. 9–10): x1' = −x1 + Da(1 − x1)exp(x2/(1 + x2/γ)),
 * x2' = −x2 + B·Da(1 − x1)exp(x2/(1 + x2/γ)) − β x2.
 */
export const REACTOR: ModelText = {
  states: { c: 0.3, T: 1.2 },
  parameters: { Da: 0.08, B: 8, beta: 0.3, gamma: 20 },
  definitions: [['rate', 'Da*(1 - c)*exp(T/(1 + T/gamma))']],
  equations: { c: '-c + rate', T: '-T + B*rate - beta*T' },
};

/** Lorenz (1963), J. Atmos. Sci. 20, eq. 25–27. */
export const LORENZ: ModelText = {
  states: { X: 1.1, Y: -0.7, Z: 20 },
  parameters: { sigma: 10, r: 28, b: 8 / 3 },
  equations: { X: 'sigma*(Y - X)', Y: 'r*X - Y - X*Z', Z: 'X*Y - b*Z' },
};

/** Brusselator (Prigogine & Lefever 1968): x' = a − (b+1)x + x²y, y' = bx − x²y. */
export const BRUSSELATOR: ModelText = {
  states: { x: 1.3, y: 2.1 },
  parameters: { a: 1, b: 2.5 },
  equations: { x: 'a - (b + 1)*x + x^2*y', y: 'b*x - x^2*y' },
};

/** A 20-state chain with saturating coupling (common practice test model, no source). */
export function chainModel(size: number): ModelText {
  const states: Record<string, number> = {};
  const equations: Record<string, string> = {};
  for (let i = 0; i < size; i++) states[`s${i}`] = 0.5 + 0.03 * i;
  for (let i = 0; i < size; i++) {
    const prev = i === 0 ? 'u' : `s${i - 1}`;
    equations[`s${i}`] = `k*${prev}/(1 + ${prev}^2) - d*s${i} + 0.1*tanh(s${i} - c)`;
  }
  return { states, parameters: { k: 1.2, d: 0.7, u: 1.5, c: 0.4 }, equations };
}

export const ALL_MODELS: [string, ModelText][] = [
  ['the stirred-tank reactor', REACTOR],
  ['the Lorenz system', LORENZ],
  ['the Brusselator', BRUSSELATOR],
  ['a 20-state chain', chainModel(20)],
];

export { modelFromText };
