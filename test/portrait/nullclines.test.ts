import { describe, expect, it } from 'vitest';
import { NULLCLINE_DEFAULTS, nullclines } from '../../src/portrait/nullclines.js';
import type { PlaneFrame, Point2 } from '../../src/portrait/plane.js';
import { makeSystem, nominalParameters } from '../helpers/handSystem.js';

const frame = (x: [number, number], y: [number, number]): PlaneFrame =>
  ({ ix: 0, iy: 1, window: { x, y }, held: new Float64Array(2) });
const vertices = (lines: Point2[][]): Point2[] => lines.flat();

describe('nullclines', () => {
  it('puts every vertex of the circle x² + y² = 1 within 1e-6 of radius 1 and closes the curve', () => {
    // Analytic: f_x = x² + y² − 1 vanishes on the unit circle; f_y = y − x on the line y = x.
    const sys = makeSystem({
      n: 2,
      rhs: (s, _p, o) => { o[0] = s[0]! ** 2 + s[1]! ** 2 - 1; o[1] = s[1]! - s[0]!; },
      jacobian: (s, _p, j) => { j[0] = 2 * s[0]!; j[1] = 2 * s[1]!; j[2] = -1; j[3] = 1; },
    });
    const [circle, line] = nullclines(sys, nominalParameters(sys), frame([-2, 2.1], [-1.7, 1.9]));
    // Bounds in this test (1e-6 on the radius, 1e-10 residual, 1e-12 and 10 digits on the line): common practice.
    expect(circle!.polylines).toHaveLength(1);
    const ring = circle!.polylines[0]!;
    expect(ring.length).toBeGreaterThan(100);
    expect(ring[0]).toEqual(ring[ring.length - 1]);
    for (const v of ring) expect(Math.abs(Math.hypot(v.x, v.y) - 1)).toBeLessThan(1e-6);
    expect(circle!.unrefined).toBe(0);
    expect(circle!.residual).toBeLessThan(1e-10);

    // The line y = x crosses the window from its lower-left edge to its upper-right edge: one open polyline.
    expect(line!.polylines).toHaveLength(1);
    const l = line!.polylines[0]!;
    for (const v of l) expect(Math.abs(v.y - v.x)).toBeLessThan(1e-12);
    const ends = [l[0]!, l[l.length - 1]!].sort((a, b) => a.x - b.x);
    expect(ends[0]!.x).toBeCloseTo(-1.7, 10); // enters through the bottom edge y = −1.7
    expect(ends[1]!.x).toBeCloseTo(1.9, 10); // leaves through the top edge y = 1.9
  });

  it('finds both branches of each Rosenzweig–MacArthur nullcline on their closed forms', () => {
    // Rosenzweig & MacArthur (1963) predator–prey model with a Holling type II response:
    //   x' = r x (1 − x/K) − a x y / (1 + a h x),   y' = e a x y / (1 + a h x) − m y.
    // Analytic: f_x = 0 ⇔ x = 0 or y = (r/a)(1 − x/K)(1 + a h x);
    //           f_y = 0 ⇔ y = 0 or e a x = m (1 + a h x) ⇔ x = m / (a (e − m h)).
    const params = { r: 1, K: 3, a: 1, h: 0.5, e: 0.6, m: 0.2 };
    const sys = makeSystem({
      n: 2,
      parameters: params,
      rhs: (s, q, o) => {
        const [x, y] = [s[0]!, s[1]!];
        const [r, K, a, h, e, m] = q as unknown as number[];
        const g = (a! * x) / (1 + a! * h! * x);
        o[0] = r! * x * (1 - x / K!) - g * y;
        o[1] = e! * g * y - m! * y;
      },
      jacobian: (s, q, j) => {
        const [x, y] = [s[0]!, s[1]!];
        const [r, K, a, h, e, m] = q as unknown as number[];
        const d = 1 + a! * h! * x;
        const g = (a! * x) / d, dg = a! / (d * d);
        j[0] = r! * (1 - (2 * x) / K!) - dg * y; j[1] = -g;
        j[2] = e! * dg * y; j[3] = e! * g - m!;
      },
    });
    const prey = (x: number): number => (params.r / params.a) * (1 - x / params.K) * (1 + params.a * params.h * x);
    const xPredator = params.m / (params.a * (params.e - params.m * params.h)); // = 0.4
    const [fx, fy] = nullclines(sys, nominalParameters(sys), frame([-0.3, 3.5], [-0.25, 2]));
    // The 1e-9 distance to a closed form and the minimum of 50 vertices per branch: common practice.
    let onAxis = 0, onCurve = 0;
    for (const v of vertices(fx!.polylines)) {
      const axis = Math.abs(v.x) < 1e-9, curve = Math.abs(v.y - prey(v.x)) < 1e-9;
      expect(axis || curve).toBe(true);
      if (axis) onAxis++;
      if (curve) onCurve++;
    }
    expect(onAxis).toBeGreaterThan(50);
    expect(onCurve).toBeGreaterThan(50);
    let onXAxis = 0, onVertical = 0;
    for (const v of vertices(fy!.polylines)) {
      const axis = Math.abs(v.y) < 1e-9, vertical = Math.abs(v.x - xPredator) < 1e-9;
      expect(axis || vertical).toBe(true);
      if (axis) onXAxis++;
      if (vertical) onVertical++;
    }
    expect(onXAxis).toBeGreaterThan(50);
    expect(onVertical).toBeGreaterThan(50);
  });

  it('resolves a saddle cell by its centre value where the corner average would join two branches', () => {
    // f = x y + x² y² − c with c = 1e-9. Analytic: with u = x y, u² + u − c = 0 gives
    // u₁ = (−1 + √(1 + 4c))/2 ≈ c (a hyperbola with one branch in the first quadrant and one in the third)
    // and u₂ = (−1 − √(1 + 4c))/2 ≈ −1 (branches in the second and fourth quadrants).
    // With 121 cells on [−1.05875, 1.05875] the origin is a cell centre; that cell's corners
    // (±d, ±d), d = 0.00875, give ±d² + d⁴ − c: a saddle pattern. The centre value is −c < 0, which
    // separates the first- and third-quadrant branches; the corner average d⁴ − c = +4.9e-9 would join them.
    const c = 1e-9;
    const sys = makeSystem({
      n: 2,
      rhs: (s, _p, o) => { const u = s[0]! * s[1]!; o[0] = u + u * u - c; o[1] = 1; },
      jacobian: (s, _p, j) => {
        const u = s[0]! * s[1]!;
        j[0] = s[1]! * (1 + 2 * u); j[1] = s[0]! * (1 + 2 * u); j[2] = 0; j[3] = 0;
      },
    });
    const w: [number, number] = [-1.05875, 1.05875];
    const [fx] = nullclines(sys, nominalParameters(sys), frame(w, w), { ...NULLCLINE_DEFAULTS, cells: 121 });
    const u1 = (-1 + Math.sqrt(1 + 4 * c)) / 2, u2 = (-1 - Math.sqrt(1 + 4 * c)) / 2;
    let nearOrigin = 0;
    for (const line of fx!.polylines) {
      // No polyline may pass from one quadrant's branch to another's.
      expect(new Set(line.map((v) => Math.sign(v.x))).size).toBe(1);
      for (const v of line) {
        const u = v.x * v.y;
        // Refinement stops at |f| ≤ 1e-12, and |df/du| = |1 + 2u| ≈ 1 on both branches.
        expect(Math.min(Math.abs(u - u1), Math.abs(u - u2))).toBeLessThan(1.5e-12);
        if (Math.hypot(v.x, v.y) < 0.05) nearOrigin++;
      }
    }
    expect(nearOrigin).toBeGreaterThan(0);
  });

  it('skips cells with non-finite corners and still traces y = log x where it is defined', () => {
    // Analytic: f_x = log x − y is NaN for x < 0 and −Infinity at x = 0; its zero set is y = log x.
    const sys = makeSystem({
      n: 2,
      rhs: (s, _p, o) => { o[0] = Math.log(s[0]!) - s[1]!; o[1] = s[1]!; },
      jacobian: (s, _p, j) => { j[0] = 1 / s[0]!; j[1] = -1; j[2] = 0; j[3] = 1; },
    });
    const [fx] = nullclines(sys, nominalParameters(sys), frame([-1, 3], [-2, 1.5]));
    const vs = vertices(fx!.polylines);
    expect(vs.length).toBeGreaterThan(50);
    for (const v of vs) {
      expect(Number.isFinite(v.x) && Number.isFinite(v.y)).toBe(true);
      expect(Math.abs(v.y - Math.log(v.x))).toBeLessThan(1e-9);
    }
  });
});
