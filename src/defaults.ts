/**
 * Every default tolerance and limit in one place. `report.json` records the resolved values.
 * Values marked "common practice" have no single source; they are the usual choices in the
 * continuation literature for problems scaled to order one.
 */

/** Newton's method at fixed parameters (equilibria). Common practice. */
export const NEWTON = {
  absTol: 1e-10,
  maxIter: 50,
} as const;

/** Many-start search with deflation (Farrell, Birkisson & Funke 2015). Common practice. */
export const EQUILIBRIA = {
  /** Number of start points spread over the box, besides the start guesses. */
  starts: 64,
  /** Deflation power p and shift alpha in M(x) = (1/‖x − x*‖^p + alpha). */
  deflationPower: 2,
  deflationShift: 1,
  /** Relative half-width of the default box around each start guess (and at least this absolute). */
  boxRelative: 10,
  boxAbsolute: 10,
  /** Two roots closer than this (relative infinity norm) are the same equilibrium. */
  duplicateTol: 1e-6,
} as const;

/** Pseudo-arclength continuation. Common practice; steps are fractions of the sweep range. */
export const TRACE = {
  /** Initial, smallest and largest step as fractions of |to − from|. */
  dsFraction: 0.01,
  dsMinFraction: 1e-8,
  dsMaxFraction: 0.05,
  maxPoints: 2000,
  absTol: 1e-10,
  maxIter: 8,
  maxBranches: 32,
} as const;

/** Design margin thresholds (relative to the nominal value). Common practice. */
export const MARGIN = {
  warn: 0.1,
  fail: 0,
} as const;
