/**
 * The bifurcation diagram as a Vega-Lite (v6) chart, from a `Report`:
 *
 *   ┌ title: model title, varied parameter and range ─────────────────────────┐
 *   │ one panel per plotted state (or one for the Euclidean norm of the state):│
 *   │   branch lines, stable solid / unstable dashed, one colour per branch;   │
 *   │   special points, one marker shape and fill per type, tooltips;          │
 *   │   the nominal design value as a vertical rule with its margin label;     │
 *   │ last panel: largest real part of the eigenvalues, with a zero line.      │
 *   └ legends: branch, stability, special point (full words) ─────────────────┘
 *
 * Lines are drawn in arclength order: `order` by point index and `detail` by run (branch + stretch of
 * equal stability, see `branchRows`), never sorted by parameter, so folds turn back as they should.
 * Line points that cannot be seen missing are left out (thinLines.ts); report.json keeps them all.
 * Zoom and pan: an interval selection bound to the scales, on the parameter axis only, shared by
 * every panel (the parameter scale is resolved as shared).
 *
 * Every mark layer has a stable `name` ("bt-…"); Vega turns it into a class of the SVG group, which
 * the browser tests use to find the marks.
 */
import type { TopLevelSpec } from 'vega-lite';
import type { Field } from 'vega-lite/types_unstable/channeldef.js';
import type { LayerSpec } from 'vega-lite/types_unstable/spec/layer.js';
import type { UnitSpec } from 'vega-lite/types_unstable/spec/unit.js';
import { UsageError, message } from '../errors.js';
import type { Report } from '../types.js';
import { branchRows, specialRows, stateField, type DiagramRow } from './diagramData.js';
import { thinLines } from './thinLines.js';
import { BRANCH_COLOURS, NOMINAL_COLOUR, POINT_STYLE, STABILITY_DASH } from './diagramStyle.js';
import { EVENT_LABELS } from './eventWords.js';
import { formatNumber } from './formatNumber.js';
import { marginLabel } from './marginText.js';
import { wrapText } from './wrapText.js';
import { valueWithUnit, withUnit } from './withUnit.js';

export interface DiagramOptions {
  /**
   * State names to plot (one panel each, in the given order), or 'norm' for one panel of ‖x‖₂.
   * Default (defaultPlot): every state, or the norm for a model of more than DIAGRAM_STATE_PANELS states.
   */
  plot?: readonly string[] | 'norm';
}

/**
 * The default diagram has one panel per state for models of up to this many states; a larger model
 * (a discretised PDE with a hundred states, say) gets one panel of the norm instead, which stays
 * readable and renders in a fraction of the time. Common practice: a screen's worth of panels.
 */
export const DIAGRAM_STATE_PANELS = 8;

/** What the diagram plots when no choice is given. */
export function defaultPlot(stateCount: number): 'norm' | undefined {
  return stateCount > DIAGRAM_STATE_PANELS ? 'norm' : undefined;
}

/** Common practice: panels about half a laptop screen wide, the eigenvalue panel shorter. */
export const DIAGRAM_SIZE = { width: 640, panelHeight: 240, eigenvalueHeight: 150 } as const;

/**
 * Stable mark names of the diagram. Vega names the drawn mark `<name>_marks`, and the SVG group of
 * each mark carries that name as a class (`mark-line role-mark bt_state0_lines_marks`).
 * Panel keys: state0, state1, … (model index of the plotted state), norm, eigenvalues.
 */
export const DIAGRAM_MARKS = {
  lines: (panel: string): string => `bt_${panel}_lines`,
  points: (panel: string): string => `bt_${panel}_points`,
  nominal: (panel: string): string => `bt_${panel}_nominal`,
  nominalLabel: 'bt_nominal_label',
  zero: 'bt_eigenvalue_zero',
  statePanel: (i: number): string => `state${i}`,
  normPanel: 'norm',
  eigenvaluePanel: 'eigenvalues',
  /** The SVG class Vega gives the mark named `name`. */
  svgClass: (name: string): string => `${name}_marks`,
} as const;

const NORM_FIELD = 'norm';
/** Legend lines long and thick enough to show the dash pattern (common practice). */
const LINE_LEGEND = { symbolSize: 500, symbolStrokeWidth: 2 } as const;
/** Characters per subtitle line of the caution (fits the panel width at the subtitle font; common practice). */
const CAUTION_LINE = 110;
const ZOOM = 'bt_zoom';

