import { describe, expect, it } from 'vitest';
import { directionField } from '../../src/portrait/directionField.js';
import type { PlaneFrame } from '../../src/portrait/plane.js';
import { makeSystem, nominalParameters } from '../helpers/handSystem.js';

describe('directionField', () => {
  it('points every arrow of the rotation x\' = −y, y\' = x along the tangent of the circle through it', () => {
    // Analytic: the flow is the rigid rotation; in window fractions (width 4, height 2) the direction
    // is (−y/4, x/2)/‖·‖ and the speed ‖(−y/4, x/2)‖.
    const sys = makeSystem({
      n: 2,
      rhs: (s, _p, o) => { o[0] = -s[1]!; o[1] = s[0]!; },
      jacobian: (_s, _p, j) => { j[0] = 0; j[1] = -1; j[2] = 1; j[3] = 0; },
    });
    const frame: PlaneFrame = { ix: 0, iy: 1, window: { x: [-2, 2], y: [-1, 1] }, held: new Float64Array(2) };
    const arrows = directionField(sys, nominalParameters(sys), frame, { columns: 20, rows: 16 });
    // No cell centre is the origin (20 and 16 columns/rows are even), so every cell gets an arrow.
    expect(arrows).toHaveLength(320);
    for (const a of arrows) {
      const du = -a.y / 4, dv = a.x / 2, s = Math.hypot(du, dv);
      expect(Math.abs(a.u - du / s)).toBeLessThan(1e-14);
      expect(Math.abs(a.v - dv / s)).toBeLessThan(1e-14);
      expect(Math.abs(a.speed - s)).toBeLessThan(1e-14);
      expect(a.x).toBeGreaterThan(-2);
      expect(a.x).toBeLessThan(2);
    }
  });

  it('leaves out arrows where the rate is zero or not finite and uses the held value of a third state', () => {
    // x' = z·sqrt(x), y' = 0, z' = 0 held at z = 3 (analytic): NaN for x < 0; rate 3√x > 0 for x > 0.
    const sys = makeSystem({
      n: 3,
      rhs: (s, _p, o) => { o[0] = s[2]! * Math.sqrt(s[0]!); o[1] = 0; o[2] = 0; },
      jacobian: (_s, _p, j) => j.fill(0),
    });
    const frame: PlaneFrame = { ix: 0, iy: 1, window: { x: [-1, 1], y: [0, 1] }, held: Float64Array.of(0, 0, 3) };
    const arrows = directionField(sys, nominalParameters(sys), frame, { columns: 4, rows: 2 });
    expect(arrows).toHaveLength(4); // the two right columns only
    for (const a of arrows) {
      expect(a.x).toBeGreaterThan(0);
      expect(a.u).toBe(1);
      expect(Math.abs(a.speed - (3 * Math.sqrt(a.x)) / 2)).toBeLessThan(1e-14);
    }
  });
});
