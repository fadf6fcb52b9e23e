import type { EventLabel } from './eventWords.js';

/**
 * Colours and markers of the diagram, designed for readers with colour-vision deficiencies: hues far
 * apart on the blue–orange axis (which all common forms of colour blindness keep), alternated with
 * differences in lightness, and every special-point type also told apart by its marker shape.
 */
export const BRANCH_COLOURS = ['#2456a4', '#d9730d', '#1f8a83', '#a23b72', '#5c5c5c', '#6aa6d9', '#8c6d1f'] as const;

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