interface Panel {
  key: string;
  field: string;
  title: string;
  height: number;
}

type Layer = LayerSpec<Field> | UnitSpec<Field>;
type Panels = readonly Panel[];

export function diagramSpec(report: Report, opts: DiagramOptions = {}): TopLevelSpec {
  const names = report.model.states.map((s) => s.name);
  const plot = opts.plot ?? defaultPlot(names.length);
  const norm = plot === 'norm';
  const statePanelList = plot === 'norm' ? [normPanel(report)] : statePanels(report, plot);
  const eigen: Panel = {
    key: DIAGRAM_MARKS.eigenvaluePanel, field: 'maxRealPart', title: 'largest real part of the eigenvalues',
    height: DIAGRAM_SIZE.eigenvalueHeight,
  };
  const all: Panels = [...statePanelList, eigen];
  // Tooltips name the plotted states, or every state of a model small enough to list them.
  const tooltipStates = Array.isArray(plot) ? statePanelList.map((p) => p.field)
    : names.length <= DIAGRAM_STATE_PANELS ? names.map((_, i) => stateField(i)) : [];
  const specials = withNorm(specialRows(report), names.length, norm);
  // Line rows carry only what the lines draw (a model of a hundred states would otherwise put
  // every state into every row of diagram.vl.json and of the page).
  const lineFields = ['parameter', ...all.map((p) => p.field)];
  const logX = report.settings.parameterScale === 'log';
  const branches = thinLines(withNorm(branchRows(report), names.length, norm), lineFields, undefined, logX ? ['parameter'] : [])
    .map((r) => pick(r, ['branch', 'run', 'index', 'stability', ...lineFields]));
  const style = chartStyle(report, specials);

  const panelSpec = (panel: Panel, extra: Layer[]): LayerSpec<Field> => {
    const flat = flatDomain(panel.field, [branches, specials]);
    const y = {
      field: panel.field, type: 'quantitative' as const, title: panel.title,
      scale: flat === null ? { zero: false } : { zero: false, domain: flat },
    };
    const layers: Layer[] = [...extra, {
      name: DIAGRAM_MARKS.lines(panel.key),
      data: { name: 'branches' },
      mark: { type: 'line', clip: true, strokeWidth: 2, strokeCap: 'butt' },
      encoding: {
        x: style.x, y, stroke: style.stroke, strokeDash: style.strokeDash,
        detail: { field: 'run', type: 'nominal' },
        order: { field: 'index', type: 'quantitative' },
      },
    }];
    if (style.present.length > 0) {
      layers.push({
        name: DIAGRAM_MARKS.points(panel.key),
        data: { name: 'special' },
        mark: { type: 'point', filled: true, clip: true, size: 120, opacity: 1, stroke: '#ffffff', strokeWidth: 1.2 },
        encoding: { x: style.x, y, shape: style.shape, fill: style.fill, tooltip: pointTooltip(report, tooltipStates, norm) },
      });
    }
    return { width: DIAGRAM_SIZE.width, height: panel.height, layer: layers };
  };

  const nominal = nominalDatum(report);
  const nominalLayers = (panel: Panel, labelled: boolean): Layer[] => {
    if (nominal === null) return [];
    const rule: Layer = {
      name: DIAGRAM_MARKS.nominal(panel.key),
      data: { values: [nominal] },
      mark: { type: 'rule', clip: true, color: NOMINAL_COLOUR, strokeWidth: 1.5, opacity: 0.8 },
      encoding: { x: style.x },
    };
    // The label reads to the right of the rule, or to its left in the right third of the axis (it would be cut off).
    const right = axisFraction(report, nominal.parameter) > 2 / 3;
    const label: Layer = {
      name: DIAGRAM_MARKS.nominalLabel,
      data: { values: [nominal] },
      mark: {
        type: 'text', clip: true, align: right ? 'right' : 'left', baseline: 'top', dx: right ? -4 : 4, color: NOMINAL_COLOUR, fontSize: 11,
      },
      encoding: { x: style.x, y: { value: 4 }, text: { field: 'label', type: 'nominal' } },
    };
    return labelled ? [rule, label] : [rule];
  };
  const zeroLine: Layer = {
    name: DIAGRAM_MARKS.zero,
    data: { values: [{ zero: 0 }] },
    mark: { type: 'rule', color: '#8a8a8a', strokeWidth: 1 },
    encoding: { y: { datum: 0, type: 'quantitative' } },
  };

  const vconcat = [
    ...statePanelList.map((p, k) => panelSpec(p, nominalLayers(p, k === 0))),
    panelSpec(eigen, [zeroLine, ...nominalLayers(eigen, false)]),
  ];
  return {
    $schema: 'https://vega.github.io/schema/vega-lite/v6.json',
    title: { text: diagramTitle(report), subtitle: diagramSubtitle(report), anchor: 'start' },
    params: [{
      name: ZOOM, select: { type: 'interval', encodings: ['x'] }, bind: 'scales',
      views: all.map((p) => DIAGRAM_MARKS.lines(p.key)),
    }],
    datasets: { branches, special: specials },
    vconcat,
    resolve: {
      scale: { x: 'shared', y: 'independent', stroke: 'shared', strokeDash: 'shared', shape: 'shared', fill: 'shared' },
      legend: { stroke: 'shared', strokeDash: 'shared', shape: 'shared', fill: 'shared' },
    },
    config: { view: { stroke: '#d0d0d0' }, axis: { grid: true, gridColor: '#eeeeee' } },
  };
}

