import type { Report } from '../types.js';
import { coefficientText, criticalityWords } from './coefficientText.js';
import { eventLabel } from './eventWords.js';
import { formatEigenvalues } from './formatNumber.js';

/** One row per plotted branch point; states are in fields v0, v1, … (model order). */
export type DiagramRow = Record<string, string | number | null>;

/** The field that holds state `i` in the diagram's rows. */
export const stateField = (i: number): string => `v${i}`;

const finite = (x: number | undefined): number | null => (x !== undefined && Number.isFinite(x) ? x : null);

/**
 * Branch rows for line marks: each branch split into runs of equal stability (field `run`), the point
 * where stability changes repeated in both runs so the lines join. `index` keeps arclength order.
 */
export function branchRows(report: Report): DiagramRow[] {
  const names = report.model.states.map((s) => s.name);
  const rows: DiagramRow[] = [];
  for (const b of report.branches) {
    let run = 0;
    b.points.forEach((p, k) => {
      const previous = b.points[k - 1];
      const row = (runNumber: number): DiagramRow => {
        const r: DiagramRow = {
          branch: `branch ${b.id}`, run: `${b.id}-${runNumber}`, index: p.index, parameter: finite(p.parameter),
          stability: p.stable ? 'stable' : 'unstable', maxRealPart: finite(p.maxRealPart),
        };
        names.forEach((n, i) => {
          r[stateField(i)] = finite(p.state[n]);
        });
        return r;
      };
      if (previous !== undefined && previous.stable !== p.stable) {
        const joint = row(run);
        joint.stability = previous.stable ? 'stable' : 'unstable';
        rows.push(joint);
        run += 1;
      }
      rows.push(row(run));
    });
  }
  return rows;
}

/** Special-point rows with the text their tooltips show. */
export function specialRows(report: Report): DiagramRow[] {
  const names = report.model.states.map((s) => s.name);
  return report.events.map((e) => {
    const r: DiagramRow = {
      id: e.id, type: eventLabel(e.type, e.criticality), branch: `branch ${e.branch}`, parameter: finite(e.parameter),
      maxRealPart: finite(e.eigenvalues.length === 0 ? Number.NaN : Math.max(...e.eigenvalues.map((v) => v.re))),
      eigenvalues: formatEigenvalues(e.eigenvalues), coefficient: coefficientText(e) || 'none',
      criticality: e.criticality === undefined ? 'not applicable' : criticalityWords(e.criticality), meaning: e.meaning,
    };
    names.forEach((n, i) => {
      r[stateField(i)] = finite(e.state[n]);
    });
    return r;
  });
}
