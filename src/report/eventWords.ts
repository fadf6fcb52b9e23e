import type { Criticality, EventType } from '../types.js';

/**
 * Plain words for special points: the label shown in tables and legends, and what the point means
 * for someone running the plant. Full words only.
 */
export function eventLabel(type: EventType, criticality?: Criticality): EventLabel {
  switch (type) {
    case 'fold':
      return 'fold';
    case 'hopf':
      return `Hopf (${criticality === 'supercritical' || criticality === 'subcritical' ? criticality : 'criticality undecided'})`;
    case 'transcritical':
      return 'transcritical';
    case 'pitchfork':
      return 'pitchfork';
    case 'branch-point':
      return 'branch point';
  }
}

/** Every label `eventLabel` can return, in legend order. */
export const EVENT_LABELS = [
  'fold', 'Hopf (supercritical)', 'Hopf (subcritical)', 'Hopf (criticality undecided)',
  'transcritical', 'pitchfork', 'branch point',
] as const;

export function eventMeaning(type: EventType, criticality?: Criticality): string {
  switch (type) {
    case 'fold':
      return 'the steady state disappears: expect a jump to another state, and hysteresis when the parameter moves back';
    case 'hopf':
      if (criticality === 'supercritical') return 'oscillations start with small amplitude that grows gradually';
      if (criticality === 'subcritical') {
        return 'oscillations start abruptly (dangerous: a jump to large oscillations, which may persist when the parameter moves back)';
      }
      return 'oscillations start; whether gently or abruptly is undecided at this order';
    case 'transcritical':
      return 'two branches of steady states cross and exchange stability';
    case 'pitchfork':
      return 'branches exchange stability; a symmetric pair of steady states appears or disappears';
    case 'branch-point':
      return 'branches of steady states meet here; the state may follow either branch';
  }
}

export type EventLabel = (typeof EVENT_LABELS)[number];
