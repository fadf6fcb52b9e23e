/**
 * The phase portrait at one parameter value, as plain data for a chart:
 *
 *   1. check the plane (two different states, a proper window);
 *   2. direction field → the median arrow speed sets the time scale of every curve;
 *   3. nullclines of the two plotted states;
 *   4. sample trajectories (forward and backward from Halton start points);
 *   5. stable and unstable manifolds of every saddle.
 *
 * For n > 2 the plane is a slice: every other state is held at `held` (and `note` says so);
 * trajectories still move in all n states and are drawn projected.
 */
import { UsageError, message } from '../errors.js';
import type { Eigenvalue, Equilibrium, System } from '../types.js';
import { DIRECTION_FIELD_DEFAULTS, directionField, type Arrow } from './directionField.js';
import type { CurveLimits } from './followCurve.js';
import { NULLCLINE_DEFAULTS, nullclines, type Nullcline } from './nullclines.js';
import { insideWindow, type PlaneFrame, type PortraitWindow } from './plane.js';
import { CURVE_LIMITS, PORTRAIT } from './portraitDefaults.js';
import { saddleManifolds } from './saddleManifolds.js';
import { trajectories, type PortraitCurve } from './trajectories.js';

export interface PortraitOptions {
  ix: number;
  iy: number;
  window: PortraitWindow;
  /** A full state vector; entries other than ix, iy give the held values (n > 2). */
  held: Float64Array;
  /** All equilibria known at p (used to end curves); those inside the window are drawn. */
  equilibria: Equilibrium[];
}

export interface NamedValue {
  name: string;
  value: number;
  unit?: string;
}

export interface PortraitAxis {
  state: number;
  name: string;
  unit?: string;
}

export interface PortraitEquilibrium {
  /** Position in the caller's equilibria list (the `saddle` index of manifolds refers to it). */
  index: number;
  x: number;
  y: number;
  type: string;
  stable: boolean;
  unstableDimension: number;
  eigenvalues: Eigenvalue[];
  residual: number;
}

export interface PortraitData {
  title: string;
  parameters: NamedValue[];
  window: PortraitWindow;
  x: PortraitAxis;
  y: PortraitAxis;
  /** The other states and their held values (empty for n = 2). */
  held: NamedValue[];
  note?: string;
  /** Nullclines of the x state, then of the y state. */
  nullclines: (Nullcline & { name: string })[];
  arrows: Arrow[];
  trajectories: PortraitCurve[];
  manifolds: PortraitCurve[];
  equilibria: PortraitEquilibrium[];
  settings: {
    arrowColumns: number;
    arrowRows: number;
    nullclineCells: number;
    starts: number;
    manifoldOffset: number;
    limits: CurveLimits;
  };
}

/** Shortest round-trip form, at most 6 significant digits. */
function short(v: number): string {
  return String(Number(v.toPrecision(6)));
}

function checkPlane(system: System, opts: PortraitOptions): void {
  const { file, states } = system.info;
  if (system.n < 2) throw new UsageError(message.portraitNeedsTwoStates(file, system.n));
  if (opts.ix === opts.iy) throw new UsageError(message.portraitSameState(file, states[opts.ix]?.name ?? String(opts.ix)));
  for (const [k, [lo, hi]] of [[opts.ix, opts.window.x], [opts.iy, opts.window.y]] as const) {
    if (!(Number.isFinite(lo) && Number.isFinite(hi) && lo < hi)) {
      throw new UsageError(message.portraitBadWindow(file, states[k]?.name ?? String(k), lo, hi));
    }
  }
  if (opts.held.length !== system.n) throw new Error(`held has ${opts.held.length} entries, the system ${system.n} states`);
}

/** Median of the arrow speeds, or NaN without arrows. */
function medianSpeed(arrows: Arrow[]): number {
  const s = arrows.map((a) => a.speed).sort((a, b) => a - b);
  if (s.length === 0) return NaN;
  const m = s.length >> 1;
  return s.length % 2 ? s[m]! : (s[m - 1]! + s[m]!) / 2;
}

export function buildPortrait(system: System, p: Float64Array, opts: PortraitOptions): PortraitData {
  checkPlane(system, opts);
  const { ix, iy, window: w, equilibria } = opts;
  const info = system.info;
  const frame: PlaneFrame = { ix, iy, window: w, held: opts.held };

  const arrows = directionField(system, p, frame, DIRECTION_FIELD_DEFAULTS);
  const speed = medianSpeed(arrows);
  // Common practice: without a usable speed, 100 time units.
  const maxTime = speed > 0 && Number.isFinite(speed) ? PORTRAIT.windowCrossings / speed : 100;
  const limits: CurveLimits = { ...CURVE_LIMITS, maxTime };

  const axis = (k: number): PortraitAxis => {
    const s = info.states[k];
    return { state: k, name: s?.name ?? `x${k + 1}`, ...(s?.unit !== undefined ? { unit: s.unit } : {}) };
  };
  const x = axis(ix), y = axis(iy);
  const held: NamedValue[] = [];
  info.states.forEach((s, k) => {
    if (k !== ix && k !== iy) held.push({ name: s.name, value: opts.held[k]!, ...(s.unit !== undefined ? { unit: s.unit } : {}) });
  });

  return {
    title: info.title ?? info.file,
    parameters: info.parameters.map((q, k) => ({ name: q.name, value: p[k]!, ...(q.unit !== undefined ? { unit: q.unit } : {}) })),
    window: w,
    x,
    y,
    held,
    ...(held.length > 0 ? { note: `other states held at ${held.map((h) => `${h.name} = ${short(h.value)}`).join(', ')}` } : {}),
    nullclines: nullclines(system, p, frame, NULLCLINE_DEFAULTS).map((c) => ({ ...c, name: axis(c.state).name })),
    arrows,
    trajectories: trajectories(system, p, frame, equilibria, { starts: PORTRAIT.starts, limits }),
    manifolds: saddleManifolds(system, p, frame, equilibria, { offset: PORTRAIT.manifoldOffset, limits }),
    equilibria: equilibria
      .map((e, index) => ({
        index, x: e.state[ix]!, y: e.state[iy]!, type: e.type, stable: e.stable,
        unstableDimension: e.unstableDimension, eigenvalues: e.eigenvalues, residual: e.residual,
      }))
      .filter((e) => insideWindow(w, e.x, e.y, 0)),
    settings: {
      arrowColumns: DIRECTION_FIELD_DEFAULTS.columns,
      arrowRows: DIRECTION_FIELD_DEFAULTS.rows,
      nullclineCells: NULLCLINE_DEFAULTS.cells,
      starts: PORTRAIT.starts,
      manifoldOffset: PORTRAIT.manifoldOffset,
      limits,
    },
  };
}
