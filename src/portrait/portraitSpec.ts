/**
 * A layered Vega-Lite (v6) chart of a phase portrait, from `PortraitData`:
 *
 *   1. direction field: short rules with a triangle at the tip, fainter where the flow is slow;
 *   2. sample trajectories: thin grey lines;
 *   3. nullclines: one colour per state, named "x-nullcline (dx/dt = 0)" in the legend;
 *   4. saddle manifolds: thicker lines, stable and unstable in two further colours;
 *   5. equilibria: filled points, shape by stability, with type and eigenvalues in the tooltip.
 *
 * Scales are fixed to the window (no padding, no rounding) and every mark is clipped to it.
 * Lines use `detail` per curve and `order` by point index, so each is drawn in integration order.
 * Arrow geometry is computed here in pixels so that every arrow has the same length on screen.
 */
import type { TopLevelSpec } from 'vega-lite';
import { CAUTION } from '../report/caution.js';
import { valueWithUnit, withUnit } from '../report/withUnit.js';
import { wrapText } from '../report/wrapText.js';
import type { Eigenvalue } from '../types.js';
import type { PortraitData, PortraitEquilibrium } from './buildPortrait.js';
import type { Point2 } from './plane.js';
import type { PortraitCurve } from './trajectories.js';

export interface PortraitSpecOptions {
  /** Plot area in pixels. */
  width: number;
  height: number;
}

/** Common practice: a plot area about the size of a laptop half-screen. */
export const PORTRAIT_SPEC_DEFAULTS: PortraitSpecOptions = { width: 560, height: 440 };

/**
 * Stable layer names. Vega draws the layer named `n` as the mark `n_marks`, and that name is a
 * class of the mark's SVG group (the browser tests find the marks by it).
 */
export const PORTRAIT_MARKS = {
  arrows: 'bt_portrait_arrows',
  arrowHeads: 'bt_portrait_arrow_heads',
  trajectories: 'bt_portrait_trajectories',
  nullclines: 'bt_portrait_nullclines',
  manifolds: 'bt_portrait_manifolds',
  equilibria: 'bt_portrait_equilibria',
} as const;

/** Colours (an own choice): nullclines of x and y, stable and unstable manifolds. */
const CURVE_COLOURS = ['#2a7f62', '#c26a1b', '#3b5bdb', '#c2255c'];
const TRAJECTORY_COLOUR = '#9a9a9a';
const ARROW_COLOUR = '#5c6370';
const STABILITY = ['stable', 'unstable', 'saddle'] as const;
const STABILITY_SHAPES = ['circle', 'square', 'diamond'];

export function nullclineLabel(name: string): string {
  return `${name}-nullcline (d${name}/dt = 0)`;
}

function axisTitle(a: { name: string; unit?: string }): string {
  return withUnit(a.name, a.unit);
}

function formatEigenvalues(values: Eigenvalue[]): string {
  const num = (v: number): string => String(Number(v.toPrecision(5)));
  return values.map((e) => (e.im === 0 ? num(e.re) : `${num(e.re)} ${e.im < 0 ? '−' : '+'} ${num(Math.abs(e.im))}i`)).join(', ');
}

function stabilityClass(e: PortraitEquilibrium): (typeof STABILITY)[number] {
  if (e.stable) return 'stable';
  return e.unstableDimension > 0 && e.unstableDimension < e.eigenvalues.length ? 'saddle' : 'unstable';
}

/** Line rows {id, i, x, y, curve}: one per vertex. */
function lineRows(lines: { id: string; curve: string; points: Point2[] }[]): Record<string, string | number>[] {
  return lines.flatMap(({ id, curve, points }) => points.map((q, i) => ({ id, i, x: q.x, y: q.y, curve })));
}

function manifoldId(c: PortraitCurve, k: number): string {
  return `${c.kind} of equilibrium ${c.saddle ?? '?'} (${c.side === -1 ? 'minus' : 'plus'} side, curve ${k})`;
}

