import { describe, expect, it } from 'vitest';
import type { DiagramRow } from '../../src/report/diagramData.js';
import { DIAGRAM_THIN_TOL, thinLines } from '../../src/report/thinLines.js';

/** Rows along a curve (parameter, v0, v1) = c(u), u = 0 … 1, all in one run. */
function curve(count: number, c: (u: number) => [number, number, number], run = 'r'): DiagramRow[] {
  return Array.from({ length: count }, (_, i) => {
    const [parameter, v0, v1] = c(i / (count - 1));
    return { run, index: i, parameter, v0, v1 };
  });
}

const FIELDS = ['parameter', 'v0', 'v1'];

/**
 * Brute force over every kept segment, written apart from the implementation: the largest distance, in coordinates scaled by each
 * field's spread over all rows, from a dropped row to the kept polyline of its run.
 */
function worstGap(all: readonly DiagramRow[], kept: readonly DiagramRow[]): number {
  const spread = FIELDS.map((f) => {
    const v = all.map((r) => r[f] as number);
    return Math.max(...v) - Math.min(...v) || 1;
  });
  const at = (r: DiagramRow) => FIELDS.map((f, j) => (r[f] as number) / spread[j]!);
  let worst = 0;
  for (const r of all) {
    if (kept.includes(r)) continue;
    const p = at(r);
    let best = Infinity;
    const line = kept.filter((k) => k.run === r.run);
    for (let k = 1; k < line.length; k++) {
      const a = at(line[k - 1]!);
      const b = at(line[k]!);
      // Closest point of the segment: the projection onto the line through a and b, clamped to it.
      const ab = a.map((x, j) => b[j]! - x);
      const s = Math.min(1, Math.max(0, ab.reduce((sum, d, j) => sum + d * (p[j]! - a[j]!), 0) / ab.reduce((sum, d) => sum + d * d, 0)));
      best = Math.min(best, Math.hypot(...a.map((x, j) => x + s * ab[j]! - p[j]!)));
    }
    worst = Math.max(worst, best);
  }
  return worst;
}

describe('thinLines (Ramer 1972; Douglas & Peucker 1973)', () => {
  it('measures a field drawn on a log axis in its logarithm: a straight line there keeps its two ends only', () => {
    // v0 = log10(parameter) is straight on a log axis and curved on a linear one.
    const rows = curve(300, (u) => [10 ** (4 * u - 3), 4 * u - 3, 0]);
    expect(thinLines(rows, FIELDS, DIAGRAM_THIN_TOL, ['parameter'])).toEqual([rows[0], rows[299]]);
    expect(thinLines(rows, FIELDS).length).toBeGreaterThan(10);
  });

  it('keeps only the two ends of a straight run', () => {
    const rows = curve(500, (u) => [u, 3 * u - 1, -2 * u]);
    expect(thinLines(rows, FIELDS)).toEqual([rows[0], rows[499]]);
  });

  it('leaves every dropped point of a curved run within the tolerance of the kept line, in order', () => {
    // A circle in (v0, v1) while the parameter rises: curvature everywhere.
    const rows = curve(2000, (u) => [u, Math.cos(2 * Math.PI * u), Math.sin(2 * Math.PI * u)]);
    const kept = thinLines(rows, FIELDS);
    expect(kept.length).toBeLessThan(rows.length / 4);
    expect(kept[0]).toBe(rows[0]);
    expect(kept.at(-1)).toBe(rows.at(-1));
    const order = kept.map((r) => r.index as number);
    expect(order).toEqual([...order].sort((a, b) => a - b));
    expect(worstGap(rows, kept)).toBeLessThanOrEqual(DIAGRAM_THIN_TOL * (1 + 1e-9));
    // A looser tolerance keeps fewer points and still honours its own bound.
    const coarse = thinLines(rows, FIELDS, 1e-2);
    expect(coarse.length).toBeLessThan(kept.length);
    expect(worstGap(rows, coarse)).toBeLessThanOrEqual(1e-2 * (1 + 1e-9));
  });

  it('never joins two runs, and keeps rows with a missing value and their neighbours', () => {
    const a = curve(50, (u) => [u, u, u], 'a');
    const b = curve(50, (u) => [1 + u, 1 + u, 1 + u], 'b');
    const gap = curve(50, (u) => [2 + u, 2 + u, 2 + u], 'c');
    gap[20] = { ...gap[20]!, v1: null };
    const kept = thinLines([...a, ...b, ...gap], FIELDS);
    // Straight runs: two ends each; the third is broken at the missing value into [0, 19], 20, [21, 49].
    expect(kept).toEqual([a[0], a[49], b[0], b[49], gap[0], gap[19], gap[20], gap[21], gap[49]]);
  });

  it('ignores a field that never changes (no spread to scale by)', () => {
    const rows = curve(100, (u) => [u, 5, u * u]);
    const kept = thinLines(rows, FIELDS);
    expect(kept.length).toBeGreaterThan(2);
    expect(kept.length).toBeLessThan(100);
  });
});
