/**
 * Headless Chromium for the page tests: Debian's /usr/bin/chromium driven by playwright-core, every
 * request that is not a file: URL aborted and recorded, console errors, page errors and dialogs
 * recorded. A missing browser is a failure, never a skip (install it with `apt-get install -y chromium`).
 */
import { existsSync, mkdirSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { chromium, type Browser, type Page } from 'playwright-core';
import { DIAGRAM_MARKS } from '../../src/report/diagramSpec.js';

export const CHROMIUM = '/usr/bin/chromium';

const ARGS = [
  '--headless', '--no-sandbox', '--disable-gpu', '--no-first-run', '--disable-background-networking',
  '--disable-component-update', '--disable-sync',
];

export async function launchBrowser(): Promise<Browser> {
  if (!existsSync(CHROMIUM)) {
    throw new Error(`${CHROMIUM} is missing: the browser tests need it (apt-get install -y chromium)`);
  }
  return chromium.launch({ executablePath: CHROMIUM, headless: true, args: ARGS });
}

export interface OpenedPage {
  page: Page;
  /** Console messages of type "error", and uncaught page errors. */
  errors: string[];
  /** Every request that was not for a file: URL (all of them aborted). */
  network: string[];
  /** Messages of alert/confirm/prompt dialogs (all dismissed). */
  dialogs: string[];
  close(): Promise<void>;
}

/** A fresh temporary folder for pages written by one test file. */
export function pageFolder(prefix: string): string {
  return mkdtempSync(join(tmpdir(), `bt-${prefix}-`));
}

/** Writes `html` to `dir/name`, opens it with file:// and waits until the chart has rendered. */
export async function openPage(browser: Browser, dir: string, name: string, html: string): Promise<OpenedPage> {
  const file = join(dir, name);
  writeFileSync(file, html);
  const context = await browser.newContext({ viewport: { width: 1100, height: 1200 } });
  const page = await context.newPage();
  const errors: string[] = [];
  const network: string[] = [];
  const dialogs: string[] = [];
  await context.route('**/*', async (route) => {
    const url = route.request().url();
    if (url.startsWith('file:')) return route.continue();
    network.push(url);
    return route.abort();
  });
  page.on('request', (request) => {
    if (!request.url().startsWith('file:')) network.push(request.url());
  });
  page.on('console', (m) => {
    if (m.type() === 'error') errors.push(m.text());
  });
  page.on('pageerror', (e) => errors.push(String(e)));
  page.on('dialog', (d) => {
    dialogs.push(d.message());
    void d.dismiss();
  });
  await page.goto(pathToFileURL(file).href);
  await page.waitForSelector('body[data-bt-ready="true"]', { timeout: 15_000 });
  return { page, errors, network, dialogs, close: () => context.close() };
}

/** Saves a screenshot as out/browser/<name>.png (out/ is not committed). */
export async function screenshot(page: Page, name: string): Promise<string> {
  const dir = join(process.cwd(), 'out', 'browser');
  mkdirSync(dir, { recursive: true });
  const path = join(dir, `${name}.png`);
  await page.screenshot({ path, fullPage: true });
  return path;
}

/** Moves the mouse onto the centre of `selector`'s nth match and returns the tooltip's text ('' if hidden). */
export async function hoverTooltip(page: Page, selector: string, nth: number): Promise<string> {
  await page.mouse.move(0, 0);
  const box = await page.locator(selector).nth(nth).boundingBox();
  if (box === null) throw new Error(`no box for ${selector} #${nth}`);
  await page.mouse.move(box.x + box.width / 2, box.y + box.height / 2, { steps: 2 });
  const tip = page.locator('.bt-tooltip');
  await tip.waitFor({ state: 'visible', timeout: 3_000 });
  return (await tip.textContent()) ?? '';
}


/** CSS selectors of the diagram's branch line paths and special-point marks in one panel. */
export const lineMarks = (panel: string): string => `g.${DIAGRAM_MARKS.svgClass(DIAGRAM_MARKS.lines(panel))} > path`;
export const pointMarks = (panel: string): string => `g.${DIAGRAM_MARKS.svgClass(DIAGRAM_MARKS.points(panel))} > path`;
