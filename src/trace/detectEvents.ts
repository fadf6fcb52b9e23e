/**
 * Scans a finished branch for sign changes of the test functions between consecutive points and
 * locates each one (locateOnBranch.ts; branch points by locateBranchPoint.ts). Test functions
 * (Kuznetsov, Elements of Applied Bifurcation Theory, 3rd ed., §10.2; Allgower & Georg 1990, §8.1):
 *   branch point  τ_bp = det [F_z; tᵀ]   (checked first: at a simple branch point t_λ need not vanish,
 *                                         and where a branch turns at one, t_λ changes sign too; a
 *                                         fold in the same bracket is kept when it lies apart from it:
 *                                         foldBesideBranchPoint);
 *   fold          τ_f  = t_λ, the parameter component of the unit tangent (foldBetween: an exact
 *                 zero, as at a start on a fold, counts once);
 *   Hopf          the bialternate-product sign change together with a change in the number of
 *                 unstable complex eigenvalues (hopfBetween, src/detect/hopfTest.ts: a neutral
 *                 saddle flips the sign only), located on the real part of the eigenvalue that
 *                 crosses, followed over the bracket (crossingMatch, then pairRealPart.ts).
 * A bracket across a corner where the branch turned back (corner.ts) is not searched: its fold or
 * Hopf point is the corner itself (atTurnedCorner).
 */
import { IMAG_TOL, TRACE } from '../defaults.js';
import { eigenvalues } from '../linalg/eig.js';
import type { Eigenvalue, EventType } from '../types.js';
import type { ExtendedSystem } from './extendedSystem.js';
import { criticalPair, crossingMatch, hopfBetween, hopfTest, matchComplex } from '../detect/hopfTest.js';
import { normInf } from '../linalg/norm.js';
import { pairRealPart } from './pairRealPart.js';
import { locateBranchPoint } from './locateBranchPoint.js';
import { locateOnBranch, type BranchTest, type Located } from './locateOnBranch.js';
import type { RawPoint } from './rawPoint.js';
import { tangentAt } from './tangentAt.js';
import { nearSegment, type Workspace } from './workspace.js';
import { distance } from '../linalg/vector.js';

/** A zero of t_λ this close to a branch point in the same bracket (fraction of the bracket) is that branch point's own turn. Common practice. */
const SAME_BRACKET_SHARE = 1e-3;

export interface FoundEvent {
  type: Extract<EventType, 'fold' | 'hopf' | 'branch-point'>;
  between: [number, number];
  testBefore: number;
  testAfter: number;
  located: Located;
  eigenvalues: Eigenvalue[];
}

export interface DetectOptions {
  absTol: number;
  maxIter: number;
  /** Absolute arclength tolerance of the locator at parameter value λ. */
  tol: (lambda: number) => number;
  rootMaxIter: number;
  /** Brackets not to locate in (e.g. around a branch point already found from another branch). */
  skip?: (type: FoundEvent['type'], a: RawPoint, b: RawPoint) => boolean;
  /** The ends of the parameter range: a branch end exactly on one may sit on a Hopf point. */
  bounds?: readonly [number, number];
}

