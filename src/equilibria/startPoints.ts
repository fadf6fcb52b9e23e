/**
 * Deterministic start points over a box: the Halton sequence (Halton 1960, Numer. Math. 2:84–90;
 * radical inverse of the index in the d-th prime base) with a pseudo-random shift per coordinate
 * (Cranley & Patterson 1976, SIAM J. Numer. Anal. 13(6):904–914), which breaks the diagonal
 * alignment the plain sequence shows in high dimensions. The same stream number always gives the same points.
 */
import { radicalInverse } from '../linalg/radicalInverse.js';

export interface Box {
  lo: Float64Array;
  hi: Float64Array;
}

/** The first n primes. */
function primes(n: number): number[] {
  const out: number[] = [];
  for (let c = 2; out.length < n; c++) if (out.every((p) => c % p !== 0)) out.push(c);
  return out;
}

/** Deterministic uniform generator on [0, 1) (mulberry32, a 32-bit mixing generator; common practice). */
function uniformGenerator(stream: number): () => number {
  let s = stream >>> 0;
  return () => {
    s = (s + 0x6d2b79f5) >>> 0;
    let t = s;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** `count` points spread over the box. */
export function startPoints(box: Box, count: number, stream: number): Float64Array[] {
  const n = box.lo.length;
  const bases = primes(n);
  const next = uniformGenerator(stream);
  const shift = Array.from({ length: n }, () => next());
  const out: Float64Array[] = [];
  for (let k = 1; k <= count; k++) {
    const x = new Float64Array(n);
    for (let d = 0; d < n; d++) {
      const u = (radicalInverse(k, bases[d]!) + shift[d]!) % 1;
      x[d] = box.lo[d]! + u * (box.hi[d]! - box.lo[d]!);
    }
    out.push(x);
  }
  return out;
}

/** Half-width max(relative·|s|, absolute) around each start value s. */
export function boxAround(start: Float64Array, relative: number, absolute: number): Box {
  const lo = new Float64Array(start.length);
  const hi = new Float64Array(start.length);
  for (let i = 0; i < start.length; i++) {
    const h = Math.max(relative * Math.abs(start[i]!), absolute);
    lo[i] = start[i]! - h;
    hi[i] = start[i]! + h;
  }
  return { lo, hi };
}

/** The bounds the model gives its states (min, max), ±Infinity where it gives none. */
export function stateBounds(states: readonly { min?: number; max?: number }[]): Box {
  return {
    lo: Float64Array.from(states, (q) => q.min ?? -Infinity),
    hi: Float64Array.from(states, (q) => q.max ?? Infinity),
  };
}

/** The box cut down to the bounds (an interval wholly outside them shrinks to the nearer bound). */
export function clipBox(box: Box, bounds: Box): Box {
  const clip = (v: number, i: number) => Math.min(Math.max(v, bounds.lo[i]!), bounds.hi[i]!);
  return { lo: box.lo.map(clip), hi: box.hi.map(clip) };
}
