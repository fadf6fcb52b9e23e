/**
 * Every equilibrium of a model at fixed parameter values, from the model itself:
 *   Model ─prepare→ system, parameters, guess ─findEquilibria→ classified equilibria.
 */
import { findEquilibria, type EquilibriumSearch } from './equilibria/findEquilibria.js';
import { assertIsolatedEquilibria, prepare, searchBox, type Overrides, type Prepared } from './setup.js';
import { equilibriaInModelTime, inLongerTime, timeFactor } from './timeUnit.js';
import type { Model } from './types.js';

export interface EquilibriaAtOptions extends Overrides {
  /** Search ranges of single states, [name, lo, hi]; the other states keep the default box. */
  box?: readonly [string, number, number][];
}

export function equilibriaAt(model: Model, opts: EquilibriaAtOptions = {}): Prepared & { search: EquilibriumSearch } {
  const prepared = prepare(model, opts);
  assertIsolatedEquilibria(prepared);
  const box = searchBox(model, prepared.guess, opts.box ?? []);
  // Without --box the box is only where start points go; every equilibrium found is reported.
  const keepOutsideBox = (opts.box ?? []).length === 0;
  // A slow model is searched in a longer time unit, its eigenvalues given back in its own (timeUnit.ts).
  const r = timeFactor(prepared.system, prepared.params, prepared.guess);
  const search = findEquilibria(inLongerTime(prepared.system, r), prepared.params, { box, guess: prepared.guess, keepOutsideBox });
  return { ...prepared, search: { ...search, equilibria: equilibriaInModelTime(search.equilibria, r) } };
}
