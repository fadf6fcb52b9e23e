/**
 * A Vega-Lite chart → three outputs:
 *
 *   1. `vegaLite`: the chart as JSON text (diagram.vl.json);
 *   2. `svg`: compiled to Vega and rendered headless in Node (diagram.svg);
 *   3. `html`: ONE self-contained page that opens from disk with no network. It inlines vega's
 *      browser build, carries the compiled Vega spec as JSON in a <script type="application/json">
 *      (every `<` written as \u003c so no text can close the script), renders it as SVG, and shows
 *      tooltips in its own small box (text only, via textContent). Title, subtitle and notes are
 *      escaped HTML text. A Content-Security-Policy allows no network request of any kind.
 *
 * This is the only module that uses vega and vega-lite (through chartRuntime.ts, loaded with
 * `await import()`) so that commands which write no chart start fast.
 */
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';
import type { TopLevelSpec } from 'vega-lite';
import { pageHtml } from './pageHtml.js';

export interface PageText {
  title: string;
  subtitle?: string;
  notes: readonly string[];
}

export interface RenderedPage {
  html: string;
  svg: string;
  vegaLite: string;
}

export interface CompiledChart {
  /** The Vega spec (without its `$schema` address, so that the page names no URL). */
  vega: Record<string, unknown>;
  /** Everything Vega-Lite warned about while compiling (empty for a clean chart). */
  warnings: string[];
}

/**
 * vega and vega-lite (about 0.2 s to load unbundled, 0.06 s as the build's chunk). Calling this
 * early, e.g. while a sweep computes in its worker, overlaps the load with the computation.
 */
export function loadChartRuntime(): Promise<typeof import('./chartRuntime.js')> {
  return import('./chartRuntime.js');
}

/** A Vega-Lite logger that keeps warnings and errors instead of printing them. */
class CollectingLogger {
  readonly messages: string[] = [];
  #level = 0;
  level(): number;
  level(l: number): this;
  level(l?: number): number | this {
    if (l === undefined) return this.#level;
    this.#level = l;
    return this;
  }
  warn(...args: readonly unknown[]): this {
    this.messages.push(args.map(String).join(' '));
    return this;
  }
  error(...args: readonly unknown[]): this {
    this.messages.push(`error: ${args.map(String).join(' ')}`);
    return this;
  }
  info(): this {
    return this;
  }
  debug(): this {
    return this;
  }
}

/** Vega-Lite → Vega, collecting warnings instead of printing them. */
export async function compileChart(spec: TopLevelSpec): Promise<CompiledChart> {
  const { compile } = await loadChartRuntime();
  const logger = new CollectingLogger();
  const compiled = compile(spec, { logger });
  const { $schema: _schema, ...vega } = compiled.spec as Record<string, unknown>;
  return { vega, warnings: logger.messages };
}

/** The chart as SVG text, rendered in Node without a browser. */
async function chartSvg(vegaSpec: Record<string, unknown>): Promise<string> {
  const { parse, View } = await loadChartRuntime();
  const view = new View(parse(vegaSpec as Parameters<typeof parse>[0]), { renderer: 'none' });
  try {
    return await view.toSVG();
  } finally {
    view.finalize();
  }
}

/** vega's self-contained browser build (build/vega.min.js beside the package's module entry). */
export function vegaBrowserBuild(): string {
  const require = createRequire(import.meta.url);
  const entry = require.resolve('vega');
  return readFileSync(join(dirname(entry), 'vega.min.js'), 'utf8');
}

export async function renderPage(spec: TopLevelSpec, text: PageText): Promise<RenderedPage> {
  const { vega } = await compileChart(spec);
  const svg = await chartSvg(vega);
  const html = pageHtml(vega, text, vegaBrowserBuild());
  return { html, svg, vegaLite: `${JSON.stringify(spec, null, 2)}\n` };
}
