/**
 * Direction field: one arrow at the centre of each cell of a coarse grid over the window.
 *
 * Directions are measured in window fractions, (u, v) ∝ (f_ix / width, f_iy / height) with
 * u² + v² = 1, so an arrow drawn on a plot of any aspect ratio points along the flow once each
 * component is scaled by the plot's width and height. `speed` = ‖(f_ix / width, f_iy / height)‖₂
 * is in window lengths per unit time. Points where the rate is zero or not finite get no arrow.
 */
import type { System } from '../types.js';
import { stateAt, windowSize, type PlaneFrame } from './plane.js';

export interface Arrow {
  /** Arrow centre, in data coordinates. */
  x: number;
  y: number;
  /** Unit direction in window fractions. */
  u: number;
  v: number;
  /** Window lengths per unit time. */
  speed: number;
}

export interface DirectionFieldOptions {
  columns: number;
  rows: number;
}

/** Common practice: about 20 × 16 arrows keep a plot readable. */
export const DIRECTION_FIELD_DEFAULTS: DirectionFieldOptions = { columns: 20, rows: 16 };

export function directionField(system: System, p: Float64Array, frame: PlaneFrame,
  opts: DirectionFieldOptions = DIRECTION_FIELD_DEFAULTS): Arrow[] {
  const { window: w, ix, iy } = frame;
  const { width, height } = windowSize(w);
  const f = new Float64Array(system.n);
  const arrows: Arrow[] = [];
  for (let r = 0; r < opts.rows; r++) {
    for (let c = 0; c < opts.columns; c++) {
      const x = w.x[0] + ((c + 0.5) * width) / opts.columns;
      const y = w.y[0] + ((r + 0.5) * height) / opts.rows;
      system.rhs(stateAt(frame, x, y), p, f);
      const a = f[ix]! / width, b = f[iy]! / height;
      const speed = Math.hypot(a, b);
      if (!(speed > 0) || !Number.isFinite(speed)) continue;
      arrows.push({ x, y, u: a / speed, v: b / speed, speed });
    }
  }
  return arrows;
}
