import type { EventLabel } from './eventWords.js';

/**
 * Colours and markers of the diagram, for readers with colour-vision deficiencies too. The branch
 * colours were chosen (our own greedy max-min search over a 16-level RGB grid, starting from the blue
 * and the orange) so that every pair stays apart, CIE76 ΔE ≥ 20, in normal vision and under simulated
 * protanopia, deuteranopia and tritanopia (test/report/diagramStyle.test.ts checks this), with
 * lightness 30–70 so that thin lines show on white. Every special-point type is also told apart by
 * its marker shape, and stability by the dash pattern, so no information rests on colour alone.
 */
export const BRANCH_COLOURS = ['#2456a4', '#d9730d', '#774422', '#cc88bb', '#88aa77', '#6699ff', '#992255'] as const;

/** Special points: a marker shape and fill per type (white outline so they stand out on the lines). */
export const POINT_STYLE: Record<EventLabel, { shape: string; fill: string }> = {
  'fold': { shape: 'diamond', fill: '#111111' },
  'Hopf (supercritical)': { shape: 'circle', fill: '#d9730d' },
  'Hopf (subcritical)': { shape: 'triangle-up', fill: '#b8005c' },
  'Hopf (criticality undecided)': { shape: 'triangle-down', fill: '#8a8a8a' },
  'transcritical': { shape: 'square', fill: '#2456a4' },
  'pitchfork': { shape: 'cross', fill: '#1f8a83' },
  'branch point': { shape: 'triangle-right', fill: '#6b3fa0' },
};

/** Stable parts solid, unstable parts dashed (the textbook convention). */
export const STABILITY_DASH = { stable: [1, 0], unstable: [6, 4] } as const;

export const NOMINAL_COLOUR = '#333333';
