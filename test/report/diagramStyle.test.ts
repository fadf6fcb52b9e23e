import { describe, expect, it } from 'vitest';
import { BRANCH_COLOURS, POINT_STYLE, STABILITY_DASH } from '../../src/report/diagramStyle.js';
import { EVENT_LABELS } from '../../src/report/eventWords.js';

type Rgb = [number, number, number];
type Matrix = [Rgb, Rgb, Rgb];

/**
 * Simulated dichromacy, severity 1.0, applied to linear RGB: Machado, Oliveira & Fernandes (2009),
 * "A physiologically-based model for simulation of color vision deficiency", IEEE TVCG 15(6),
 * the severity-1.0 matrices of their table (values from memory).
 */
const VISION: Record<string, Matrix> = {
  normal: [[1, 0, 0], [0, 1, 0], [0, 0, 1]],
  protanopia: [[0.152286, 1.052583, -0.204868], [0.114503, 0.786281, 0.099216], [-0.003882, -0.048116, 1.051998]],
  deuteranopia: [[0.367322, 0.860646, -0.227968], [0.280085, 0.672501, 0.047413], [-0.01182, 0.04294, 0.968881]],
  tritanopia: [[1.255528, -0.076749, -0.178779], [-0.078411, 0.930809, 0.147602], [0.004733, 0.691367, 0.3039]],
};

/** sRGB transfer function (IEC 61966-2-1). */
function linear(hex: string): Rgb {
  return [1, 3, 5].map((i) => {
    const c = parseInt(hex.slice(i, i + 2), 16) / 255;
    return c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
  }) as Rgb;
}

/** Linear sRGB → CIELAB (D65 white), the CIE 1976 formulas. */
function lab([r, g, b]: Rgb): Rgb {
  const x = (0.4124 * r + 0.3576 * g + 0.1805 * b) / 0.95047;
  const y = 0.2126 * r + 0.7152 * g + 0.0722 * b;
  const z = (0.0193 * r + 0.1192 * g + 0.9505 * b) / 1.08883;
  const f = (t: number) => (t > 216 / 24389 ? Math.cbrt(t) : (24389 / 27 * t + 16) / 116);
  return [116 * f(y) - 16, 500 * (f(x) - f(y)), 200 * (f(y) - f(z))];
}

function seenAs(hex: string, m: Matrix): Rgb {
  const c = linear(hex);
  const clamp = (v: number) => Math.min(1, Math.max(0, v));
  return lab(m.map((row) => clamp(row[0] * c[0] + row[1] * c[1] + row[2] * c[2])) as Rgb);
}

const deltaE = (a: Rgb, b: Rgb) => Math.hypot(a[0] - b[0], a[1] - b[1], a[2] - b[2]);

describe('diagram style', () => {
  it('keeps every pair of branch colours apart in normal and in simulated dichromatic vision', () => {
    // Common practice: CIE76 ΔE of about 20 or more reads as clearly different colours for thin lines.
    for (const [vision, m] of Object.entries(VISION)) {
      for (let i = 0; i < BRANCH_COLOURS.length; i++) {
        for (let j = i + 1; j < BRANCH_COLOURS.length; j++) {
          const d = deltaE(seenAs(BRANCH_COLOURS[i]!, m), seenAs(BRANCH_COLOURS[j]!, m));
          expect(d, `${vision}: ${BRANCH_COLOURS[i]} vs ${BRANCH_COLOURS[j]}`).toBeGreaterThanOrEqual(20);
        }
      }
    }
  });

  it('draws every branch colour dark enough to show as a thin line on white', () => {
    for (const c of BRANCH_COLOURS) {
      const [l] = lab(linear(c));
      // The L* band 30..70 (dark enough for a thin line on white, light enough to tell hues apart): common practice.
      expect(l, c).toBeGreaterThanOrEqual(30);
      expect(l, c).toBeLessThanOrEqual(70);
    }
    // Sanity of the conversion itself: white is L* = 100 and black L* = 0 (CIE 1976 definition).
    expect(lab(linear('#ffffff'))[0]).toBeCloseTo(100, 3);
    expect(lab(linear('#000000'))[0]).toBe(0);
  });

  it('gives every special-point type its own marker shape and keeps stable lines solid, unstable dashed', () => {
    const shapes = EVENT_LABELS.map((l) => POINT_STYLE[l].shape);
    expect(new Set(shapes).size).toBe(EVENT_LABELS.length);
    expect(STABILITY_DASH.stable[1]).toBe(0);
    expect(STABILITY_DASH.unstable[1]).toBeGreaterThan(0);
  });
});
