/**
 * Complex vectors as pairs of Float64Arrays, and the complex operations the normal-form
 * coefficients need: the inner product ⟨p, q⟩ = p̄ᵀq (Kuznetsov, Elements of Applied Bifurcation
 * Theory, 3rd ed., §3.5), the multilinear forms B and C of a `System` at complex arguments, and
 * linear solves with a complex matrix through the real 2n×2n embedding
 *   (R + iI)(u + iv) = b + ic  ⇔  [[R, −I], [I, R]] [u; v] = [b; c].
 */
import { luFactor, luSolve } from '../linalg/lu.js';
import type { System } from '../types.js';

export interface ComplexVector {
  re: Float64Array;
  im: Float64Array;
}

export interface Complex {
  re: number;
  im: number;
}

export function complexVector(n: number): ComplexVector {
  return { re: new Float64Array(n), im: new Float64Array(n) };
}

export function conjugate(v: ComplexVector): ComplexVector {
  return { re: v.re.slice(), im: v.im.map((t) => -t) };
}

/** ⟨p, q⟩ = Σ conj(p_i) q_i. */
export function innerProduct(p: ComplexVector, q: ComplexVector): Complex {
  let re = 0;
  let im = 0;
  for (let i = 0; i < p.re.length; i++) {
    re += p.re[i]! * q.re[i]! + p.im[i]! * q.im[i]!;
    im += p.re[i]! * q.im[i]! - p.im[i]! * q.re[i]!;
  }
  return { re, im };
}

/** v · c, a new vector. */
export function scaleComplex(v: ComplexVector, c: Complex): ComplexVector {
  const out = complexVector(v.re.length);
  for (let i = 0; i < v.re.length; i++) {
    out.re[i] = v.re[i]! * c.re - v.im[i]! * c.im;
    out.im[i] = v.re[i]! * c.im + v.im[i]! * c.re;
  }
  return out;
}

/** max_i |v_i| (complex modulus). */
export function maxModulus(v: ComplexVector): number {
  let m = 0;
  for (let i = 0; i < v.re.length; i++) m = Math.max(m, Math.hypot(v.re[i]!, v.im[i]!));
  return m;
}

/** B(u, v) at complex arguments, by bilinearity from the real form: 4 real evaluations. */
export function complexSecond(
  system: System, x: Float64Array, params: Float64Array, u: ComplexVector, v: ComplexVector,
): ComplexVector {
  const n = system.n;
  const out = complexVector(n);
  const t = new Float64Array(n);
  const terms: [Float64Array, Float64Array, Float64Array, number][] = [
    [u.re, v.re, out.re, 1], [u.im, v.im, out.re, -1], [u.re, v.im, out.im, 1], [u.im, v.re, out.im, 1],
  ];
  for (const [a, b, into, sign] of terms) {
    system.secondDerivative(x, params, a, b, t);
    for (let i = 0; i < n; i++) into[i]! += sign * t[i]!;
  }
  return out;
}

/** C(u, v, w) at complex arguments, by trilinearity: 8 real evaluations. */
export function complexThird(
  system: System, x: Float64Array, params: Float64Array, u: ComplexVector, v: ComplexVector, w: ComplexVector,
): ComplexVector {
  const n = system.n;
  const out = complexVector(n);
  const t = new Float64Array(n);
  for (let mask = 0; mask < 8; mask++) {
    // Bit k of mask picks the imaginary part of argument k; i^(number of picks) gives sign and slot.
    const picks = (mask & 1) + ((mask >> 1) & 1) + ((mask >> 2) & 1);
    const a = mask & 1 ? u.im : u.re;
    const b = mask & 2 ? v.im : v.re;
    const c = mask & 4 ? w.im : w.re;
    system.thirdDerivative(x, params, a, b, c, t);
    const into = picks % 2 === 0 ? out.re : out.im;
    const sign = picks >= 2 ? -1 : 1;
    for (let i = 0; i < n; i++) into[i]! += sign * t[i]!;
  }
  return out;
}

/** The real 2n×2n embedding [[R, −I], [I, R]] of the complex matrix R + iI (row-major, n×n each). */
export function embedComplex(re: Float64Array, im: Float64Array, n: number): Float64Array {
  const m = 2 * n;
  const e = new Float64Array(m * m);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      const r = re[i * n + j]!;
      const c = im[i * n + j]!;
      e[i * m + j] = r;
      e[i * m + n + j] = -c;
      e[(n + i) * m + j] = c;
      e[(n + i) * m + n + j] = r;
    }
  }
  return e;
}

/** [u; v] ↔ u + iv. */
export function stack(v: ComplexVector): Float64Array {
  const n = v.re.length;
  const s = new Float64Array(2 * n);
  s.set(v.re, 0);
  s.set(v.im, n);
  return s;
}

export function unstack(s: Float64Array): ComplexVector {
  const n = s.length / 2;
  return { re: s.slice(0, n), im: s.slice(n) };
}

/**
 * Solve (R + iI) z = b. Returns null when the LU factorisation meets an exactly zero pivot or the
 * solution is not finite (a singular matrix).
 */
export function solveComplex(re: Float64Array, im: Float64Array, n: number, b: ComplexVector): ComplexVector | null {
  const f = luFactor(embedComplex(re, im, n), 2 * n);
  if (f.singular) return null;
  const z = luSolve(f, stack(b), new Float64Array(2 * n));
  return z.every(Number.isFinite) ? unstack(z) : null;
}
