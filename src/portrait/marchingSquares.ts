/**
 * Zero contour of a function sampled on a regular grid, by marching squares (Lorensen & Cline
 * 1987 describe the three-dimensional form; this is its two-dimensional square-cell case).
 *
 * A node counts as "positive" when its value is ≥ 0, so every cell edge whose ends differ in sign
 * holds exactly one crossing, placed by linear interpolation. A cell with four crossings (a saddle
 * cell: diagonal corners alike) is resolved by the function value at the cell centre: when the
 * centre has the sign of the bottom-left corner, that corner and the top-right one are joined
 * through the centre and the contour cuts off the other two corners, else the reverse.
 * Cells with any non-finite corner are skipped. Segments that share an edge crossing are joined
 * end to end into polylines; a closed curve repeats its first vertex at the end.
 */
import type { Point2 } from './plane.js';

export interface GridSpec {
  /** Cells along x and y; the nodes are (nx + 1) × (ny + 1), row by row from the bottom. */
  nx: number;
  ny: number;
  x0: number;
  y0: number;
  dx: number;
  dy: number;
}

/**
 * Polylines of the zero set. `values[j*(nx+1) + i]` is the value at node (x0 + i·dx, y0 + j·dy);
 * `centre(x, y)` evaluates the function at a cell centre (used only in saddle cells).
 */
export function zeroContour(values: Float64Array, grid: GridSpec, centre: (x: number, y: number) => number): Point2[][] {
  const { nx, ny, x0, y0, dx, dy } = grid;
  const stride = nx + 1;
  const node = (i: number, j: number): number => values[j * stride + i]!;
  // Edge keys: 2·node for the horizontal edge to the right of a node, 2·node + 1 for the vertical edge above it.
  const hKey = (i: number, j: number): number => 2 * (j * stride + i);
  const vKey = (i: number, j: number): number => 2 * (j * stride + i) + 1;
  const points = new Map<number, Point2>();
  const crossing = (key: number): number => {
    if (!points.has(key)) {
      const base = key >> 1;
      const i = base % stride;
      const j = (base - i) / stride;
      const a = node(i, j);
      const horizontal = (key & 1) === 0;
      const b = horizontal ? node(i + 1, j) : node(i, j + 1);
      const s = a / (a - b);
      points.set(key, horizontal ? { x: x0 + (i + s) * dx, y: y0 + j * dy } : { x: x0 + i * dx, y: y0 + (j + s) * dy });
    }
    return key;
  };

  const segments: [number, number][] = [];
  for (let j = 0; j < ny; j++) {
    for (let i = 0; i < nx; i++) {
      const a = node(i, j), b = node(i + 1, j), c = node(i + 1, j + 1), d = node(i, j + 1);
      if (!(Number.isFinite(a) && Number.isFinite(b) && Number.isFinite(c) && Number.isFinite(d))) continue;
      const sa = a >= 0, sb = b >= 0, sc = c >= 0, sd = d >= 0;
      const edges: number[] = [];
      if (sa !== sb) edges.push(crossing(hKey(i, j))); // bottom
      if (sb !== sc) edges.push(crossing(vKey(i + 1, j))); // right
      if (sd !== sc) edges.push(crossing(hKey(i, j + 1))); // top
      if (sa !== sd) edges.push(crossing(vKey(i, j))); // left
      if (edges.length === 2) {
        segments.push([edges[0]!, edges[1]!]);
      } else if (edges.length === 4) {
        const [bottom, right, top, left] = edges as [number, number, number, number];
        let m = centre(x0 + (i + 0.5) * dx, y0 + (j + 0.5) * dy);
        if (!Number.isFinite(m)) m = (a + b + c + d) / 4;
        if (m >= 0 === sa) {
          segments.push([bottom, right], [top, left]); // cut off corners b and d
        } else {
          segments.push([left, bottom], [right, top]); // cut off corners a and c
        }
      }
    }
  }
  return joinSegments(segments).map((chain) => chain.map((key) => points.get(key)!));
}

/** Join segments that share an end key into chains; open chains first, then closed loops. */
function joinSegments(segments: [number, number][]): number[][] {
  const byKey = new Map<number, number[]>();
  segments.forEach(([a, b], s) => {
    for (const k of [a, b]) {
      const list = byKey.get(k);
      if (list) list.push(s);
      else byKey.set(k, [s]);
    }
  });
  const used = new Uint8Array(segments.length);
  const walk = (start: number, from: number): number[] => {
    const chain = [from];
    let key = from;
    let s = start;
    while (s >= 0 && !used[s]) {
      used[s] = 1;
      const [a, b] = segments[s]!;
      key = a === key ? b : a;
      chain.push(key);
      s = (byKey.get(key) ?? []).find((t) => !used[t]) ?? -1;
    }
    return chain;
  };
  const chains: number[][] = [];
  for (const [key, list] of byKey) {
    if (list.length === 1 && !used[list[0]!]) chains.push(walk(list[0]!, key));
  }
  for (let s = 0; s < segments.length; s++) {
    if (!used[s]) chains.push(walk(s, segments[s]![0]));
  }
  return chains;
}
