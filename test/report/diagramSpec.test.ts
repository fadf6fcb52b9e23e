import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { describe, expect, it } from 'vitest';
import { UsageError, message } from '../../src/errors.js';
import { buildReport } from '../../src/report/buildReport.js';
import { DIAGRAM_MARKS, diagramSpec } from '../../src/report/diagramSpec.js';
import { compileChart } from '../../src/report/renderPage.js';
import { expectClose } from '../helpers/close.js';
import { schemaErrors } from './diagramSchemaCheck.js';
import { FOLD_LAMBDA, FOLD_X, hopfTrace, info, sCurveTrace, transcriticalTrace } from './fixtures.js';

/** The parts of the spec these tests read. */
interface Row {
  [field: string]: string | number | null;
}
interface LayerView {
  name?: string;
  mark: { type: string };
  data: { name?: string; values?: Row[] };
  encoding: Record<string, { field?: string; title?: string; scale?: { domain?: unknown[]; range?: unknown[] } } | undefined> & {
    tooltip?: { field: string; title: string }[];
  };
}
interface SpecView {
  title: { text: string; subtitle: string[] };
  datasets: { branches: Row[]; special: Row[] };
  vconcat: { layer: LayerView[] }[];
  params: { name: string; bind: string; select: { type: string; encodings: string[] }; views: string[] }[];
  resolve: { scale: Record<string, string> };
}

/** The Vega-Lite JSON schema shipped with the installed vega-lite (a reference from outside the project). */
const VEGA_LITE_SCHEMA = JSON.parse(
  readFileSync(createRequire(import.meta.url).resolve('vega-lite/vega-lite-schema.json'), 'utf8'),
) as Record<string, unknown>;

const opts = { parameter: 'lambda', version: '0.1.0', warnMargin: 0.1, failMargin: 0 };
const sCurve = () => buildReport(sCurveTrace(), info('S-shaped test model', 'lambda', 'mol/L'), opts);
const view = (spec: unknown): SpecView => spec as SpecView;
const runsOf = (rows: Row[]): Map<string, Row[]> => {
  const runs = new Map<string, Row[]>();
  for (const r of rows) runs.set(String(r.run), [...(runs.get(String(r.run)) ?? []), r]);
  return runs;
};

