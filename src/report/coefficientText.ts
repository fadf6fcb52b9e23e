import type { ReportEvent } from '../types.js';
import { formatNumber } from './formatNumber.js';

/**
 * The normal-form numbers of a special point in words: "fold coefficient a = 1.732" or
 * "first Lyapunov coefficient l1 = −0.5 (supercritical), frequency 1, period 6.283"; '' when none.
 */
export function coefficientText(e: ReportEvent): string {
  const parts: string[] = [];
  if (e.foldCoefficient !== undefined) parts.push(`fold coefficient a = ${formatNumber(e.foldCoefficient)}`);
  if (e.lyapunov !== undefined) {
    const criticality = e.criticality === undefined ? '' : ` (${criticalityWords(e.criticality)})`;
    parts.push(`first Lyapunov coefficient l1 = ${formatNumber(e.lyapunov)}${criticality}`);
  } else if (e.criticality !== undefined) {
    parts.push(criticalityWords(e.criticality));
  }
  if (e.frequency !== undefined) parts.push(`frequency ${formatNumber(e.frequency)}`);
  if (e.period !== undefined) parts.push(`period ${formatNumber(e.period)}`);
  return parts.join(', ');
}

export function criticalityWords(c: NonNullable<ReportEvent['criticality']>): string {
  return c === 'degenerate' ? 'criticality undecided' : c;
}
