import { describe, expect, it } from 'vitest';
import { buildReport } from '../../src/report/buildReport.js';
import { CAUTION } from '../../src/report/caution.js';
import { DIAGRAM_MARKS, diagramSpec } from '../../src/report/diagramSpec.js';
import { diagramText } from '../../src/report/diagramText.js';
import { escapeHtml, scriptJson } from '../../src/report/pageHtml.js';
import { renderPage, vegaBrowserBuild } from '../../src/report/renderPage.js';
import { info, sCurveTrace, transcriticalTrace } from './fixtures.js';

const opts = { parameter: 'lambda', version: '0.1.0', warnMargin: 0.1, failMargin: 0 };
const HOSTILE = '<script>alert(1)</script> & "quotes"';

/** The page without the inlined vega build (the only place that may name an address: XML namespaces). */
function withoutVega(html: string): string {
  const code = vegaBrowserBuild();
  expect(html.includes(code)).toBe(true);
  return html.replace(code, '');
}

/** How many SVG groups with this class, and how many <path> elements inside them. */
function marks(svg: string, cls: string): { groups: number; paths: number } {
  const re = new RegExp(`<g class="mark-[a-z]+ role-mark ${cls}"[^>]*>(.*?)</g>`, 'g');
  const found = [...svg.matchAll(re)];
  return { groups: found.length, paths: found.reduce((n, m) => n + (m[1]!.match(/<path /g)?.length ?? 0), 0) };
}

describe('renderPage', () => {
  it('renders the S-curve to SVG in Node: one path per run of equal stability and one marker per fold', async () => {
    const report = buildReport(sCurveTrace(), info('S', 'lambda'), opts);
    const page = await renderPage(diagramSpec(report), { title: 'S', notes: [CAUTION] });
    for (const panel of ['state0', 'state1', 'eigenvalues']) {
      // Analytic (fixtures.ts): stable, unstable, stable between the two folds → 3 line paths; 2 folds → 2 markers.
      expect(marks(page.svg, DIAGRAM_MARKS.svgClass(DIAGRAM_MARKS.lines(panel)))).toEqual({ groups: 3, paths: 3 });
      expect(marks(page.svg, DIAGRAM_MARKS.svgClass(DIAGRAM_MARKS.points(panel))).paths).toBe(2);
    }
    expect(page.svg).toContain('Special point');
    expect(page.svg.startsWith('<svg')).toBe(true);
    expect(JSON.parse(page.vegaLite)).toEqual(JSON.parse(JSON.stringify(diagramSpec(report))));
  });

  it('writes model text into the page as text only, and the chart JSON with no "<" at all', async () => {
    const report = buildReport(transcriticalTrace(), info(HOSTILE, 'lambda'), opts);
    const page = await renderPage(diagramSpec(report), { title: HOSTILE, subtitle: HOSTILE, notes: [HOSTILE, CAUTION] });
    const html = withoutVega(page.html);
    expect(html).not.toContain('<script>alert');
    expect(html).toContain(`<h1>${escapeHtml(HOSTILE)}</h1>`);
    expect(escapeHtml(HOSTILE)).toBe('&#60;script&#62;alert(1)&#60;/script&#62; &#38; &#34;quotes&#34;');
    const json = /<script type="application\/json" id="bt-chart-spec">(.*?)<\/script>/s.exec(html)![1]!;
    expect(json).not.toContain('<');
    expect(JSON.parse(json).title.text).toContain('<script>alert(1)</script>');
    expect(scriptJson({ a: '</script><!--' })).toBe('{"a":"\\u003c/script>\\u003c!--"}');
    // The static SVG escapes it as well.
    expect(page.svg).not.toContain('<script>');
    expect((page.html.match(/<script/g) ?? []).length).toBe(3);
  });

  it('names no address outside the inlined vega build and forbids every network request', async () => {
    const report = buildReport(sCurveTrace(), info('S', 'lambda'), opts);
    const page = await renderPage(diagramSpec(report), { title: 'S', notes: [CAUTION] });
    const html = withoutVega(page.html);
    expect(html).not.toMatch(/https?:\/\//);
    expect(html).not.toMatch(/\b(src|href)=/);
    expect(html).toContain("default-src 'none'");
    expect(html).toContain("connect-src 'none'");
    // vega's own build names only XML namespaces, which are identifiers, never fetched.
    const addresses = new Set(vegaBrowserBuild().match(/https?:\/\/[^"'\s]*/g));
    expect([...addresses].sort()).toEqual(['http://www.w3.org/1999/xlink', 'http://www.w3.org/2000/svg', 'http://www.w3.org/2000/xmlns/']);
  });

  it('shows the caution in its own box even when the notes do not carry it', async () => {
    const report = buildReport(sCurveTrace(), info('S', 'lambda'), opts);
    const withNote = await renderPage(diagramSpec(report), { title: 'S', notes: [CAUTION, 'Another note.'] });
    const without = await renderPage(diagramSpec(report), { title: 'S', notes: [] });
    for (const page of [withNote, without]) {
      expect(page.html).toContain(`<p class="bt-caution"><strong>Caution.</strong> ${escapeHtml(CAUTION)}</p>`);
      expect(page.html.split(escapeHtml(CAUTION)).length).toBe(2);
    }
    expect(withNote.html).toContain('<li>Another note.</li>');
  });

  it('renders an interrupted trace with no branch at all, and says it is incomplete', async () => {
    const trace = sCurveTrace();
    trace.branches = [];
    trace.events = [];
    trace.interrupted = true;
    const spec = diagramSpec(buildReport(trace, info('Empty', 'lambda'), opts));
    const page = await renderPage(spec, { title: 'Empty', notes: [] });
    expect(marks(page.svg, DIAGRAM_MARKS.svgClass(DIAGRAM_MARKS.lines('state0'))).paths).toBe(0);
    expect(page.svg).toContain('Interrupted before the end: the branches shown are incomplete.');
    expect(page.svg).toContain('0 branches, 0 special points');
  });

  it('carries the caution inside the static SVG, so the picture alone keeps it', async () => {
    const report = buildReport(sCurveTrace(), info('S', 'lambda'), opts);
    const page = await renderPage(diagramSpec(report), diagramText(report));
    // Visible text only: tags (and the attributes inside them) removed, line breaks joined.
    const svgText = page.svg.replace(/<[^>]+>/g, ' ').replace(/\s+/g, ' ');
    expect(svgText).toContain(`Caution: ${CAUTION}`);
  });

  it('puts the caution first among the page notes, then the margin and the warnings', () => {
    const report = buildReport(transcriticalTrace(), info('Crossing', 'lambda', 'mol/L'), opts);
    const text = diagramText(report);
    expect(text.title).toBe('Crossing');
    expect(text.subtitle).toBe('Steady states as lambda (mol/L) varies from −1 to 1. A hand-built trace with analytic branches.');
    expect(text.notes[0]).toBe(CAUTION);
    expect(text.notes[1]).toMatch(/^The nominal value is lambda = 0\.1\./);
    expect(text.notes.at(-1)).toBe('Warning: step at its smallest near λ = 0');
  });
});
