import type { Margin, MarginSide, ReportEvent } from '../types.js';
import { eventLabel } from './eventWords.js';
import { formatNumber } from './formatNumber.js';

/** Short label for the nominal-value rule of the diagram: "nominal D = 0.1, margin 28.5%". */
export function marginLabel(m: Margin): string {
  const head = `nominal ${m.parameter} = ${formatNumber(m.nominal)}${m.operatingStable === false ? ' (unstable state)' : ''}`;
  if (m.nearestRelative === null) return `${head}, ${m.status}`;
  return `${head}, margin ${percent(m.nearestRelative)}${m.status === 'ok' ? '' : ` (${m.status})`}`;
}

/** Sentences for the report: where the nominal value sits and how far the nearest special points are. */
export function marginSentences(m: Margin, events: readonly ReportEvent[]): string[] {
  const head = `The nominal value is ${m.parameter} = ${formatNumber(m.nominal)}.`;
  if (m.status === 'nominal outside range' || m.branch === null) {
    return [head, 'No traced branch passes this value, so no design margin could be measured.'];
  }
  const lines = [`${head} The operating point is on branch ${m.branch}.`];
  if (m.operatingStable === false) {
    const k = m.operatingUnstableCount ?? 0;
    lines.push(`CAUTION: this steady state is unstable at the nominal value (${k} eigenvalue${k === 1 ? '' : 's'} with ` +
      'positive real part): the system will not stay at it.');
  }
  lines.push(m.below === null ? 'No special point below it on this branch.' : sideSentence('Below', m.below, m.parameter, events));
  lines.push(m.above === null ? 'No special point above it on this branch.' : sideSentence('Above', m.above, m.parameter, events));
  lines.push(statusSentence(m));
  return lines;
}

function sideSentence(side: string, s: MarginSide, parameter: string, events: readonly ReportEvent[]): string {
  const criticality = events.find((e) => e.id === s.event)?.criticality;
  return `${side}: ${eventLabel(s.type, criticality)} (special point ${s.event}) at ${parameter} = ${formatNumber(s.parameter)}, ` +
    `${formatNumber(s.distance)} away (${percent(s.relative)} of the nominal value).`;
}

function statusSentence(m: Margin): string {
  switch (m.status) {
    case 'fail':
      return `FAILED: the nearest special point is closer than the failing margin of ${percent(m.failMargin)}.`;
    case 'warn':
      return `WARNING: the nearest special point is closer than the warning margin of ${percent(m.warnMargin)}.`;
    case 'ok':
      return `The margin is at least the warning margin of ${percent(m.warnMargin)}.`;
    default:
      return 'The operating branch has no special point in the traced range.';
  }
}

export function percent(fraction: number): string {
  return `${formatNumber(fraction * 100, 3)}%`;
}