describe('diagramSpec', () => {
  it('has one row per branch point plus one joint per change of stability, in runs that share their end points', () => {
    const s = view(diagramSpec(sCurve()));
    // Analytic: the eigenvalue 1 − 3x² changes sign at x = ∓1/√3 ≈ ∓0.577, i.e. between points 10/11
    // (x = −0.6, −0.5) and 21/22 (x = 0.5, 0.6): 33 points, 2 changes of stability → 35 rows in 3 runs.
    expect(s.datasets.branches).toHaveLength(35);
    const runs = [...runsOf(s.datasets.branches).values()];
    expect(runs.map((r) => r[0]!.stability)).toEqual(['stable', 'unstable', 'stable']);
    expect(runs.map((r) => r.length)).toEqual([12, 12, 11]);
    for (let k = 1; k < runs.length; k++) {
      const end = runs[k - 1]!.at(-1)!, start = runs[k]![0]!;
      expect(end.index).toBe(start.index);
      expect(end.parameter).toBe(start.parameter);
      expect(end.v0).toBe(start.v0);
    }
    // Arclength order, not parameter order: λ = x³ − x rises to the first fold, then falls.
    // The stable run ends at point 11, the first point past the fold, so its rise stops before the joint.
    const first = runs[0]!.slice(0, -1).map((r) => r.parameter as number);
    const middle = runs[1]!.map((r) => r.parameter as number);
    expect(first.every((p, k) => k === 0 || p > first[k - 1]!)).toBe(true);
    expect(middle.every((p, k) => k === 0 || p < middle[k - 1]!)).toBe(true);
    expect(runs.flat().map((r) => r.index)).toEqual([...Array(12).keys(), ...Array.from({ length: 23 }, (_, k) => 11 + k - (k > 11 ? 1 : 0))]);
  });

  it('draws every branch line in point order, grouped by run, dashed by stability and coloured by branch', () => {
    const s = view(diagramSpec(buildReport(transcriticalTrace(), info('T', 'lambda'), opts)));
    for (const panel of s.vconcat) {
      const line = panel.layer.find((l) => l.mark.type === 'line')!;
      expect(line.encoding.order?.field).toBe('index');
      expect(line.encoding.detail?.field).toBe('run');
      expect(line.encoding.stroke?.field).toBe('branch');
      expect(line.encoding.strokeDash?.field).toBe('stability');
      expect(line.encoding.strokeDash?.scale?.domain).toEqual(['stable', 'unstable']);
      expect(line.data.name).toBe('branches');
    }
    // Analytic: x = 0 is stable for λ < 0, x = λ for λ > 0; each has one change of stability, so two
    // runs per branch. Every run is straight in (λ, x) and in the eigenvalue (±λ), so thinning keeps
    // only its two end points: 4 runs × 2 rows.
    expect(s.datasets.branches).toHaveLength(8);
    expect([...runsOf(s.datasets.branches).keys()]).toEqual(['0-0', '0-1', '1-0', '1-1']);
    const stroke = s.vconcat[0]!.layer.find((l) => l.mark.type === 'line')!.encoding.stroke!;
    expect(stroke.scale?.domain).toEqual(['branch 0', 'branch 1']);
    expect(new Set(stroke.scale?.range).size).toBe(2);
  });

  it('has a panel per state and an eigenvalue panel, with the mark types and names the page relies on', () => {
    const s = view(diagramSpec(sCurve()));
    expect(s.vconcat).toHaveLength(3);
    const marks = s.vconcat.map((p) => p.layer.map((l) => `${l.mark.type}:${l.name}`));
    expect(marks).toEqual([
      ['rule:bt_state0_nominal', 'text:bt_nominal_label', 'line:bt_state0_lines', 'point:bt_state0_points'],
      ['rule:bt_state1_nominal', 'line:bt_state1_lines', 'point:bt_state1_points'],
      ['rule:bt_eigenvalue_zero', 'rule:bt_eigenvalues_nominal', 'line:bt_eigenvalues_lines', 'point:bt_eigenvalues_points'],
    ]);
    const y = s.vconcat.map((p) => p.layer.find((l) => l.mark.type === 'line')!.encoding.y!);
    expect(y.map((e) => e.field)).toEqual(['v0', 'v1', 'maxRealPart']);
    // Titles with units from the model: x has unit K, y has none; the parameter has mol/L.
    expect(y.map((e) => e.title)).toEqual(['x (K)', 'y', 'largest real part of the eigenvalues']);
    expect(s.vconcat[0]!.layer[2]!.encoding.x!.title).toBe('lambda (mol/L)');
    expect(s.title.text).toBe('S-shaped test model: steady states as lambda varies');
    expect(s.title.subtitle[0]).toMatch(/lambda from −2\.5 to 2\.5 mol\/L; 1 branch, 2 special points/);
  });

  it('marks the folds at their analytic place with full-word types, tooltips and the fold coefficient', () => {
    const s = view(diagramSpec(sCurve()));
    expect(s.datasets.special).toHaveLength(2);
    const [a, b] = s.datasets.special;
    expect([a!.type, b!.type]).toEqual(['fold', 'fold']);
    // Analytic: folds at x = ∓1/√3, λ = ±2/(3√3); fold coefficient a = −3x = ±√3 (see fixtures.ts).
    expectClose(a!.parameter as number, FOLD_LAMBDA, { abs: 1e-12 }, 'first fold λ');
    expectClose(a!.v0 as number, -FOLD_X, { abs: 1e-12 }, 'first fold x');
    expectClose(b!.parameter as number, -FOLD_LAMBDA, { abs: 1e-12 }, 'second fold λ');
    expect(a!.coefficient).toBe('fold coefficient a = 1.732');
    expect(a!.eigenvalues).toBe('0, −1');
    expect(a!.criticality).toBe('not applicable');
    const points = s.vconcat[0]!.layer.find((l) => l.mark.type === 'point')!;
    expect(points.data.name).toBe('special');
    expect(points.encoding.tooltip!.map((t) => t.field)).toEqual(
      ['type', 'branch', 'parameter', 'v0', 'v1', 'eigenvalues', 'coefficient', 'criticality', 'meaning']);
    expect(points.encoding.shape?.scale?.domain).toEqual(['fold']);
    expect(points.encoding.fill?.scale?.domain).toEqual(['fold']);
  });

  it('tells Hopf points apart by criticality in words and by marker shape', () => {
    const mu = { ...opts, parameter: 'mu' };
    const shapes = [-1, 1, 0].map((s) => {
      const spec = view(diagramSpec(buildReport(hopfTrace(s), info('H', 'mu'), mu)));
      const row = spec.datasets.special[0]!;
      const points = spec.vconcat[0]!.layer.find((l) => l.mark.type === 'point')!;
      expect(points.encoding.shape?.scale?.domain).toEqual([row.type]);
      return { type: row.type, criticality: row.criticality, shape: points.encoding.shape?.scale?.range?.[0] };
    });
    // Analytic: l1 = s for this normal form, so s = −1 is supercritical, s = 1 subcritical, s = 0 undecided.
    expect(shapes.map((x) => x.type)).toEqual(['Hopf (supercritical)', 'Hopf (subcritical)', 'Hopf (criticality undecided)']);
    expect(shapes.map((x) => x.criticality)).toEqual(['supercritical', 'subcritical', 'criticality undecided']);
    expect(new Set(shapes.map((x) => x.shape)).size).toBe(3);
  });

  it('gives a constant state a readable y range around its value, and fits the others to the data', () => {
    const spec = view(diagramSpec(buildReport(hopfTrace(-1), info('H', 'mu'), { ...opts, parameter: 'mu' })));
    const y = spec.vconcat.map((p) => p.layer.find((l) => l.mark.type === 'line')!.encoding.y!.scale?.domain);
    // Analytic: the equilibrium is (0, 0) for every μ, so both state panels are flat at 0 (0 ± 1/2);
    // the largest real part μ varies, so that panel keeps the fitted domain.
    expect(y).toEqual([[-0.5, 0.5], [-0.5, 0.5], undefined]);
  });

  it('draws the nominal value as a rule labelled with its margin, only inside the traced range', () => {
    const s = view(diagramSpec(sCurve()));
    const rule = s.vconcat[0]!.layer.find((l) => l.name === 'bt_state0_nominal')!;
    expect(rule.data.values).toEqual([{ parameter: 0.1, label: expect.stringMatching(/^nominal lambda = 0\.1, margin /) }]);
    const outside = sCurve();
    outside.margin = { ...outside.margin!, nominal: 7 };
    const o = view(diagramSpec(outside));
    expect(o.vconcat.flatMap((p) => p.layer).filter((l) => l.mark.type === 'rule').map((l) => l.name)).toEqual(['bt_eigenvalue_zero']);
  });

  it('draws a sweep over decades on a logarithmic parameter axis, with the nominal label kept inside the panel', () => {
    const linear = view(diagramSpec(sCurve())).vconcat[0]!.layer.find((l) => l.name === 'bt_state0_lines')!;
    expect(linear.encoding.x?.scale).toEqual({ zero: false, nice: false });
    const report = buildReport(sCurveTrace(), info('S-shaped test model', 'lambda', 'mol/L'), { ...opts, parameterScale: 'log' as const });
    const spec = diagramSpec({ ...report, range: { from: 1e-3, to: 1 }, margin: { ...report.margin!, nominal: 0.5 } });
    const layers = view(spec).vconcat[0]!.layer;
    expect(layers.find((l) => l.name === 'bt_state0_lines')!.encoding.x?.scale).toEqual({ type: 'log', nice: false });
    // 0.5 lies at 0.9 of the log axis from 1e-3 to 1: the label reads to the left of its rule.
    expect(layers.find((l) => l.name === 'bt_nominal_label')!.mark).toMatchObject({ align: 'right', dx: -4 });
    expect(schemaErrors(VEGA_LITE_SCHEMA, spec)).toEqual([]);
  });

  it('plots only the chosen states, or the Euclidean norm of the state', () => {
    const only = view(diagramSpec(sCurve(), { plot: ['y'] }));
    expect(only.vconcat.map((p) => p.layer.find((l) => l.mark.type === 'line')!.name)).toEqual(['bt_state1_lines', 'bt_eigenvalues_lines']);
    const report = sCurve();
    const norm = view(diagramSpec(report, { plot: 'norm' }));
    expect(norm.vconcat.map((p) => p.layer.find((l) => l.mark.type === 'line')!.encoding.y!.field)).toEqual(['norm', 'maxRealPart']);
    // Analytic: on the S-curve y = x, so ‖(x, y)‖ = √2·|x|. Line rows carry only what the lines draw.
    for (const r of norm.datasets.branches) {
      expect(r.v0).toBeUndefined();
      const x = report.branches[0]!.points[r.index as number]!.state['x']!;
      expectClose(r.norm as number, Math.SQRT2 * Math.abs(x), { rel: 1e-15 }, 'norm');
    }
    expectClose(norm.datasets.special[0]!.norm as number, Math.SQRT2 * FOLD_X, { rel: 1e-15 }, 'norm at the fold');
    expect(() => diagramSpec(sCurve(), { plot: ['z'] })).toThrow(new UsageError(message.unknownState('z', ['x', 'y'])));
  });

  it('zooms and pans the shared parameter axis of every panel', () => {
    const s = view(diagramSpec(sCurve()));
    expect(s.params).toEqual([{
      name: 'bt_zoom', select: { type: 'interval', encodings: ['x'] }, bind: 'scales',
      views: ['bt_state0_lines', 'bt_state1_lines', 'bt_eigenvalues_lines'],
    }]);
    expect(s.resolve.scale.x).toBe('shared');
    expect(s.resolve.scale.y).toBe('independent');
    expect(DIAGRAM_MARKS.svgClass(DIAGRAM_MARKS.lines('state0'))).toBe('bt_state0_lines_marks');
  });

  it('compiles to Vega without a single Vega-Lite warning for every fixture and plot choice', async () => {
    const mu = { ...opts, parameter: 'mu' };
    const specs = [
      diagramSpec(sCurve()), diagramSpec(sCurve(), { plot: 'norm' }), diagramSpec(sCurve(), { plot: ['y', 'x'] }),
      diagramSpec(buildReport(hopfTrace(-1), info('H', 'mu'), mu)),
      diagramSpec(buildReport(transcriticalTrace(), info('T', 'lambda'), opts)),
      diagramSpec(buildReport(hopfTrace(-1), info('H', 'mu'), { ...mu, parameterScale: 'log' })),
    ];
    for (const spec of specs) {
      const { vega, warnings } = await compileChart(spec);
      expect(warnings).toEqual([]);
      const names = JSON.stringify(vega).match(/"name":"bt_[a-z0-9]+_lines_marks"/g) ?? [];
      expect(names.length).toBe((spec as unknown as SpecView).vconcat.length);
    }
  });

  it('validates against the Vega-Lite JSON schema shipped with vega-lite, which rejects a broken chart', () => {
    const mu = { ...opts, parameter: 'mu' };
    const specs = [
      diagramSpec(sCurve()), diagramSpec(sCurve(), { plot: 'norm' }),
      diagramSpec(buildReport(hopfTrace(1), info('H', 'mu'), mu)),
      diagramSpec(buildReport(transcriticalTrace(), info('T', 'lambda'), opts)),
    ];
    for (const spec of specs) expect(schemaErrors(VEGA_LITE_SCHEMA, spec)).toEqual([]);
    const broken = JSON.parse(JSON.stringify(specs[0])) as SpecView & { colour?: string };
    broken.colour = 'red';
    expect(schemaErrors(VEGA_LITE_SCHEMA, broken)).toHaveLength(1);
    // Checked against the vertical-concatenation definition alone, the error names the stray property.
    const vconcatOnly = { ...VEGA_LITE_SCHEMA, $ref: '#/definitions/TopLevelVConcatSpec' };
    expect(schemaErrors(vconcatOnly, specs[0])).toEqual([]);
    expect(schemaErrors(vconcatOnly, broken)).toEqual(['$.colour: not allowed']);
    const badMark = JSON.parse(JSON.stringify(specs[0])) as SpecView;
    badMark.vconcat[0]!.layer[2]!.mark.type = 'lien';
    expect(schemaErrors(vconcatOnly, badMark)).toEqual([expect.stringMatching(/^\$\.vconcat\[0\]: matches no alternative/)]);
  });
});
