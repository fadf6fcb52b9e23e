import type { Report } from '../types.js';
import { formatNumber } from './formatNumber.js';
import { marginSentences } from './marginText.js';
import type { PageText } from './renderPage.js';
import { withUnit } from './withUnit.js';

/**
 * The words around the diagram on its page: the model's name as the heading, what was varied as the
 * subtitle, then the notes — the caution first, the design margin, and every warning of the run.
 */
export function diagramText(report: Report): PageText {
  const name = report.model.title ?? report.model.file;
  const range = `${formatNumber(report.range.from)} to ${formatNumber(report.range.to)}`;
  const notes = [report.caution];
  if (report.interrupted) notes.push('The run was interrupted: the diagram is incomplete.');
  if (report.margin !== null) notes.push(marginSentences(report.margin, report.events).join(' '));
  notes.push('Drag to pan, scroll to zoom, double-click to reset; hover over a special point for its values.');
  notes.push(...report.warnings.map((w) => `Warning: ${w}`));
  return {
    title: name,
    subtitle: `Steady states as ${withUnit(report.parameter, report.unit)} varies from ${range}` +
      `${report.model.about === undefined ? '' : `. ${report.model.about.trim()}`}`,
    notes,
  };
}
