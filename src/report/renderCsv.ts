import type { Report } from '../types.js';

/**
 * points.csv: one row per branch point, columns branch, index, the varied parameter (by name), every
 * state (by name), stable, maxRealPart. RFC 4180 quoting; numbers at full precision; values that are
 * not finite are left empty.
 */
export function renderCsv(report: Report): string {
  const states = report.model.states.map((s) => s.name);
  const rows: string[] = [['branch', 'index', report.parameter, ...states, 'stable', 'maxRealPart'].map(csvField).join(',')];
  for (const b of report.branches) {
    for (const p of b.points) {
      const cells = [
        csvNumber(b.id), csvNumber(p.index), csvNumber(p.parameter),
        ...states.map((s) => csvNumber(p.state[s] ?? Number.NaN)),
        p.stable ? 'true' : 'false', csvNumber(p.maxRealPart),
      ];
      rows.push(cells.join(','));
    }
  }
  return rows.join('\r\n') + '\r\n';
}

function csvNumber(x: number): string {
  return Number.isFinite(x) ? String(x) : '';
}

/** Quote a field when it holds a comma, quote, line break or surrounding space (RFC 4180 §2). */
export function csvField(text: string): string {
  return /[",\r\n]|^\s|\s$/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}
