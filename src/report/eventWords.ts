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

/**
 * `touchesStable`: whether the branch is stable on at least one side of the point. Where it is
 * unstable on both sides, no state the plant can run at is lost or starts to oscillate there.
 */
export function eventMeaning(type: EventType, criticality?: Criticality, touchesStable = true): string {
  switch (type) {
    case 'fold':
      if (!touchesStable) return 'two unstable steady states meet and vanish; no stable operating state is lost here';
      return 'the steady state disappears: expect a jump to another state, and hysteresis when the parameter moves back';
    case 'hopf':
      if (!touchesStable) {
        return 'a further pair of eigenvalues of an already unstable steady state crosses the imaginary axis; ' +
          'no stable state starts to oscillate here';
      }
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

/** What a special point at a corner of the model (an abs, min or max switching) means: the eigenvalues jump there. */
export function cornerMeaning(type: EventType): string {
  const where = 'at a corner of the model (an abs, min or max switches), with no normal form';
  switch (type) {
    case 'fold':
      return `the branch turns back ${where}: the steady state disappears; expect a jump`;
    case 'hopf':
      return `a pair of eigenvalues jumps across the imaginary axis ${where}: oscillations may start, gently or abruptly`;
    default:
      return `an eigenvalue jumps across zero ${where}: the steady state changes stability here`;
  }
}

export type EventLabel = (typeof EVENT_LABELS)[number];