/** Encodings shared by every panel: parameter axis, branch colours, stability dashes, special-point markers. */
function chartStyle(report: Report, specials: readonly DiagramRow[]) {
  const branchNames = report.branches.map((b) => `branch ${b.id}`);
  const present = EVENT_LABELS.filter((label) => specials.some((r) => r.type === label));
  const pointLegend = { title: 'Special point', labelLimit: 260 };
  return {
    present,
    x: {
      field: 'parameter', type: 'quantitative' as const, title: withUnit(report.parameter, report.unit),
      // A sweep over decades (--log) is drawn on a logarithmic axis.
      scale: report.settings.parameterScale === 'log' ? { type: 'log' as const, nice: false } : { zero: false, nice: false },
    },
    stroke: {
      field: 'branch', type: 'nominal' as const, legend: { title: 'Branch', ...LINE_LEGEND },
      scale: { domain: branchNames, range: branchNames.map((_, k) => BRANCH_COLOURS[k % BRANCH_COLOURS.length]!) },
    },
    strokeDash: {
      field: 'stability', type: 'nominal' as const, legend: { title: 'Stability', ...LINE_LEGEND },
      scale: { domain: ['stable', 'unstable'], range: [[...STABILITY_DASH.stable], [...STABILITY_DASH.unstable]] },
    },
    shape: {
      field: 'type', type: 'nominal' as const, legend: pointLegend,
      scale: { domain: [...present], range: present.map((l) => POINT_STYLE[l].shape) },
    },
    fill: {
      field: 'type', type: 'nominal' as const, legend: pointLegend,
      scale: { domain: [...present], range: present.map((l) => POINT_STYLE[l].fill) },
    },
  };
}

/** The nominal design value with its margin label, when it lies inside the traced range. */
/** Where a parameter value sits along the diagram's horizontal axis, 0 at its left end and 1 at its right. */
function axisFraction(report: Report, value: number): number {
  const lo = Math.min(report.range.from, report.range.to);
  const hi = Math.max(report.range.from, report.range.to);
  const f = (v: number) => (report.settings.parameterScale === 'log' ? Math.log10(v) : v);
  return (f(value) - f(lo)) / (f(hi) - f(lo));
}

function nominalDatum(report: Report): { parameter: number; label: string } | null {
  const m = report.margin;
  const lo = Math.min(report.range.from, report.range.to);
  const hi = Math.max(report.range.from, report.range.to);
  if (m === null || !(m.nominal >= lo && m.nominal <= hi)) return null;
  return { parameter: m.nominal, label: marginLabel(m) };
}

/** "Cooled tank reactor: steady states as D varies". */
export function diagramTitle(report: Report): string {
  const name = report.model.title ?? report.model.file;
  return `${name}: steady states as ${report.parameter} varies`;
}