export function detectEvents(
  ext: ExtendedSystem, work: Workspace, points: readonly RawPoint[], opts: DetectOptions,
): { events: FoundEvent[]; failures: { type: EventType; between: [number, number]; status: string }[] } {
  const { n } = ext;
  const events: FoundEvent[] = [];
  const failures: { type: EventType; between: [number, number]; status: string }[] = [];
  const record = (
    type: FoundEvent['type'], i: number, test: BranchTest, gA: number, gB: number,
  ): void => {
    const a = points[i]!;
    const b = points[i + 1]!;
    if (opts.skip?.(type, a, b) === true) return;
    const locate = type === 'branch-point' ? locateBranchPoint : locateOnBranch;
    const located = locate(ext, work, a, b, test, gA, gB, { ...opts, tol: opts.tol(a.z[n]!) });
    if (located.status !== 'converged' && located.status !== 'max-iter') {
      failures.push({ type, between: [i, i + 1], status: located.status });
      return;
    }
    events.push({ type, between: [i, i + 1], testBefore: gA, testAfter: gB, located, eigenvalues: eigenvalues(ext.jx, n) });
  };
  const foldTest: BranchTest = (_z, t, tangent) => (tangent.ok ? t[n]! : NaN);
  /**
   * t_λ changes sign in a bracket that holds a branch point too. Where the branch turns at the branch
   * point itself (a pitchfork seen from its new branch), the zero of t_λ is that point; otherwise a
   * fold shares the step with it, and is located and kept when it lies apart from the branch point
   * (more than SAME_BRACKET_SHARE of the bracket). Failing to locate it here says nothing new: the
   * bracket next to a branch point is ill-conditioned, and the branch point is reported anyway.
   */
  const foldBesideBranchPoint = (i: number, branchPoint: FoundEvent): void => {
    const a = points[i]!;
    const b = points[i + 1]!;
    if (opts.skip?.('fold', a, b) === true) return;
    const located = locateOnBranch(ext, work, a, b, foldTest, a.t[n]!, b.t[n]!, { ...opts, tol: opts.tol(a.z[n]!) });
    if (located.status !== 'converged' && located.status !== 'max-iter') return;
    if (distance(located.z, branchPoint.located.z) <= SAME_BRACKET_SHARE * distance(a.z, b.z)) return;
    events.push({
      type: 'fold', between: [i, i + 1], testBefore: a.t[n]!, testAfter: b.t[n]!, located, eigenvalues: eigenvalues(ext.jx, n),
    });
  };
  /**
   * Re of the crossing eigenvalue between points a and b, followed from its value ends[0] at a to
   * ends[1] at b: the eigenvalue nearest the straight path between them, at z's share of the chord.
   */
  const followed = (a: RawPoint, b: RawPoint, ends: readonly [Eigenvalue, Eigenvalue]): BranchTest => {
    const [v, w] = ends;
    const chord = distance(a.z, b.z);
    return (z, _t, tangent) => {
      if (!(tangent.ok || tangent.singular)) return NaN;
      const share = chord > 0 ? Math.min(1, distance(z, a.z) / chord) : 0;
      return pairRealPart(eigenvalues(ext.jx, n), { re: v.re + share * (w.re - v.re), im: v.im + share * (w.im - v.im) });
    };
  };
  /**
   * A bracket across a corner where the branch turned back (corner.ts: pastCorner): the test
   * functions jump there rather than pass through zero, so nothing is located; the corner itself is
   * the special point: a fold where t_λ changes sign, a Hopf point where a pair jumps across the
   * imaginary axis.
   */
  const atTurnedCorner = (i: number, c: Float64Array): void => {
    const a = points[i]!;
    const b = points[i + 1]!;
    const imagTol = IMAG_TOL * (1 + Math.max(size(a.eigenvalues), size(b.eigenvalues)));
    const types: FoundEvent['type'][] = [];
    if (a.t[n]! * b.t[n]! < 0) types.push('fold');
    if (hopfBetween(a.eigenvalues, b.eigenvalues, imagTol)) types.push('hopf');
    for (const type of types) {
      if (opts.skip?.(type, a, b) === true) continue;
      const f = new Float64Array(n);
      const t = new Float64Array(ext.m);
      // At a right-angled corner the old tangent can be orthogonal to the one-sided one: keep it then.
      const tangent = ext.residual(c, f) ? tangentAt(ext, c, a.t, t, work) : null;
      if (tangent === null || (!tangent.ok && !tangent.singular)) {
        failures.push({ type, between: [i, i + 1], status: 'non-finite' });
        continue;
      }
      if (!tangent.ok) t.set(a.t);
      const located: Located = {
        status: 'converged', z: c.slice(), t, tangent, residual: normInf(f), s: distance(c, a.z), iterations: 0, g: 0,
      };
      const pair = crossingMatch(a.eigenvalues, b.eigenvalues, imagTol);
      const test = type === 'fold' ? [a.t[n]!, b.t[n]!] : pair !== null ? [pair[0].re, pair[1].re] : [hopfTest(a.eigenvalues), hopfTest(b.eigenvalues)];
      events.push({ type, between: [i, i + 1], testBefore: test[0]!, testAfter: test[1]!, located, eigenvalues: eigenvalues(ext.jx, n) });
    }
  };
  for (let i = 0; i + 1 < points.length; i++) {
    const a = points[i]!;
    const b = points[i + 1]!;
    const corner = [a.corner, b.corner].find((c) => c !== undefined && nearSegment(c, a.z, b.z));
    if (corner !== undefined) {
      atTurnedCorner(i, corner);
      continue;
    }
    if (a.detSign * b.detSign < 0) {
      const ref = Math.max(a.detLog, b.detLog);
      const bp: BranchTest = (_z, _t, tangent) =>
        tangent.singular ? 0 : tangent.ok ? tangent.detSign * Math.exp(tangent.detLog - ref) : NaN;
      const before = events.length;
      record('branch-point', i, bp, a.detSign * Math.exp(a.detLog - ref), b.detSign * Math.exp(b.detLog - ref));
      const branchPoint = events.length > before ? events.at(-1)! : undefined;
      if (branchPoint !== undefined && foldBetween(points, i, n)) foldBesideBranchPoint(i, branchPoint);
    } else if (foldBetween(points, i, n)) {
      record('fold', i, foldTest, a.t[n]!, b.t[n]!);
    }
    const imagTol = IMAG_TOL * (1 + Math.max(size(a.eigenvalues), size(b.eigenvalues)));
    if (hopfBetween(a.eigenvalues, b.eigenvalues, imagTol)) {
      const ends = crossingMatch(a.eigenvalues, b.eigenvalues, imagTol) ?? onAxis(criticalPair(a.eigenvalues, imagTol) ?? criticalPair(b.eigenvalues, imagTol));
      if (ends === null) continue;
      const gA = pairRealPart(a.eigenvalues, ends[0]);
      const gB = pairRealPart(b.eigenvalues, ends[1]);
      if (!(gA * gB < 0)) continue;
      record('hopf', i, followed(a, b, ends), gA, gB);
    }
  }
  // A Hopf point exactly on an end of the range (a range chosen to end at it): there the crossing
  // pair's real part is zero to rounding, so its sign says nothing. Counted when the branch end lies
  // on a bound, a pair there has |Re| within the stability threshold (src/trace/stabilityOf.ts), and
  // the same pair at the neighbouring point is off the axis; the root is then that end itself.
  if (points.length >= 2) {
    for (const [end, next] of [[0, 1], [points.length - 1, points.length - 2]] as const) {
      const q = points[end]!;
      if (!(opts.bounds?.includes(q.z[n]!) ?? false)) continue;
      const pair = pairOnAxis(q.eigenvalues, points[next]!.eigenvalues);
      if (pair === null) continue;
      const [atEnd, beside] = pair;
      if (end === 0) record('hopf', 0, followed(q, points[next]!, [atEnd, beside]), 0, beside.re);
      else record('hopf', next, followed(points[next]!, q, [beside, atEnd]), beside.re, 0);
    }
  }
  return { events, failures };
}

