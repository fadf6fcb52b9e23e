import { readFileSync, rmSync } from 'node:fs';
import { createRequire } from 'node:module';
import { join } from 'node:path';
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { compileModel } from '../../src/compile/compileModel.js';
import { findEquilibria } from '../../src/equilibria/findEquilibria.js';
import { readModelFile } from '../../src/model/loadModel.js';
import { buildPortrait } from '../../src/portrait/buildPortrait.js';
import { PORTRAIT_MARKS, portraitSpec } from '../../src/portrait/portraitSpec.js';
import { CAUTION } from '../../src/report/caution.js';
import { compileChart, renderPage } from '../../src/report/renderPage.js';
import { expectClose } from '../helpers/close.js';
import { schemaErrors } from '../report/diagramSchemaCheck.js';
import { hoverTooltip, launchBrowser, openPage, pageFolder, screenshot } from './browserPage.js';

const marks = (name: string) => `g.${name}_marks > path`;

let browser: Browser;
let dir: string;

beforeAll(async () => {
  browser = await launchBrowser();
  dir = pageFolder('portrait');
});

afterAll(async () => {
  await browser?.close();
  if (dir !== undefined) rmSync(dir, { recursive: true, force: true });
});

describe('the phase-portrait page in a browser (file://, network blocked)', () => {
  it('draws the bistable toggle switch: three equilibria, the saddle at (2, 2), nullclines and a tooltip', async () => {
    // models/genetic-toggle-switch.yaml: u' = α1/(1 + v²) − u, v' = α2/(1 + u²) − v with α1 = α2 = 10.
    const model = readModelFile(join(process.cwd(), 'models', 'genetic-toggle-switch.yaml'));
    const system = compileModel(model);
    const p = Float64Array.from(model.parameters.map((q) => q.value));
    const box = { lo: Float64Array.from([-1, -1]), hi: Float64Array.from([12, 12]) };
    const { equilibria } = findEquilibria(system, p, { box });
    // Analytic: u(1 + v²) = 10 and v(1 + u²) = 10 subtract to (u − v)(1 − uv) = 0. On u = v:
    // u³ + u − 10 = 0, so u = v = 2. Off it: uv = 1, so u + v = u(1 + v²) = 10, u, v = 5 ± 2√6.
    const expected = [[2, 2], [5 + 2 * Math.sqrt(6), 5 - 2 * Math.sqrt(6)], [5 - 2 * Math.sqrt(6), 5 + 2 * Math.sqrt(6)]];
    expect(equilibria).toHaveLength(3);
    for (const [u, v] of expected) {
      const e = equilibria.find((q) => Math.hypot(q.state[0]! - u!, q.state[1]! - v!) < 1e-6);
      // A missing equilibrium gives NaN and fails the comparison.
      expectClose(e?.state[0] ?? NaN, u!, { abs: 1e-9 }, `u of the equilibrium near (${u}, ${v})`);
    }

    const window = { x: [-0.5, 11] as [number, number], y: [-0.5, 11] as [number, number] };
    const data = buildPortrait(system, p, { ix: 0, iy: 1, window, held: p.slice(0, 2), equilibria });
    const spec = portraitSpec(data);
    expect((await compileChart(spec)).warnings).toEqual([]);
    const schema = JSON.parse(readFileSync(createRequire(import.meta.url).resolve('vega-lite/vega-lite-schema.json'), 'utf8'));
    expect(schemaErrors(schema, spec)).toEqual([]);
    const page = await renderPage(spec, { title: 'Phase portrait of the toggle switch', notes: [CAUTION] });
    const opened = await openPage(browser, dir, 'toggle-switch.html', page.html);
    const pg = opened.page;

    expect(await pg.locator(marks(PORTRAIT_MARKS.equilibria)).count()).toBe(3);
    expect(await pg.locator(marks(PORTRAIT_MARKS.nullclines)).count()).toBeGreaterThanOrEqual(2);
    expect(await pg.locator(marks(PORTRAIT_MARKS.manifolds)).count()).toBeGreaterThanOrEqual(2);
    expect(await pg.locator(marks(PORTRAIT_MARKS.arrows)).count()).toBe(0); // rules are <line>, not <path>
    expect(await pg.locator(`g.${PORTRAIT_MARKS.arrows}_marks > line`).count()).toBe(data.arrows.length);

    const tips: string[] = [];
    for (let k = 0; k < 3; k++) tips.push(await hoverTooltip(pg, marks(PORTRAIT_MARKS.equilibria), k));
    const saddle = tips.filter((t) => t.includes('type: saddle'));
    expect(saddle).toHaveLength(1);
    expect(saddle[0]).toContain('u: 2.00000');
    expect(saddle[0]).toContain('v: 2.00000');
    // Analytic: J = [[−1, −2α1·v/(1 + v²)²], [−2α2·u/(1 + u²)², −1]] = [[−1, −1.6], [−1.6, −1]] at (2, 2),
    // eigenvalues −1 ± 1.6.
    expect(saddle[0]).toContain('eigenvalues: 0.6, -2.6');
    expect(tips.filter((t) => t.includes('type: stable node'))).toHaveLength(2);

    await screenshot(pg, 'portrait-toggle-switch');
    expect(opened.errors).toEqual([]);
    expect(opened.network).toEqual([]);
    expect(opened.dialogs).toEqual([]);
    await opened.close();
  });
});
