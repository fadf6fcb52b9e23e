/**
 * `branchtrace check`: load, compile, and show that the compiled model is sound at the start guess:
 * the residual there and the largest mismatch between the exact Jacobian and central differences.
 */
import { checkJacobian, type JacobianCheck } from './compile/checkJacobian.js';
import { conservedQuantities, weightedSum, type ConservedQuantity } from './equilibria/conservedQuantities.js';
import { formatNumber } from './report/formatNumber.js';
import { textTable } from './report/renderEquilibria.js';
import { prepare, type Overrides } from './setup.js';
import type { Model } from './types.js';

export interface ModelCheck {
  model: Model;
  residual: Float64Array;
  jacobian: JacobianCheck;
  guess: Float64Array;
  params: Float64Array;
  /** Weighted sums of the states whose rate of change does not depend on the state (conservedQuantities.ts). */
  conserved: ConservedQuantity[];
}

export function checkModel(model: Model, overrides: Overrides = {}): ModelCheck {
  const { system, params, guess } = prepare(model, overrides);
  const residual = new Float64Array(system.n);
  system.rhs(guess, params, residual);
  return {
    model, residual, jacobian: checkJacobian(system, guess, params), guess, params,
    conserved: conservedQuantities(system, params, guess),
  };
}

export function checkText(c: ModelCheck): string {
  const { model } = c;
  const unit = (u?: string) => u ?? '';
  const states = textTable(
    ['state', 'start', 'bounds', 'unit', 'f at start', 'about'],
    model.states.map((s, i) => [
      s.name, formatNumber(c.guess[i]!, 6), boundsText(s.min, s.max), unit(s.unit), formatNumber(c.residual[i]!, 4), s.about ?? '',
    ]),
  );
  const parameters = textTable(
    ['parameter', 'value', 'unit', 'about'],
    model.parameters.map((q, k) => [q.name, formatNumber(c.params[k]!, 6), unit(q.unit), q.about ?? '']),
  );
  const names = model.states.map((s) => s.name);
  const w = c.jacobian.worst;
  return [
    `${model.file}: ${model.title ?? 'model'} — loads and compiles`,
    `${count(model.states.length, "state")}, ${count(model.parameters.length, "parameter")}, ${count(model.definitions.length, "definition")}`,
    '',
    states,
    '',
    parameters,
    '',
    `largest |f| at the start guess: ${formatNumber(Math.max(...c.residual.map(Math.abs)), 4)}`,
    `exact Jacobian vs central differences: largest relative mismatch ${c.jacobian.maxRelError.toExponential(2)} ` +
      `(d f_${names[w.row]} / d ${names[w.col]}), absolute ${c.jacobian.maxAbsError.toExponential(2)}`,
    ...c.conserved.map((q) => q.rate === 0
      ? `warning: ${weightedSum(names, q.weights)} is conserved: equilibria are not isolated, and equilibria and sweep refuse the model until one of these states is replaced by the total minus the others`
      : `warning: ${weightedSum(names, q.weights)} changes at the same rate ${formatNumber(q.rate, 6)} at every state: the model has no equilibrium`),
    '',
  ].join('\n');
}

/** `>= 0`, `<= 1`, `-3.142 to 3.142`, or nothing. */
function boundsText(min?: number, max?: number): string {
  if (min !== undefined && max !== undefined) return `${formatNumber(min, 4)} to ${formatNumber(max, 4)}`;
  if (min !== undefined) return `>= ${formatNumber(min, 4)}`;
  return max !== undefined ? `<= ${formatNumber(max, 4)}` : '';
}

function count(k: number, noun: string): string {
  return `${k} ${noun}${k === 1 ? '' : 's'}`;
}
