import { describe, expect, it } from 'vitest';
import { buildReport } from '../../src/report/buildReport.js';
import { CAUTION } from '../../src/report/caution.js';
import { formatEigenvalues, formatNumber } from '../../src/report/formatNumber.js';
import { csvField, renderCsv } from '../../src/report/renderCsv.js';
import { renderJson } from '../../src/report/renderJson.js';
import { md, renderMarkdown } from '../../src/report/renderMarkdown.js';
import type { Report } from '../../src/types.js';
import { hopfTrace, info, sCurveTrace, transcriticalTrace } from './fixtures.js';

const opts = { parameter: 'lambda', version: '0.1.0', warnMargin: 0.1, failMargin: 0 };
const sReport = (): Report => buildReport(sCurveTrace(), info('Cubic switch', 'lambda', 'mol/L'), opts);

/** RFC 4180 reader written independently of renderCsv: quoted fields, doubled quotes, CRLF rows. */
function parseCsv(text: string): string[][] {
  const rows: string[][] = [];
  let row: string[] = [];
  let field = '';
  let quoted = false;
  for (let i = 0; i < text.length; i++) {
    const c = text[i]!;
    if (quoted) {
      if (c === '"' && text[i + 1] === '"') { field += '"'; i++; } else if (c === '"') quoted = false; else field += c;
    } else if (c === '"') quoted = true;
    else if (c === ',') { row.push(field); field = ''; } else if (c === '\r' && text[i + 1] === '\n') {
      row.push(field); rows.push(row); row = []; field = ''; i++;
    } else field += c;
  }
  return rows;
}

describe('renderMarkdown', () => {
  it('puts the caution near the top and at the end', () => {
    const text = renderMarkdown(sReport());
    const first = text.indexOf(md(CAUTION));
    expect(first).toBeGreaterThan(0);
    expect(first).toBeLessThan(400);
    expect(text.lastIndexOf(md(CAUTION))).toBeGreaterThan(text.length - md(CAUTION).length - 5);
  });

  it('lists each fold as a table row with its parameter, state, eigenvalues and coefficient', () => {
    const text = renderMarkdown(sReport());
    // Analytic: first fold at λ = 2/(3√3) = 0.3849, x = y = −1/√3 = −0.5774, eigenvalues 0 and −1, a = √3.
    expect(text).toContain('| 0 | fold | 0 | 0.3849 | \u22120.5774 | \u22120.5774 | 0, \u22121 | fold coefficient a = 1.732 |');
    expect(text).toContain('| 1 | fold | 0 | \u22120.3849 | 0.5774 | 0.5774 | 0, \u22121 | fold coefficient a = \u22121.732 |');
    expect(text).toContain('| point | type | branch | lambda (mol/L) | x (K) | y |');
  });

  it('gives each branch its stability runs and the reason it stopped', () => {
    const text = renderMarkdown(sReport());
    expect(text).toContain('## Branch 0');
    expect(text).toContain('It stopped because it left the parameter range.');
    expect(text).toContain('| unstable | 0.3849 | \u22120.3849 | 1 |');
  });

  it('writes the Hopf coefficient with its criticality, frequency and period', () => {
    const report = buildReport(hopfTrace(-0.5), info('Oscillator', 'mu'), { ...opts, parameter: 'mu' });
    const text = renderMarkdown(report);
    // Analytic: eigenvalues ±i at μ = 0, l1 = s = −0.5, ω = 1, period 2π = 6.283.
    expect(text).toContain('Hopf (supercritical)');
    expect(text).toContain('0 \u00b1 1i');
    expect(text).toContain('first Lyapunov coefficient l1 = \u22120.5 (supercritical), frequency 1, period 6.283');
    expect(text).toContain('oscillations start with small amplitude');
  });

  it('states the design margin with a warning when the nominal value is close to a fold', () => {
    const report = buildReport(sCurveTrace(), info('S', 'lambda'), { ...opts, nominal: 0.36 });
    const text = renderMarkdown(report);
    // Hand-computed: (0.3849 − 0.36)/0.36 = 6.92%.
    expect(text).toContain('Above: fold (special point 0) at lambda = 0.3849, 0.0249 away (6.92% of the nominal value).');
    expect(text).toContain('WARNING: the nearest special point is closer than the warning margin of 10%.');
  });

  it('lists warnings and neutralises markup in text from the model', () => {
    const report = buildReport(transcriticalTrace(), info('<b>|x|</b> *bold*', 'lambda'), opts);
    const text = renderMarkdown(report);
    expect(text).toContain('- step at its smallest near λ = 0');
    expect(text).toContain('&lt;b&gt;\\|x\\|&lt;/b&gt; \\*bold\\*');
    expect(text).not.toContain('<b>');
  });
});

