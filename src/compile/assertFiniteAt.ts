/**
 * Evaluate f and its Jacobian at (x, p) and stop with a ModelError naming the first entry that is
 * not a finite number: the equation (by its state) or the Jacobian entry ∂f_i/∂x_j, with where the
 * equation is written and the values of every state and parameter.
 */
import { message, ModelError, where } from '../errors.js';
import type { CompiledSystem } from './compileModel.js';

export function assertFiniteAt(system: CompiledSystem, x: Float64Array, p: Float64Array): void {
  const { n, info } = system;
  const at = (i: number) => where(system.equationSources[i] ?? { file: info.file });
  const stateName = (i: number) => info.states[i]?.name ?? `#${i}`;
  const values = () =>
    [
      ...info.states.map((s, i) => `${s.name} = ${x[i]}`),
      ...info.parameters.map((q, k) => `${q.name} = ${p[k]}`),
    ].join(', ');

  const f = new Float64Array(n);
  system.rhs(x, p, f);
  const badRow = f.findIndex((v) => !Number.isFinite(v));
  if (badRow >= 0) throw new ModelError(message.nonFiniteEquation(at(badRow), stateName(badRow), f[badRow]!, values()));

  const jac = new Float64Array(n * n);
  system.jacobian(x, p, jac);
  const bad = jac.findIndex((v) => !Number.isFinite(v));
  if (bad >= 0) {
    const row = Math.floor(bad / n);
    throw new ModelError(message.nonFiniteJacobian(at(row), stateName(row), stateName(bad % n), jac[bad]!, values()));
  }
}
