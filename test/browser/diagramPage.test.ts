import { rmSync } from 'node:fs';
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildReport } from '../../src/report/buildReport.js';
import { CAUTION } from '../../src/report/caution.js';
import { diagramSpec } from '../../src/report/diagramSpec.js';
import { renderPage } from '../../src/report/renderPage.js';
import { FOLD_LAMBDA, hopfTrace, info, sCurveTrace, transcriticalTrace } from '../report/fixtures.js';
import { hoverTooltip, launchBrowser, openPage, pageFolder, screenshot, lineMarks, pointMarks } from './browserPage.js';

const opts = { parameter: 'lambda', version: '0.1.0', warnMargin: 0.1, failMargin: 0 };
const HOSTILE = '<script>alert(1)</script><img src=x onerror="alert(2)">';

const lines = lineMarks;
const points = pointMarks;

let browser: Browser;
let dir: string;

beforeAll(async () => {
  browser = await launchBrowser();
  dir = pageFolder('diagram');
});

afterAll(async () => {
  await browser?.close();
  if (dir !== undefined) rmSync(dir, { recursive: true, force: true });
});

describe('the diagram page in a browser (file://, network blocked)', () => {
  it('draws the S-curve: three runs per panel, two fold markers, a tooltip in words and a working zoom', async () => {
    const report = buildReport(sCurveTrace(), info('S-shaped test model', 'lambda', 'mol/L'), opts);
    const page = await renderPage(diagramSpec(report), { title: 'S-shaped test model', notes: [CAUTION] });
    const opened = await openPage(browser, dir, 's-curve.html', page.html);
    const p = opened.page;
    // Analytic (test/report/fixtures.ts): stable, unstable, stable between the folds at λ = ±2/(3√3).
    for (const panel of ['state0', 'state1', 'eigenvalues']) {
      expect(await p.locator(lines(panel)).count()).toBe(3);
      expect(await p.locator(points(panel)).count()).toBe(2);
    }
    const dashes = await p.locator(lines('state0')).evaluateAll((els) => els.map((e) => e.getAttribute('stroke-dasharray') ?? 'none'));
    expect(dashes.filter((d) => d !== 'none' && d !== '1,0').length).toBe(1);

    const tip = await hoverTooltip(p, points('state0'), 0);
    expect(tip).toContain('special point: fold');
    expect(tip).toContain('fold coefficient a = ');
    expect(tip).toContain(`lambda (mol/L): ${Number(FOLD_LAMBDA.toPrecision(6))}`);

    // Zoom: a wheel turn over the top panel changes the parameter axis of every panel.
    const labels = () => p.locator('.role-axis-label text').allTextContents();
    const before = await labels();
    const plot = (await p.locator('g.concat_0_group').boundingBox())!;
    await p.mouse.move(plot.x + plot.width / 2, plot.y + plot.height / 2);
    await p.mouse.wheel(0, -400);
    await p.waitForTimeout(200);
    expect(await labels()).not.toEqual(before);

    await screenshot(p, 'diagram-s-curve');
    expect(opened.errors).toEqual([]);
    expect(opened.network).toEqual([]);
    expect(opened.dialogs).toEqual([]);
    await opened.close();
  });

  it('draws two crossing branches and a Hopf point with their own colours and markers', async () => {
    const both = buildReport(transcriticalTrace(), info('Transcritical', 'lambda'), opts);
    const hopf = buildReport(hopfTrace(-1), info('Hopf', 'mu'), { ...opts, parameter: 'mu' });
    const tPage = await openPage(browser, dir, 'transcritical.html',
      (await renderPage(diagramSpec(both), { title: 'Transcritical', notes: [CAUTION] })).html);
    // Analytic: each branch changes stability once at λ = 0 → 2 runs per branch, 4 paths; 1 transcritical point.
    expect(await tPage.page.locator(lines('state0')).count()).toBe(4);
    const colours = await tPage.page.locator(lines('state0')).evaluateAll((els) => els.map((e) => e.getAttribute('stroke')));
    expect(new Set(colours).size).toBe(2);
    expect(await hoverTooltip(tPage.page, points('state0'), 0)).toContain('special point: transcritical');
    await screenshot(tPage.page, 'diagram-transcritical');
    expect(tPage.errors).toEqual([]);
    await tPage.close();

    const hPage = await openPage(browser, dir, 'hopf.html', (await renderPage(diagramSpec(hopf), { title: 'Hopf', notes: [] })).html);
    // Analytic: l1 = s = −1 < 0 for this normal form → supercritical.
    const tip = await hoverTooltip(hPage.page, points('eigenvalues'), 0);
    expect(tip).toContain('special point: Hopf (supercritical)');
    expect(tip).toContain('criticality: supercritical');
    expect(await hPage.page.locator('.role-legend-label text').allTextContents()).toContain('Hopf (supercritical)');
    await screenshot(hPage.page, 'diagram-hopf');
    expect(hPage.errors).toEqual([]);
    expect(hPage.network).toEqual([]);
    await hPage.close();
  });

  it('shows a hostile model title as text: nothing runs, no dialog, no request', async () => {
    const report = buildReport(sCurveTrace(), info(HOSTILE, 'lambda'), opts);
    report.model.states[0]!.unit = HOSTILE; // reaches the axis title and the tooltip keys
    const page = await renderPage(diagramSpec(report), { title: HOSTILE, subtitle: HOSTILE, notes: [HOSTILE, CAUTION] });
    const opened = await openPage(browser, dir, 'hostile.html', page.html);
    const p = opened.page;
    expect(await p.locator('h1').textContent()).toBe(HOSTILE);
    expect(await p.locator('.bt-subtitle').textContent()).toBe(HOSTILE);
    expect(await p.locator('.bt-notes li').first().textContent()).toBe(HOSTILE);
    expect(await p.locator('.role-title-text text').first().textContent()).toContain('<script>alert(1)</script>');
    expect(await hoverTooltip(p, points('state0'), 1)).toContain(`x (${HOSTILE}): `);
    expect(await p.locator('img').count()).toBe(0);
    expect(await p.locator('script').count()).toBe(3);
    expect(await p.locator('.bt-caution').textContent()).toContain(CAUTION);
    await screenshot(p, 'diagram-hostile-title');
    expect(opened.dialogs).toEqual([]);
    expect(opened.errors).toEqual([]);
    expect(opened.network).toEqual([]);
    await opened.close();
  });
});
