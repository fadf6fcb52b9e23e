import type { Report, ReportBranch, ReportEvent } from '../types.js';
import { coefficientText } from './coefficientText.js';
import { eventLabel } from './eventWords.js';
import { formatEigenvalues, formatNumber } from './formatNumber.js';
import { marginSentences, percent } from './marginText.js';
import { stopWords } from './stopWords.js';
import { valueWithUnit, withUnit } from './withUnit.js';

/** report.md: what was traced, the special points and what they mean, each branch, the margin, warnings. */
export function renderMarkdown(report: Report): string {
  const title = report.model.title ?? report.model.file;
  const out: string[] = [`# ${md(title)}: steady states as ${md(report.parameter)} varies`, ''];
  out.push(`> **Caution.** ${md(report.caution)}`, '');
  if (report.model.about !== undefined) out.push(md(report.model.about), '');
  out.push(`Model file \`${code(report.model.file)}\`, traced by ${report.tool} ${md(report.version)}.`, '');
  out.push(...sweepSection(report), ...eventSection(report));
  for (const b of report.branches) out.push(...branchSection(b, report));
  if (report.margin !== null) {
    out.push('## Design margin', '', ...marginSentences(report.margin, report.events).map(md), '');
  }
  if (report.warnings.length > 0) out.push('## Warnings', '', ...report.warnings.map((w) => `- ${md(w)}`), '');
  out.push('## Caution', '', md(report.caution), '');
  return out.join('\n');
}

function sweepSection(r: Report): string[] {
  const s = r.settings;
  const others = r.model.parameters.filter((p) => p.name !== r.parameter);
  const lines = [
    '## Sweep', '',
    `- Varied parameter: ${md(withUnit(r.parameter, r.unit))} from ${formatNumber(r.range.from)} to ${formatNumber(r.range.to)}` +
      `${s.parameterScale === 'log' ? ', stepped on a logarithmic scale (step lengths below in decades)' : ''}.`,
    `- Other parameters: ${others.length === 0 ? 'none' : others.map((p) => `${md(p.name)} = ${md(valueWithUnit(formatNumber(p.value), p.unit))}`).join(', ')}.`,
    `- Step length: first ${formatNumber(s.ds)}, smallest ${formatNumber(s.dsMin)}, largest ${formatNumber(s.dsMax)}; at most ${s.maxPoints} points per branch and ${s.maxBranches} branches.`,
    `- Starts: equilibria searched for at ${md(r.parameter)} = ${[...s.searchedAt].sort((a, b) => a - b).map((v) => formatNumber(v)).join(', ')}; ` +
      'a branch that reaches none of these values (a closed curve narrower than their spacing) is not found.',
    `- Corrector: tolerance ${formatNumber(s.absTol)}, at most ${s.maxIter} Newton iterations.`,
    `- Margins: warning below ${percent(s.warnMargin)} of the nominal value; ` +
      (s.failMargin > 0 ? `failing below ${percent(s.failMargin)}.` : 'no failing margin (--fail-margin not set).'),
  ];
  if (r.interrupted) lines.push('- The run was interrupted: the results below are incomplete.');
  return [...lines, ''];
}

function eventSection(r: Report): string[] {
  if (r.events.length === 0) return ['## Special points', '', 'No special points were found in the traced range.', ''];
  const states = r.model.states;
  const head = ['point', 'type', 'branch', withUnit(r.parameter, r.unit), ...states.map((s) => withUnit(s.name, s.unit)),
    'eigenvalues', 'coefficient', 'meaning'];
  const rows = r.events.map((e: ReportEvent) => [
    String(e.id), eventLabel(e.type, e.criticality), String(e.branch), formatNumber(e.parameter),
    ...states.map((s) => formatNumber(e.state[s.name] ?? Number.NaN)),
    formatEigenvalues(e.eigenvalues), coefficientText(e) || '(none)', e.meaning,
  ]);
  return ['## Special points', '', ...table(head, rows), ''];
}

function branchSection(b: ReportBranch, r: Report): string[] {
  const origin = b.origin.kind === 'start' ? 'from a start equilibrium'
    : `switched from branch ${b.origin.branch} at special point ${b.origin.event}`;
  const rows = b.stability.map((s) => [
    s.stable ? 'stable' : 'unstable', formatNumber(s.from), formatNumber(s.to), String(s.unstableCount),
  ]);
  return [
    `## Branch ${b.id}`, '',
    `Traced ${origin}; ${b.points.length} points. It stopped because ${stopWords(b.stopped)}.`, '',
    ...table(['stability', `${withUnit(r.parameter, r.unit)} from`, 'to', 'unstable eigenvalues'], rows), '',
  ];
}

function table(head: string[], rows: string[][]): string[] {
  return [
    `| ${head.map(md).join(' | ')} |`,
    `|${head.map(() => ' --- ').join('|')}|`,
    ...rows.map((row) => `| ${row.map(md).join(' | ')} |`),
  ];
}

/** Text from the model or the numerics, safe in Markdown: no markup, no raw HTML, one line. */
export function md(text: string): string {
  return text
    .replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;')
    .replace(/[\\`*_[\]|#]/g, (c) => `\\${c}`)
    .replace(/\s*[\r\n]+\s*/g, ' ');
}

function code(text: string): string {
  return text.replace(/`/g, "'").replace(/[\r\n]+/g, ' ');
}
