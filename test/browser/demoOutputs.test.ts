/**
 * The files a user actually gets: `branchtrace sweep` and `branchtrace portrait` on the bundled
 * reactor model through the CLI, opened from disk in headless Chromium with the network blocked.
 * Expected counts come from the analytic equilibrium curve of the model (see the comment below).
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DIAGRAM_MARKS } from '../../src/report/diagramSpec.js';
import { PORTRAIT_MARKS } from '../../src/portrait/portraitSpec.js';
import { runCli, tempDir } from '../cli/runCli.js';
import { hoverTooltip, launchBrowser, openPage, pageFolder, screenshot, lineMarks, pointMarks } from './browserPage.js';

const MODEL = 'models/cooled-tank-reactor.yaml';
const lines = lineMarks;
const points = pointMarks;

let browser: Browser;
let pages: string;

beforeAll(async () => {
  browser = await launchBrowser();
  pages = pageFolder('demo');
});

afterAll(async () => {
  await browser?.close();
});

describe('pages written by the CLI for the reactor model', () => {
  it('the sweep diagram shows one branch in three stability runs, two folds and a Hopf point, with tooltips', async () => {
    // Analytic for this model (Uppal, Ray & Poore 1974 form with B = 14, beta = 2): on the equilibrium
    // curve x1 = 3·x2/14 and Da = x1/((1 − x1)e^x2), which rises, falls, rises in x2: two folds; the
    // trace of the Jacobian changes sign once more on the upper part (det > 0): one Hopf point. Drawn
    // runs: stable (solid) up to the first fold, unstable (dashed: saddle, then two unstable) up to the
    // Hopf point, stable (solid) after it.
    const out = tempDir('demo-sweep');
    const r = runCli(['sweep', MODEL, '--vary', 'Da', '--from', '0.02', '--to', '0.2', '--out', out]);
    expect(r.status, r.stderr).toBe(0);
    const opened = await openPage(browser, pages, 'sweep.html', readFileSync(join(out, 'diagram.html'), 'utf8'));
    const p = opened.page;
    for (const panel of ['state0', 'state1']) {
      expect(await p.locator(lines(panel)).count()).toBe(3);
      expect(await p.locator(points(panel)).count()).toBe(3);
    }
    const tip = await hoverTooltip(p, points('state0'), 2);
    expect(tip).toMatch(/special point: (fold|Hopf)/);
    await screenshot(p, 'demo-sweep');
    expect(opened.errors).toEqual([]);
    expect(opened.network).toEqual([]);
    await opened.close();
  });

  it('the portrait at Da = 0.1 shows the three equilibria of the S-shaped curve and the saddle manifolds', async () => {
    // Analytic: 0.0889 < Da = 0.1 < 0.1057 lies between the two folds, so three equilibria: stable, saddle, unstable.
    const out = tempDir('demo-portrait');
    const r = runCli(['portrait', MODEL, '--at', 'Da=0.1', '--out', out]);
    expect(r.status, r.stderr).toBe(0);
    expect(r.stdout).toMatch(/^3 equilibria in the window/);
    const opened = await openPage(browser, pages, 'portrait.html', readFileSync(join(out, 'portrait.html'), 'utf8'));
    const p = opened.page;
    const equilibria = `g.${DIAGRAM_MARKS.svgClass(PORTRAIT_MARKS.equilibria)} > path`;
    expect(await p.locator(equilibria).count()).toBe(3);
    const tips = [];
    for (let i = 0; i < 3; i++) tips.push(await hoverTooltip(p, equilibria, i));
    expect(tips.filter((t) => t.includes('saddle'))).toHaveLength(1);
    await screenshot(p, 'demo-portrait');
    expect(opened.errors).toEqual([]);
    expect(opened.network).toEqual([]);
    await opened.close();
  });
});