/**
 * A complex eigenvalue with |Re| within the stability threshold at `at` and its match at `beside`
 * (matchComplex) when that has |Re| above it (so the pair leaves the axis along the branch), or null.
 */
function pairOnAxis(at: readonly Eigenvalue[], beside: readonly Eigenvalue[]): [Eigenvalue, Eigenvalue] | null {
  const scale = Math.max(1, size(at));
  const threshold = TRACE.stabilityTol * scale;
  for (const [v, match] of matchComplex(at, beside, IMAG_TOL * (1 + scale))) {
    if (Math.abs(v.re) <= threshold && Math.abs(match.re) > TRACE.stabilityTol * Math.max(1, size(beside))) return [v, match];
  }
  return null;
}

/** The point iω on the axis, twice, for the eigenvalue c (iω with ω = Im c); null without one. */
function onAxis(c: Eigenvalue | null): [Eigenvalue, Eigenvalue] | null {
  if (c === null) return null;
  const axis = { re: 0, im: c.im };
  return [axis, axis];
}

/**
 * t_λ changes sign between points i and i + 1. An exact zero counts once: at the first point of
 * the branch (a start at a fold), or at the later point of the bracket, except for the repeated
 * first point that closes a loop.
 */
function foldBetween(points: readonly RawPoint[], i: number, n: number): boolean {
  const a = points[i]!.t[n]!;
  const b = points[i + 1]!.t[n]!;
  if (a * b < 0) return true;
  if (a === 0) return i === 0 && b !== 0;
  if (b !== 0) return false;
  const last = points.length - 1;
  const closes = i + 1 === last && points[last]!.z.every((v, j) => v === points[0]!.z[j]);
  return !closes;
}

/** Largest eigenvalue modulus. */
function size(values: readonly Eigenvalue[]): number {
  let r = 0;
  for (const v of values) r = Math.max(r, Math.hypot(v.re, v.im));
  return r;
}
