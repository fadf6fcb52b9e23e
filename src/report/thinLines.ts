/**
 * Fewer line points for the diagram, none that can be seen missing: the Ramer–Douglas–Peucker
 * simplification (Ramer 1972; Douglas & Peucker 1973) applied to each run of rows (field `run`)
 * in all plotted fields at once. Each field is scaled by the spread of its values over all rows, so
 * a point is dropped only when it lies within `tol` of a panel's extent from the kept polyline in
 * every panel together. With the default tolerance (DIAGRAM_THIN_TOL) a panel 600 pixels wide is off
 * by less than 0.1 pixel, and by less than 1 pixel at tenfold zoom.
 *
 * Fields named in `logFields` (a parameter axis drawn on a log scale) are measured in their logarithm.
 * Rows are kept in their order; the first and last row of a run, and every row with a missing
 * (null) value in a plotted field, are always kept. report.json and points.csv keep every point.
 */
import { segmentDistance } from '../linalg/vector.js';
import type { DiagramRow } from './diagramData.js';

/** Default tolerance, as a fraction of each field's spread. Common practice for screen output. */
export const DIAGRAM_THIN_TOL = 1e-4;

export function thinLines(
  rows: readonly DiagramRow[], fields: readonly string[], tol = DIAGRAM_THIN_TOL, logFields: readonly string[] = [],
): DiagramRow[] {
  // A field drawn on a logarithmic axis is measured in its logarithm.
  const value = (r: DiagramRow, f: string): unknown => {
    const v = r[f];
    return typeof v === 'number' && logFields.includes(f) ? Math.log10(v) : v;
  };
  const scale = fields.map((f) => {
    let lo = Infinity;
    let hi = -Infinity;
    for (const r of rows) {
      const v = value(r, f);
      if (typeof v === 'number') {
        lo = Math.min(lo, v);
        hi = Math.max(hi, v);
      }
    }
    return hi > lo ? 1 / (hi - lo) : 0;
  });
  const d = fields.length;
  const keep = new Uint8Array(rows.length);
  const coords = new Float64Array(rows.length * d);
  const complete = new Uint8Array(rows.length);
  rows.forEach((r, i) => {
    complete[i] = 1;
    fields.forEach((f, j) => {
      const v = value(r, f);
      if (typeof v === 'number') coords[i * d + j] = v * scale[j]!;
      else complete[i] = 0;
    });
  });
  const points = rows.map((_, i) => coords.subarray(i * d, (i + 1) * d));
  // Stretches to simplify: maximal sequences of complete rows within one run.
  let start = 0;
  for (let i = 1; i <= rows.length; i++) {
    const ends = i === rows.length || rows[i]!.run !== rows[start]!.run || !complete[i] || !complete[i - 1];
    if (!ends) continue;
    keepStretch(points, start, i - 1, tol, keep);
    start = i;
  }
  return rows.filter((_, i) => keep[i] === 1);
}

/** Marks the points of [first, last] that Ramer–Douglas–Peucker keeps (iteratively, no recursion). */
function keepStretch(points: readonly Float64Array[], first: number, last: number, tol: number, keep: Uint8Array): void {
  keep[first] = 1;
  keep[last] = 1;
  const stack: number[] = [first, last];
  while (stack.length > 0) {
    const b = stack.pop()!;
    const a = stack.pop()!;
    let worst = -1;
    let worstDistance = tol;
    for (let i = a + 1; i < b; i++) {
      const dist = segmentDistance(points[i]!, points[a]!, points[b]!);
      if (dist > worstDistance) {
        worstDistance = dist;
        worst = i;
      }
    }
    if (worst < 0) continue;
    keep[worst] = 1;
    stack.push(a, worst, worst, b);
  }
}