describe('formatNumber and formatEigenvalues', () => {
  it('write complex pairs once with a plus-minus sign and true minus signs', () => {
    expect(formatEigenvalues([{ re: -0.12, im: 1.3 }, { re: -0.12, im: -1.3 }, { re: -2, im: 0 }]))
      .toBe('\u22120.12 \u00b1 1.3i, \u22122');
    expect(formatNumber(1.5e-7)).toBe('1.5e\u22127');
    expect(formatNumber(Number.NaN)).toBe('not a number');
  });
});

describe('renderCsv', () => {
  it('has one row per branch point and the columns branch, index, parameter, states, stable, maxRealPart', () => {
    const report = buildReport(transcriticalTrace(), info('T', 'lambda'), opts);
    const rows = parseCsv(renderCsv(report));
    expect(rows[0]).toEqual(['branch', 'index', 'lambda', 'x', 'y', 'stable', 'maxRealPart']);
    const total = report.branches.reduce((n, b) => n + b.points.length, 0);
    expect(rows).toHaveLength(total + 1);
    expect(rows.every((r) => r.length === 7)).toBe(true);
    // Branch 1 point 8 is x = λ = 1 with eigenvalues −1, −1 (analytic): stable, maxRealPart −1.
    expect(rows[rows.length - 1]).toEqual(['1', '8', '1', '1', '0', 'true', '-1']);
  });

  it('keeps full precision so values parse back exactly', () => {
    const report = sReport();
    const rows = parseCsv(renderCsv(report));
    const p = report.branches[0]!.points[7]!;
    expect(Number(rows[8]![2])).toBe(p.parameter);
    expect(Number(rows[8]![3])).toBe(p.state.x);
  });

  it('quotes fields holding commas, quotes or line breaks (RFC 4180 §2)', () => {
    expect(csvField('a,"b"')).toBe('"a,""b"""');
    expect(csvField('two\nlines')).toBe('"two\nlines"');
    expect(csvField('plain')).toBe('plain');
  });
});

describe('renderJson', () => {
  it('round-trips the report and turns values that are not finite into null', () => {
    const report = sReport();
    report.branches[0]!.points[0]!.maxRealPart = Number.POSITIVE_INFINITY;
    const back = JSON.parse(renderJson(report)) as Report;
    expect(back.branches[0]!.points[0]!.maxRealPart).toBeNull();
    // ECMAScript JSON.stringify also writes non-finite numbers as null: an independent reference.
    expect(back).toEqual(JSON.parse(JSON.stringify(report)));
    expect(back.events[0]!.foldCoefficient).toBe(report.events[0]!.foldCoefficient); // bit-exact round trip
  });

  it('lays the file out exactly as JSON.stringify with a two-space indent does', () => {
    // ECMAScript JSON.stringify(value, null, 2) is the reference layout (a guard for the direct writer).
    const report = sReport();
    report.model.title = 'quote " backslash \\ line\nbreak \u2028 <tag> ünïcödé';
    report.branches[0]!.points[0]!.parameter = -0;
    report.warnings = [];
    const text = renderJson(report);
    expect(text).toBe(`${JSON.stringify(JSON.parse(text), null, 2)}\n`);
    expect(JSON.parse(text).model.title).toBe(report.model.title);
    expect(renderJson({ ...report, branches: [] } as Report)).toContain('"branches": []');
  });

  it('orders keys the same way whatever order the report was built in', () => {
    const report = sReport();
    const shuffled = Object.fromEntries(Object.entries(report).reverse()) as unknown as Report;
    expect(renderJson(shuffled)).toBe(renderJson(report));
    expect(Object.keys(JSON.parse(renderJson(report)) as object).slice(0, 3)).toEqual(['tool', 'version', 'model']);
    expect(Object.keys((JSON.parse(renderJson(report)) as Report).branches[0]!.points[0]!))
      .toEqual(['index', 'parameter', 'state', 'stable', 'maxRealPart', 'residual', 'iterations', 'step']);
    expect(Object.keys((JSON.parse(renderJson(report)) as Report).events[0]!).slice(0, 11)).toEqual([
      'id', 'type', 'parameter', 'state', 'branch', 'eigenvalues', 'meaning', 'residual', 'iterations', 'test', 'foldCoefficient',
    ]);
    expect(Object.keys((JSON.parse(renderJson(report)) as Report).events[0]!.test)).toEqual(['quantity', 'before', 'after']);
  });
});