export function portraitSpec(data: PortraitData, opts: PortraitSpecOptions = PORTRAIT_SPEC_DEFAULTS): TopLevelSpec {
  const { window: w } = data;
  const W = w.x[1] - w.x[0], H = w.y[1] - w.y[0];
  const x = { field: 'x', type: 'quantitative' as const, title: axisTitle(data.x), scale: { domain: w.x, nice: false, zero: false } };
  const y = { field: 'y', type: 'quantitative' as const, title: axisTitle(data.y), scale: { domain: w.y, nice: false, zero: false } };
  const curveLabels = [...data.nullclines.map((c) => nullclineLabel(c.name)), 'stable manifold', 'unstable manifold'];
  const color = { field: 'curve', type: 'nominal' as const, title: 'Curve', scale: { domain: curveLabels, range: CURVE_COLOURS } };

  // Arrows: half-length ℓ pixels either side of the cell centre, along the flow direction in pixels.
  const ell = 0.35 * Math.min(opts.width / data.settings.arrowColumns, opts.height / data.settings.arrowRows);
  const arrows = data.arrows.map((a) => {
    const px = a.u * opts.width, py = a.v * opts.height, len = Math.hypot(px, py);
    const dx = (ell * px) / len / opts.width * W, dy = (ell * py) / len / opts.height * H;
    return { x: a.x - dx, y: a.y - dy, x2: a.x + dx, y2: a.y + dy, speed: a.speed, angle: (Math.atan2(px, py) * 180) / Math.PI };
  });
  const speedOpacity = { field: 'speed', type: 'quantitative' as const, scale: { type: 'sqrt' as const, range: [0.25, 0.9] }, legend: null };

  const nullclineLines = data.nullclines.flatMap((c) =>
    c.polylines.map((points, k) => ({ id: `${c.name} nullcline ${k}`, curve: nullclineLabel(c.name), points })));
  const manifoldLines = data.manifolds.map((c, k) => ({ id: manifoldId(c, k), curve: c.kind, points: c.points }));
  const trajectoryLines = data.trajectories.map((c, k) => ({ id: `trajectory ${k}`, curve: 'trajectory', points: c.points }));
  const equilibria = data.equilibria.map((e) => ({
    x: e.x, y: e.y, type: e.type, stability: stabilityClass(e), eigenvalues: formatEigenvalues(e.eigenvalues), residual: e.residual,
  }));
  const subtitle = [data.parameters.map((q) => `${q.name} = ${valueWithUnit(String(q.value), q.unit)}`).join(', ')];
  if (data.note !== undefined) subtitle.push(data.note);
  // The caution travels with the chart, so that the SVG alone carries it (110 characters a line: common practice).
  subtitle.push(...wrapText(`Caution: ${CAUTION}`, 110));

  return {
    $schema: 'https://vega.github.io/schema/vega-lite/v6.json',
    title: { text: `Phase portrait: ${data.title}`, subtitle },
    width: opts.width,
    height: opts.height,
    layer: [
      {
        name: PORTRAIT_MARKS.arrows,
        data: { values: arrows },
        mark: { type: 'rule', clip: true, color: ARROW_COLOUR, strokeWidth: 1 },
        encoding: { x, y, x2: { field: 'x2' }, y2: { field: 'y2' }, opacity: speedOpacity },
      },
      {
        name: PORTRAIT_MARKS.arrowHeads,
        data: { values: arrows },
        mark: { type: 'point', shape: 'triangle-up', filled: true, clip: true, color: ARROW_COLOUR, size: 18 },
        encoding: {
          x: { ...x, field: 'x2' }, y: { ...y, field: 'y2' },
          angle: { field: 'angle', type: 'quantitative', scale: null }, opacity: speedOpacity,
        },
      },
      {
        name: PORTRAIT_MARKS.trajectories,
        data: { values: lineRows(trajectoryLines) },
        mark: { type: 'line', clip: true, color: TRAJECTORY_COLOUR, strokeWidth: 0.8, opacity: 0.8 },
        encoding: { x, y, detail: { field: 'id', type: 'nominal' }, order: { field: 'i', type: 'quantitative' } },
      },
      {
        name: PORTRAIT_MARKS.nullclines,
        data: { values: lineRows(nullclineLines) },
        mark: { type: 'line', clip: true, strokeWidth: 2 },
        encoding: { x, y, color, detail: { field: 'id', type: 'nominal' }, order: { field: 'i', type: 'quantitative' } },
      },
      {
        name: PORTRAIT_MARKS.manifolds,
        data: { values: lineRows(manifoldLines) },
        mark: { type: 'line', clip: true, strokeWidth: 2.6 },
        encoding: { x, y, color, detail: { field: 'id', type: 'nominal' }, order: { field: 'i', type: 'quantitative' } },
      },
      {
        name: PORTRAIT_MARKS.equilibria,
        data: { values: equilibria },
        mark: { type: 'point', filled: true, clip: true, size: 110, color: '#111111', stroke: '#ffffff', strokeWidth: 1 },
        encoding: {
          x, y,
          shape: { field: 'stability', type: 'nominal', title: 'Equilibrium', scale: { domain: [...STABILITY], range: STABILITY_SHAPES } },
          tooltip: [
            { field: 'type', title: 'type' },
            { field: 'x', title: data.x.name, type: 'quantitative', format: '.6g' },
            { field: 'y', title: data.y.name, type: 'quantitative', format: '.6g' },
            { field: 'eigenvalues', title: 'eigenvalues' },
            { field: 'residual', title: 'residual', type: 'quantitative', format: '.2e' },
          ],
        },
      },
    ],
  };
}
