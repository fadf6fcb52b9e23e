/**
 * Default sizes, tolerances and limits of a phase portrait. Common practice: values chosen for
 * readable plots of problems scaled to order one in window units; none has a single source.
 */
import type { CurveLimits } from './followCurve.js';

export const PORTRAIT = {
  /** Halton start points for sample trajectories (each followed forward and backward). */
  starts: 24,
  /** Manifold start offset, as a fraction of the smaller window side. */
  manifoldOffset: 1e-3,
  /** Trajectory time limit, in units of the time to cross the window at the median arrow speed. */
  windowCrossings: 40,
} as const;

/** Curve limits except maxTime, which `buildPortrait` derives from the arrows' speeds. */
export const CURVE_LIMITS: Omit<CurveLimits, 'maxTime'> = {
  maxSteps: 5000,
  relTol: 1e-8,
  absTolFraction: 1e-10,
  margin: 0.1,
  nearRadius: 0.01,
  maxLength: 8,
  maxChord: 0.01,
};
