/**
 * Everything a command writes, rendered in memory first (so nothing is written when rendering fails):
 * the sweep's report.json, report.md, points.csv and diagram (html, Vega-Lite spec, svg), and the
 * portrait's page. writeOutputs (writeFiles.ts) then puts them in place atomically.
 */
import type { PortraitData } from '../portrait/buildPortrait.js';
import { portraitSpec } from '../portrait/portraitSpec.js';
import type { Report } from '../types.js';
import { CAUTION } from './caution.js';
import { diagramSpec } from './diagramSpec.js';
import { formatNumber } from './formatNumber.js';
import { diagramText } from './diagramText.js';
import { renderCsv } from './renderCsv.js';
import { renderJson } from './renderJson.js';
import { renderMarkdown } from './renderMarkdown.js';
import { renderPage } from './renderPage.js';
import type { OutputFile } from './writeFiles.js';

export interface DiagramChoice {
  /** States to draw (default: all), or 'norm' for the Euclidean norm of the state. */
  plot?: readonly string[] | 'norm';
  /** Write the diagram files too (default true). */
  diagram?: boolean;
}

export async function sweepFiles(report: Report, choice: DiagramChoice = {}): Promise<OutputFile[]> {
  return [...reportFiles(report), ...(choice.diagram === false ? [] : await diagramFiles(report, choice.plot))];
}

/** report.json, report.md and points.csv. */
export function reportFiles(report: Report): OutputFile[] {
  return [
    { name: 'report.json', content: renderJson(report) },
    { name: 'report.md', content: renderMarkdown(report) },
    { name: 'points.csv', content: renderCsv(report) },
  ];
}

/** diagram.html, diagram.vl.json and diagram.svg. */
export async function diagramFiles(report: Report, plot?: DiagramChoice['plot']): Promise<OutputFile[]> {
  const page = await renderPage(diagramSpec(report, plot === undefined ? {} : { plot }), diagramText(report));
  return [
    { name: 'diagram.html', content: page.html },
    { name: 'diagram.vl.json', content: page.vegaLite },
    { name: 'diagram.svg', content: page.svg },
  ];
}

export async function portraitFiles(data: PortraitData): Promise<OutputFile[]> {
  const setting = data.parameters.map((q) => `${q.name} = ${formatNumber(q.value, 6)}`).join(', ');
  const page = await renderPage(portraitSpec(data), {
    title: `Phase portrait: ${data.title}`,
    subtitle: setting,
    notes: [...(data.note === undefined ? [] : [`This plane is a slice: ${data.note}.`]), CAUTION],
  });
  return [
    { name: 'portrait.html', content: page.html },
    { name: 'portrait.vl.json', content: page.vegaLite },
    { name: 'portrait.svg', content: page.svg },
  ];
}
