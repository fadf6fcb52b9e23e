/**
 * All equilibria f(x, p) = 0 at fixed parameters that a many-start Newton search with deflation
 * finds in a box (Farrell, Birkisson & Funke 2015; see deflation.ts).
 *
 *  1. Starts: the guess (default: the model's start values) first, then EQUILIBRIA.starts points
 *     of a shifted Halton sequence over the box (default: around the guess, see boxAround), then a
 *     quarter as many over the guess's own scale (guessScaleBox) where that is narrower.
 *  2. From each start, Newton on the deflated residual G = M·F; when it converges, the root is
 *     polished by plain Newton on F (so reported residuals are ‖F‖∞, not ‖G‖∞), deflated, and the
 *     same start is tried again (at most EQUILIBRIA.solvesPerStart times).
 *  3. A polished root is kept when Newton on F converged (newton.ts stopping rule, at least one
 *     step), it is not a duplicate (|a_i − b_i| ≤ duplicateTol·max(|a_i|, |b_i|, σ_i) for every
 *     state i) and it lies in the box widened by boxTolerance of its width on each side. Roots
 *     outside are still deflated, never reported.
 *  4. Each kept root is classified from its Jacobian (a non-finite Jacobian drops the root).
 * Typical sizes σ_i (deflation distances, duplicates and ties are measured in them): the largest
 * |x_i| over the guess and the roots found so far, or 1 where all of these are 0. A model whose
 * states are all of size 1e-3 is then searched just as one of size 1 (the box aside).
 * Total Newton iterations are capped by EQUILIBRIA.iterationBudget; the diagnostics say whether
 * the cap was reached. Non-finite values at a start end that start's solve ('non-finite' status).
 * Result order: lexicographic in the states (first state, then second, …; coordinates equal within
 * duplicateTol·σ_i tie).
 */
import { EQUILIBRIA, NEWTON } from '../defaults.js';
import { allFinite, largestMagnitudes } from '../linalg/norm.js';
import { newton, type VectorFunction } from '../solve/newton.js';
import type { Equilibrium, SolveStatus, System } from '../types.js';
import { classifyEquilibrium } from './classify.js';
import { deflate } from './deflation.js';
import { boxAround, clipBox, startPoints, stateBounds, type Box } from './startPoints.js';

export interface FindEquilibriaOptions {
  box?: Box;
  starts?: number;
  /** Selects the start-point stream: the same value always gives the same starts (default 1). */
  stream?: number;
  guess?: Float64Array;
  /**
   * Report roots found outside the box too (the box then only places the start points). For a
   * default box, whose size is a guess: Newton often lands on real equilibria beyond it.
   */
  keepOutsideBox?: boolean;
}

export interface EquilibriumSearchDiagnostics {
  box: Box;
  /** Start points used (guess included) out of those planned. */
  startsUsed: number;
  startsPlanned: number;
  /** Deflated Newton solves and their outcomes. */
  solves: number;
  outcomes: Record<SolveStatus, number>;
  /** Polishing by plain Newton that did not converge. */
  polishFailed: number;
  duplicates: number;
  outsideBox: number;
  /** Roots beyond the bounds the model gives its states (dropped). */
  outsideBounds: number;
  nonFiniteJacobian: number;
  /** Newton iterations used over the whole search, and the cap. */
  iterations: number;
  iterationBudget: number;
  budgetExhausted: boolean;
}

export interface EquilibriumSearch {
  equilibria: Equilibrium[];
  diagnostics: EquilibriumSearchDiagnostics;
}

interface Root {
  state: Float64Array;
  residual: number;
  iterations: number;
}

function sameRoot(a: Float64Array, b: Float64Array, sizes: Float64Array): boolean {
  for (let i = 0; i < a.length; i++) {
    if (Math.abs(a[i]! - b[i]!) > EQUILIBRIA.duplicateTol * Math.max(Math.abs(a[i]!), Math.abs(b[i]!), sizes[i]!)) return false;
  }
  return true;
}

/** σ_i: the largest |x_i| over the given states, or 1 where they are all 0. */
function typicalSizes(states: readonly Float64Array[], n: number): Float64Array {
  return largestMagnitudes(states, n).map((v) => (v > 0 ? v : 1));
}

function insideBox(x: Float64Array, box: Box): boolean {
  for (let i = 0; i < x.length; i++) {
    const slack = EQUILIBRIA.boxTolerance * (box.hi[i]! - box.lo[i]!);
    if (!(x[i]! >= box.lo[i]! - slack && x[i]! <= box.hi[i]! + slack)) return false;
  }
  return true;
}

/** Inside the model's bounds, or beyond them by no more than rounding (1e-9 of the state's typical size). */
function withinBounds(x: Float64Array, bounds: Box, sizes: Float64Array): boolean {
  for (let i = 0; i < x.length; i++) {
    const slack = 1e-9 * sizes[i]!;
    if (!(x[i]! >= bounds.lo[i]! - slack && x[i]! <= bounds.hi[i]! + slack)) return false;
  }
  return true;
}

