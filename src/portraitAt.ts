/**
 * The phase portrait at one parameter value, as a pipeline:
 *
 *   Model ─prepare→ system, parameters (with `--at` and `--set`)   (src/setup.ts)
 *         ─findEquilibria→ every equilibrium in the search box       (src/equilibria/)
 *         ─window and held states→ buildPortrait → PortraitData      (src/portrait/)
 *
 * Default plane: the first two states. Default window: the box around the equilibria and the
 * start guess, widened by half its size on each side (at least 1 wide; common practice), within
 * the states' bounds. For
 * models with more than two states, the other states are held at their values at the first
 * stable equilibrium (or the first equilibrium, or the start guess) and the page says so.
 */
import { buildPortrait, type PortraitData } from './portrait/buildPortrait.js';
import type { PortraitWindow } from './portrait/plane.js';
import { findEquilibria } from './equilibria/findEquilibria.js';
import { parameterIndex, prepare, stateIndex, type Overrides } from './setup.js';
import { equilibriaInModelTime, inLongerTime, timeFactor } from './timeUnit.js';
import type { Equilibrium, Model } from './types.js';

export interface PortraitRequest extends Overrides {
  /** The parameter fixed for the portrait, and its value. */
  at?: readonly [string, number];
  x?: string;
  y?: string;
  window?: PortraitWindow;
}

export interface PortraitResult {
  data: PortraitData;
  equilibria: Equilibrium[];
  params: Float64Array;
}

function defaultWindow(points: readonly Float64Array[], ix: number, iy: number, model: Model): PortraitWindow {
  const side = (i: number): [number, number] => {
    const values = points.map((s) => s[i]!);
    const lo = Math.min(...values);
    const hi = Math.max(...values);
    const pad = Math.max(0.5 * (hi - lo), 0.5, 0.25 * Math.max(Math.abs(lo), Math.abs(hi)));
    // Not beyond the bounds the model gives the state (no negative concentrations on the plane).
    const { min = -Infinity, max = Infinity } = model.states[i]!;
    return [Math.max(lo - pad, min), Math.min(hi + pad, max)];
  };
  return { x: side(ix), y: side(iy) };
}

export function portraitAt(model: Model, request: PortraitRequest): PortraitResult {
  const set = { ...request.set };
  if (request.at !== undefined) {
    parameterIndex(model, request.at[0]);
    set[request.at[0]] = request.at[1];
  }
  const { system, params, guess } = prepare(model, { set, ...(request.start && { start: request.start }) });
  const ix = request.x !== undefined ? stateIndex(model, request.x) : 0;
  const iy = request.y !== undefined ? stateIndex(model, request.y) : 1;
  // A slow model is searched in a longer time unit, its eigenvalues given back in its own (timeUnit.ts).
  const r = timeFactor(system, params, guess);
  const equilibria = equilibriaInModelTime(findEquilibria(inLongerTime(system, r), params, { guess, keepOutsideBox: true }).equilibria, r);
  const window = request.window ?? defaultWindow([guess, ...equilibria.map((e) => e.state)], ix, iy, model);
  const held = (equilibria.find((e) => e.stable) ?? equilibria[0])?.state ?? guess;
  const data = buildPortrait(system, params, { ix, iy, window, held: held.slice(), equilibria });
  return { data, equilibria, params };
}
