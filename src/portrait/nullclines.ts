/**
 * Nullclines in the plotting plane: the zero sets of f_ix and f_iy (the two plotted components of
 * the right-hand side), with every other state held.
 *
 * 1. Sample f on a (cells + 1)² node grid over the window (one rhs call per node).
 * 2. Trace each zero set with marching squares (`zeroContour`).
 * 3. Refine each vertex by Newton steps along the gradient of g = f_k in the plane,
 *      z ← z − g(z) ∇g(z) / ‖∇g(z)‖²,   ∇g = (∂f_k/∂x_ix, ∂f_k/∂x_iy) from the Jacobian,
 *    until |g| ≤ absTol or a step is below 1e-10 cell diagonals (the rounding floor of badly scaled
 *    models); a vertex whose steps leave the cell diagonal, meet a non-finite value or
 *    do not reach absTol keeps its interpolated position (counted in `unrefined`).
 */
import type { System } from '../types.js';
import { zeroContour } from './marchingSquares.js';
import { stateAt, type PlaneFrame, type Point2 } from './plane.js';

export interface NullclineOptions {
  /** Grid cells along each axis. */
  cells: number;
  /** Newton steps per vertex. */
  maxIter: number;
  /** Stop refining a vertex once |f_k| ≤ absTol. */
  absTol: number;
}

/** Common practice: a 120-cell grid resolves curves well at plot resolution; Newton converges in 2–4 steps. */
export const NULLCLINE_DEFAULTS: NullclineOptions = { cells: 120, maxIter: 8, absTol: 1e-12 };

/** A Newton step shorter than this many cell diagonals ends the refinement (rounding floor). Common practice. */
const STEP_FLOOR = 1e-10;

export interface Nullcline {
  /** Index of the state whose rate is zero along these curves. */
  state: number;
  polylines: Point2[][];
  /** Largest |f_state| over all vertices after refinement. */
  residual: number;
  /** Vertices left at their interpolated position. */
  unrefined: number;
}

/** The nullclines of the states frame.ix and frame.iy, in that order. */
export function nullclines(system: System, p: Float64Array, frame: PlaneFrame,
  opts: NullclineOptions = NULLCLINE_DEFAULTS): Nullcline[] {
  const { window: w, ix, iy } = frame;
  const nx = opts.cells, ny = opts.cells;
  const grid = { nx, ny, x0: w.x[0], y0: w.y[0], dx: (w.x[1] - w.x[0]) / nx, dy: (w.y[1] - w.y[0]) / ny };
  const f = new Float64Array(system.n);
  const valuesX = new Float64Array((nx + 1) * (ny + 1));
  const valuesY = new Float64Array((nx + 1) * (ny + 1));
  for (let j = 0; j <= ny; j++) {
    for (let i = 0; i <= nx; i++) {
      system.rhs(stateAt(frame, grid.x0 + i * grid.dx, grid.y0 + j * grid.dy), p, f);
      valuesX[j * (nx + 1) + i] = f[ix]!;
      valuesY[j * (nx + 1) + i] = f[iy]!;
    }
  }
  const component = (k: number) => (x: number, y: number): number => {
    system.rhs(stateAt(frame, x, y), p, f);
    return f[k]!;
  };
  const reach = Math.hypot(grid.dx, grid.dy);
  return [ix, iy].map((k, which) => {
    const raw = zeroContour(which === 0 ? valuesX : valuesY, grid, component(k));
    let residual = 0;
    let unrefined = 0;
    const polylines = raw.map((line) => line.map((v) => {
      const r = refineVertex(system, p, frame, k, v, reach, opts);
      residual = Math.max(residual, r.residual);
      if (!r.refined) unrefined++;
      return r.point;
    }));
    return { state: k, polylines, residual, unrefined };
  });
}

/** Newton projection of one vertex onto f_k = 0 along the in-plane gradient. */
function refineVertex(system: System, p: Float64Array, frame: PlaneFrame, k: number, start: Point2,
  reach: number, opts: NullclineOptions): { point: Point2; residual: number; refined: boolean } {
  const { n } = system;
  const f = new Float64Array(n);
  const jac = new Float64Array(n * n);
  let x = start.x, y = start.y;
  const evaluate = (): number => {
    const s = stateAt(frame, x, y);
    system.rhs(s, p, f);
    return f[k]!;
  };
  let g = evaluate();
  const startResidual = Math.abs(g);
  let step = Infinity;
  const settled = (): boolean => Math.abs(g) <= opts.absTol || step <= STEP_FLOOR * reach;
  for (let it = 0; it < opts.maxIter && Number.isFinite(g) && !settled(); it++) {
    system.jacobian(stateAt(frame, x, y), p, jac);
    const gx = jac[k * n + frame.ix]!, gy = jac[k * n + frame.iy]!;
    const norm2 = gx * gx + gy * gy;
    if (!(norm2 > 0) || !Number.isFinite(norm2)) break;
    const sx = (g * gx) / norm2, sy = (g * gy) / norm2;
    x -= sx;
    y -= sy;
    step = Math.hypot(sx, sy);
    if (!(Math.hypot(x - start.x, y - start.y) <= reach)) break;
    g = evaluate();
  }
  if (Number.isFinite(g) && settled() && Math.hypot(x - start.x, y - start.y) <= reach) {
    return { point: { x, y }, residual: Math.abs(g), refined: true };
  }
  return { point: start, residual: Number.isFinite(startResidual) ? startResidual : Infinity, refined: false };
}
