/**
 * Between the compile stage and the numerics: turn the user's overrides (`--set`, `--start`,
 * `--box`, `--vary`) into vectors indexed like the model, checking every name, and compile the
 * model once. Every command goes through here, so a misspelt name gets the same message everywhere.
 */
import { assertFiniteAt } from './compile/assertFiniteAt.js';
import { compileModel, type CompiledSystem } from './compile/compileModel.js';
import { conservedQuantities, weightedSum, type ConservedQuantity } from './equilibria/conservedQuantities.js';
import { boxAround, type Box } from './equilibria/startPoints.js';
import { EQUILIBRIA } from './defaults.js';
import { message, ModelError, UsageError, where } from './errors.js';
import type { Model } from './types.js';

export interface Overrides {
  /** Parameter values replacing the model's nominal values. */
  set?: Readonly<Record<string, number>>;
  /** Start guesses replacing the model's `states` values. */
  start?: Readonly<Record<string, number>>;
}

export interface Prepared {
  system: CompiledSystem;
  /** Parameter vector (model values, then --set). */
  params: Float64Array;
  /** Start guess (model values, then --start). */
  guess: Float64Array;
}

export function parameterIndex(model: Model, name: string): number {
  const k = model.parameters.findIndex((q) => q.name === name);
  if (k < 0) throw new UsageError(message.unknownParameter(name, model.parameters.map((q) => q.name)));
  return k;
}

export function stateIndex(model: Model, name: string): number {
  const i = model.states.findIndex((s) => s.name === name);
  if (i < 0) throw new UsageError(message.unknownState(name, model.states.map((s) => s.name)));
  return i;
}

/** Compiles the model and applies the overrides; the residual and Jacobian must be finite at the guess. */
export function prepare(model: Model, overrides: Overrides = {}): Prepared {
  const params = Float64Array.from(model.parameters.map((q) => q.value));
  for (const [name, value] of Object.entries(overrides.set ?? {})) params[parameterIndex(model, name)] = value;
  const guess = Float64Array.from(model.states.map((s) => s.start));
  for (const [name, value] of Object.entries(overrides.start ?? {})) {
    const i = stateIndex(model, name);
    const { min, max } = model.states[i]!;
    if ((min !== undefined && value < min) || (max !== undefined && value > max)) {
      throw new UsageError(message.startOutsideBounds(name, value, min, max));
    }
    guess[i] = value;
  }
  const system = compileModel(model);
  assertFiniteAt(system, guess, params);
  return { system, params, guess };
}

/**
 * Stop with a ModelError, naming the model file and the equation of the first state involved, when a
 * weighted sum of the states is conserved (equilibria come in families, not one by one) or drifts at
 * a constant rate (no equilibrium): see conservedQuantities.ts. The equilibrium search and the sweep
 * need isolated equilibria.
 */
export function assertIsolatedEquilibria({ system, params, guess }: Prepared): void {
  const found = conservedQuantities(system, params, guess);
  if (found.length === 0) return;
  const names = system.info.states.map((s) => s.name);
  const at = (q: ConservedQuantity) => where(system.equationSources[q.weights.findIndex((w) => w !== 0)] ?? { file: system.info.file });
  const drifting = found.find((q) => q.rate !== 0);
  if (drifting !== undefined) throw new ModelError(message.constantDrift(at(drifting), weightedSum(names, drifting.weights), drifting.rate));
  throw new ModelError(message.conservedQuantity(at(found[0]!), found.map((q) => weightedSum(names, q.weights))));
}

/** The search box: the default box around the guess, with `--box NAME=LO:HI` entries replacing single states. */
export function searchBox(model: Model, guess: Float64Array, entries: readonly [string, number, number][]): Box {
  const box = boxAround(guess, EQUILIBRIA.boxRelative, EQUILIBRIA.boxAbsolute);
  for (const [name, lo, hi] of entries) {
    const i = stateIndex(model, name);
    box.lo[i] = lo;
    box.hi[i] = hi;
  }
  return box;
}
