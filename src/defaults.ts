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
  /** Roots outside the box by more than this fraction of its width are dropped. */
  boxTolerance: 0.01,
  /** Cap on Newton iterations over the whole search (deflated solves and polishing together). */
  iterationBudget: 4000,
  /** Start points for the further searches of a sweep at the nominal value and the end of the range. */
  extraStarts: 16,
  /**
   * Parameter values inside a sweep's range where equilibria are searched for too (one per equal part: searchValues), so
   * that a branch reaching neither end of the range (an isola) is found: this many for models of up
   * to `probeStates` states, `probesLarge` above (a search there costs about n³ per Newton step).
   * Common practice: an isola narrower than the spacing can still be missed (--probes).
   */
  probes: 7,
  probeStates: 20,
  probesLarge: 3,
  /** Start points of a search at a probe: fewer than at the ends, as the probes are many. */
  probeStarts: 8,
  /** Deflated solves from one start point (each found root is deflated and the start reused). */
  solvesPerStart: 4,
} as const;

/** Pseudo-arclength continuation. Common practice; steps are fractions of the sweep range. */
export const TRACE = {
  /** Initial, smallest and largest step as fractions of |to − from|. */
  dsFraction: 0.01,
  dsMinFraction: 1e-8,
  dsMaxFraction: 0.02,
  maxPoints: 2000,
  absTol: 1e-10,
  maxIter: 8,
  maxBranches: 32,
  /** Largest angle between successive unit tangents (scaled coordinates) before the step is halved. */
  maxTurnDegrees: 12,
  /** Step growth after an easy correction (at most `easyIterations` Newton steps), and shrink on failure. */
  growFactor: 1.4,
  shrinkFactor: 0.5,
  easyIterations: 3,
  /** Locating special points: absolute arclength tolerance relative to max(|λ|, 1e-3·|to − from|). */
  locateRelTol: 1e-11,
  locateMaxIter: 60,
  /** Branch points: the bracket is narrowed on the branch to this fraction of its arclength, then
   *  Newton on the augmented branch-point system (at most branchPointMaxIter steps) finishes. */
  branchPointStartTol: 1e-6,
  branchPointMaxIter: 12,
  /** A start that is a branch point moves this fraction of the range toward `to`. */
  startNudge: 1e-6,
  /** In the scaled arclength, a state's typical size counts for at least this fraction of |to − from|
   *  (and at most all of it): src/trace/stateWeights.ts. */
  smallestStateShare: 0.1,
  /** A turn larger than maxTurnDegrees over a step of at most this fraction of |to − from| is taken
   *  as a corner of the model when [f_x f_λ] jumps there (src/trace/corner.ts). */
  cornerStep: 1e-6,
  /**
   * A branch running off to infinity (x = 1/λ near λ = 0): where a scaled state exceeds farFrom·|to − from|
   * (beyond every typical size, stateWeights.ts), the largest step grows to farStepShare of the excess,
   * so the walk moves in proportion to the size it has reached; beyond unboundedFactor·|to − from|
   * (a state a hundred times its largest value at the equilibria found) the branch stops as unbounded.
   */
  farFrom: 2,
  farStepShare: 0.25,
  unboundedFactor: 100,
  /** Offset of a switched branch's first point from the branch point, as a fraction of ds. */
  switchOffset: 0.3,
  /** Eigenvalues with real part below this (relative to max(1, |largest eigenvalue|)) count as stable. */
  stabilityTol: 1e-10,
  /** A start within this fraction of the local step of a traced branch, moving along it (|cos| above
   *  sameDirection), lies on that branch and is not traced again. */
  onBranch: 0.02,
  sameDirection: 0.98,
  /** Two located special points of one kind closer than this (relative to max(|to − from|, ‖z‖∞)) are one. */
  samePoint: 1e-5,
  /** At a branch point, a branch whose |t_λ| is below this fraction of the other branch's turns
   *  there (pitchfork; the state of a located point on a turning branch is accurate only to about
   *  the square root of the parameter tolerance, so its t_λ is small but not zero). */
  turningTol: 1e-3,
} as const;

/** Design margin thresholds (relative to the nominal value). Common practice. */
export const MARGIN = {
  warn: 0.1,
  fail: 0,
} as const;

/**
 * Eigenvalues: |Im λ| at most this, relative to 1 + the largest |λ|, counts as real (and above it as
 * one of a complex pair). Used by detection, the normal-form coefficients and the report's pairing.
 * Common practice.
 */
export const IMAG_TOL = 1e-8;

/** Normal-form coefficients: 'degenerate' when |l1| is at most this fraction of its terms. Common practice. */
export const DEGENERATE_TOL = 1e-8;