function diagramSubtitle(report: Report): string[] {
  const range = `${report.parameter} from ${formatNumber(report.range.from)} to ${valueWithUnit(formatNumber(report.range.to), report.unit)}`;
  const counts = `${report.branches.length} branch${report.branches.length === 1 ? '' : 'es'}, ` +
    `${report.events.length} special point${report.events.length === 1 ? '' : 's'}`;
  const lines = [`${range}; ${counts}. Solid lines: stable; dashed: unstable.`];
  if (report.interrupted) lines.push('Interrupted before the end: the branches shown are incomplete.');
  // The caution travels with the chart, so that the SVG alone (in a document or slide) carries it.
  return [...lines, ...wrapText(`Caution: ${report.caution}`, CAUTION_LINE)];
}

function statePanels(report: Report, plot: readonly string[] | undefined): Panel[] {
  const states = report.model.states;
  const names = states.map((s) => s.name);
  const wanted = plot === undefined || plot.length === 0 ? names : plot;
  return wanted.map((name) => {
    const i = names.indexOf(name);
    if (i < 0) throw new UsageError(message.unknownState(name, names));
    const s = states[i]!;
    return { key: DIAGRAM_MARKS.statePanel(i), field: stateField(i), title: withUnit(s.name, s.unit), height: DIAGRAM_SIZE.panelHeight };
  });
}

function normPanel(report: Report): Panel {
  const states = report.model.states;
  const units = new Set(states.map((s) => s.unit ?? ''));
  const unit = units.size === 1 ? [...units][0] : undefined;
  const title = `norm of the state, √(${states.map((s) => `${s.name}²`).join(' + ')})`;
  return { key: DIAGRAM_MARKS.normPanel, field: NORM_FIELD, title: withUnit(title, unit), height: DIAGRAM_SIZE.panelHeight };
}

/**
 * A y domain for a panel whose values are all equal (a constant state, such as an equilibrium that
 * stays at 0): the value ± max(1, |value|)/2, so the line sits mid-panel with readable ticks. Null
 * when the values spread (Vega-Lite then fits the domain to them).
 */
function flatDomain(field: string, tables: readonly (readonly DiagramRow[])[]): [number, number] | null {
  let lo = Infinity;
  let hi = -Infinity;
  for (const rows of tables) {
    for (const r of rows) {
      const v = r[field];
      if (typeof v !== 'number') continue;
      lo = Math.min(lo, v);
      hi = Math.max(hi, v);
    }
  }
  if (!(lo === hi)) return null;
  const half = Math.max(1, Math.abs(lo)) / 2;
  return [lo - half, lo + half];
}

/** Adds the Euclidean norm of the state (field "norm") to each row; null when a state value is missing. */
function withNorm(rows: DiagramRow[], n: number, norm: boolean): DiagramRow[] {
  if (!norm) return rows;
  return rows.map((r) => {
    let sum = 0;
    for (let i = 0; i < n; i++) {
      const v = r[stateField(i)];
      if (typeof v !== 'number') return { ...r, [NORM_FIELD]: null };
      sum += v * v;
    }
    return { ...r, [NORM_FIELD]: Math.sqrt(sum) };
  });
}

/** The row with only the given fields. */
function pick(row: DiagramRow, fields: readonly string[]): DiagramRow {
  const out: DiagramRow = {};
  for (const f of fields) if (f in row) out[f] = row[f]!;
  return out;
}

function pointTooltip(report: Report, states: readonly string[], norm: boolean) {
  // Six significant digits with trailing zeros dropped ("2", not "2.00000").
  const q = (field: string, title: string) => ({ field, title, type: 'quantitative' as const, format: '.6~g' });
  const t = (field: string, title: string) => ({ field, title, type: 'nominal' as const });
  return [
    t('type', 'special point'),
    t('branch', 'on'),
    q('parameter', withUnit(report.parameter, report.unit)),
    ...report.model.states.flatMap((s, i) => (states.includes(stateField(i)) ? [q(stateField(i), withUnit(s.name, s.unit))] : [])),
    ...(norm ? [q(NORM_FIELD, 'norm of the state')] : []),
    t('eigenvalues', 'eigenvalues'),
    t('coefficient', 'coefficient'),
    t('criticality', 'criticality'),
    t('meaning', 'meaning'),
  ];
}