/** First state, then second, …; coordinates equal within duplicateTol·σ_i count as ties. */
function lexicographic(sizes: Float64Array): (a: Equilibrium, b: Equilibrium) => number {
  return (a, b) => {
    for (let i = 0; i < a.state.length; i++) {
      const x = a.state[i]!;
      const y = b.state[i]!;
      if (Math.abs(x - y) > EQUILIBRIA.duplicateTol * Math.max(sizes[i]!, Math.abs(x), Math.abs(y))) return x - y;
    }
    return 0;
  };
}

/**
 * The box at the scale of the guess: ±boxRelative·|g_i| around each nonzero guess value g_i that
 * gives a narrower interval than the box (clipped to it), the box's own interval elsewhere; null
 * when no state is narrower. A guess of 1e-3 (a concentration in mol/L, say) in the default box of
 * ±10 says the roots are of that size too, and starts spread over ±10 rarely land near them.
 */
function guessScaleBox(guess: Float64Array, box: Box): Box | null {
  const lo = box.lo.slice();
  const hi = box.hi.slice();
  let narrower = false;
  for (let i = 0; i < guess.length; i++) {
    const h = EQUILIBRIA.boxRelative * Math.abs(guess[i]!);
    if (!(h > 0) || 2 * h >= box.hi[i]! - box.lo[i]!) continue;
    lo[i] = Math.max(box.lo[i]!, guess[i]! - h);
    hi[i] = Math.min(box.hi[i]!, guess[i]! + h);
    narrower = true;
  }
  return narrower ? { lo, hi } : null;
}

export function findEquilibria(system: System, p: Float64Array, opts: FindEquilibriaOptions = {}): EquilibriumSearch {
  const n = system.n;
  const guess = opts.guess ?? Float64Array.from(system.info.states.map((s) => s.start));
  // Start points only where the model allows states to be (its min and max), and no root beyond them.
  const bounds = stateBounds(system.info.states);
  const box = clipBox(opts.box ?? boxAround(guess, EQUILIBRIA.boxRelative, EQUILIBRIA.boxAbsolute), bounds);
  const count = opts.starts ?? EQUILIBRIA.starts;
  const inner = guessScaleBox(guess, box);
  const starts = [
    guess,
    ...startPoints(box, count, opts.stream ?? 1),
    ...(inner === null ? [] : startPoints(inner, Math.ceil(count / 4), opts.stream ?? 1)),
  ];
  const F: VectorFunction = (x, out) => system.rhs(x, p, out);
  const J: VectorFunction = (x, out) => system.jacobian(x, p, out);
  const settings = { power: EQUILIBRIA.deflationPower, shift: EQUILIBRIA.deflationShift };
  const d: EquilibriumSearchDiagnostics = {
    box, startsUsed: 0, startsPlanned: starts.length, solves: 0,
    outcomes: { converged: 0, 'max-iter': 0, singular: 0, 'non-finite': 0, stalled: 0 },
    polishFailed: 0, duplicates: 0, outsideBox: 0, outsideBounds: 0, nonFiniteJacobian: 0,
    iterations: 0, iterationBudget: EQUILIBRIA.iterationBudget, budgetExhausted: false,
  };
  const deflated: Float64Array[] = [];
  const kept: Root[] = [];
  const solve = (f: VectorFunction, j: VectorFunction, x0: Float64Array, minSteps = 0) => {
    const r = newton(f, j, x0, { absTol: NEWTON.absTol, maxIter: Math.min(NEWTON.maxIter, d.iterationBudget - d.iterations), minSteps });
    d.iterations += r.iterations;
    return r;
  };
  search: for (const start of starts) {
    d.startsUsed += 1;
    for (let s = 0; s < EQUILIBRIA.solvesPerStart; s++) {
      if (d.iterations >= d.iterationBudget) {
        d.budgetExhausted = true;
        break search;
      }
      const sizes = typicalSizes([guess, ...deflated], n);
      const { G, JG } = deflate(F, J, deflated, settings, sizes);
      const r = solve(G, JG, start);
      d.solves += 1;
      d.outcomes[r.status] += 1;
      if (r.status !== 'converged') break;
      const polished = solve(F, J, r.x, 1);
      if (polished.status !== 'converged') {
        d.polishFailed += 1;
        break;
      }
      if (deflated.some((x) => sameRoot(x, polished.x, sizes))) {
        d.duplicates += 1;
        break;
      }
      deflated.push(polished.x);
      if (!withinBounds(polished.x, bounds, sizes)) {
        d.outsideBounds += 1;
        continue;
      }
      if (!insideBox(polished.x, box)) {
        d.outsideBox += 1;
        if (opts.keepOutsideBox !== true) continue;
      }
      kept.push({ state: polished.x, residual: polished.residual, iterations: r.iterations + polished.iterations });
    }
  }
  const equilibria: Equilibrium[] = [];
  const jac = new Float64Array(n * n);
  for (const root of kept) {
    J(root.state, jac);
    if (!allFinite(jac)) {
      d.nonFiniteJacobian += 1;
      continue;
    }
    equilibria.push(classifyEquilibrium(jac.slice(), n, root.state, root.residual, root.iterations));
  }
  equilibria.sort(lexicographic(typicalSizes([guess, ...deflated], n)));
  return { equilibria, diagnostics: d };
}
