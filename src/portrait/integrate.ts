/**
 * Adaptive explicit Runge–Kutta integration with the Dormand & Prince 5(4) pair "RK5(4)7M"
 * (J. R. Dormand & P. J. Prince, "A family of embedded Runge–Kutta formulae", J. Comput. Appl.
 * Math. 6 (1980) 19–26, Table 2; also Hairer, Nørsett & Wanner, "Solving Ordinary Differential
 * Equations I", 2nd ed., §II.5, Table 5.2). The fifth-order solution is propagated (local
 * extrapolation) and the last stage is the first stage of the next step (FSAL).
 *
 * Step control (Hairer, Nørsett & Wanner §II.4, eqs. 4.10–4.13):
 *   sc_i = absTol + relTol · max(|y0_i|, |y1_i|),   err = sqrt( (1/n) Σ ((y1_i − ŷ1_i) / sc_i)² ),
 *   accept when err ≤ 1,   h_new = h · min(facMax, max(facMin, 0.9 · err^(−1/5))),
 * with facMax = 1 right after a rejection. The first step comes from the same book's starting
 * step algorithm (§II.4, "Starting Step Size").
 *
 * Integration runs backward in time when t1 < t0. Every accepted step is recorded. Outcomes are
 * statuses, never exceptions: 'done', 'max-steps', 'stopped' (stopWhen returned true),
 * 'non-finite' (f returned NaN/Infinity; the output ends at the last finite point), and
 * 'step too small' (|h| fell below 16 machine epsilons of |t|).
 */

export type OdeFunction = (t: number, y: Float64Array, dy: Float64Array) => void;

export interface IntegrateOptions {
  relTol: number;
  absTol: number;
  /** Accepted plus rejected steps allowed. */
  maxSteps: number;
  /** Largest |h| (default |t1 − t0|). */
  hMax?: number;
  /** Called after every accepted step; returning true ends the integration with 'stopped'. */
  stopWhen?: (y: Float64Array, t: number) => boolean;
}

export type IntegrateStatus = 'done' | 'max-steps' | 'stopped' | 'non-finite' | 'step too small';

export interface IntegrateResult {
  t: number[];
  y: Float64Array[];
  status: IntegrateStatus;
  /** Accepted steps. */
  steps: number;
  rejected: number;
  /** Right-hand-side evaluations. */
  evaluations: number;
}

// Dormand & Prince (1980), Table 2: nodes c, coefficients a, fifth-order weights b (= row 7 of a),
// and e = b − b̂, the difference to the embedded fourth-order weights.
const C2 = 1 / 5, C3 = 3 / 10, C4 = 4 / 5, C5 = 8 / 9;
const A21 = 1 / 5;
const A31 = 3 / 40, A32 = 9 / 40;
const A41 = 44 / 45, A42 = -56 / 15, A43 = 32 / 9;
const A51 = 19372 / 6561, A52 = -25360 / 2187, A53 = 64448 / 6561, A54 = -212 / 729;
const A61 = 9017 / 3168, A62 = -355 / 33, A63 = 46732 / 5247, A64 = 49 / 176, A65 = -5103 / 18656;
const B1 = 35 / 384, B3 = 500 / 1113, B4 = 125 / 192, B5 = -2187 / 6784, B6 = 11 / 84;
const E1 = 71 / 57600, E3 = -71 / 16695, E4 = 71 / 1920, E5 = -17253 / 339200, E6 = 22 / 525, E7 = -1 / 40;

/** Step-size factor limits and safety factor. Common practice (Hairer, Nørsett & Wanner §II.4). */
const SAFETY = 0.9;
const FAC_MIN = 0.2;
const FAC_MAX = 5;

function isFiniteVector(v: Float64Array): boolean {
  for (let i = 0; i < v.length; i++) if (!Number.isFinite(v[i]!)) return false;
  return true;
}

/** Weighted RMS norm of v with scale absTol + relTol·max(|a_i|, |b_i|). */
function scaledNorm(v: Float64Array, a: Float64Array, b: Float64Array, absTol: number, relTol: number): number {
  let s = 0;
  for (let i = 0; i < v.length; i++) {
    const sc = absTol + relTol * Math.max(Math.abs(a[i]!), Math.abs(b[i]!));
    const r = v[i]! / sc;
    s += r * r;
  }
  return Math.sqrt(s / Math.max(1, v.length));
}

/** Starting step size (Hairer, Nørsett & Wanner §II.4), with order 5; f0 = f(t0, y0). Signed. */
function startingStep(f: OdeFunction, t0: number, y0: Float64Array, f0: Float64Array, dir: number,
  hMax: number, absTol: number, relTol: number): number {
  const d0 = scaledNorm(y0, y0, y0, absTol, relTol);
  const d1 = scaledNorm(f0, y0, y0, absTol, relTol);
  let h0 = d0 < 1e-5 || d1 < 1e-5 ? 1e-6 : 0.01 * (d0 / d1);
  h0 = Math.min(h0, hMax);
  const y1 = new Float64Array(y0.length);
  for (let i = 0; i < y0.length; i++) y1[i] = y0[i]! + dir * h0 * f0[i]!;
  const f1 = new Float64Array(y0.length);
  f(t0 + dir * h0, y1, f1);
  for (let i = 0; i < y0.length; i++) f1[i] = f1[i]! - f0[i]!;
  const d2 = scaledNorm(f1, y0, y0, absTol, relTol) / h0;
  const dMax = Math.max(d1, d2);
  const h1 = Number.isFinite(dMax) && dMax > 1e-15 ? Math.pow(0.01 / dMax, 1 / 5) : Math.max(1e-6, h0 * 1e-3);
  return dir * Math.min(100 * h0, h1, hMax);
}

/** Integrate dy/dt = f(t, y) from t0 to t1 (either direction), starting at y0 (not modified). */
export function integrate(f: OdeFunction, y0: Float64Array, t0: number, t1: number, opts: IntegrateOptions): IntegrateResult {
  const n = y0.length;
  const dir = t1 >= t0 ? 1 : -1;
  const span = Math.abs(t1 - t0);
  const hMax = Math.min(opts.hMax ?? span, span);
  const { absTol, relTol } = opts;
  const out: IntegrateResult = { t: [t0], y: [y0.slice()], status: 'done', steps: 0, rejected: 0, evaluations: 0 };
  if (span === 0) return out;
  const call = (t: number, y: Float64Array, dy: Float64Array): void => {
    out.evaluations++;
    f(t, y, dy);
  };

  const k = Array.from({ length: 7 }, () => new Float64Array(n));
  const [k1, k2, k3, k4, k5, k6, k7] = k as [Float64Array, Float64Array, Float64Array, Float64Array,
    Float64Array, Float64Array, Float64Array];
  const tmp = new Float64Array(n);
  const errVec = new Float64Array(n);
  let y = y0.slice();
  let yNew = new Float64Array(n);
  let t = t0;

  call(t, y, k1);
  if (!isFiniteVector(k1)) return { ...out, status: 'non-finite' };
  let h = startingStep(call, t, y, k1, dir, hMax, absTol, relTol);
  let lastRejected = false;

  while (true) {
    if (out.steps + out.rejected >= opts.maxSteps) return { ...out, status: 'max-steps' };
    if (Math.abs(h) < 16 * Number.EPSILON * Math.max(1, Math.abs(t))) return { ...out, status: 'step too small' };
    if (dir * (t + h - t1) > 0) h = t1 - t;

    for (let i = 0; i < n; i++) tmp[i] = y[i]! + h * A21 * k1[i]!;
    call(t + C2 * h, tmp, k2);
    for (let i = 0; i < n; i++) tmp[i] = y[i]! + h * (A31 * k1[i]! + A32 * k2[i]!);
    call(t + C3 * h, tmp, k3);
    for (let i = 0; i < n; i++) tmp[i] = y[i]! + h * (A41 * k1[i]! + A42 * k2[i]! + A43 * k3[i]!);
    call(t + C4 * h, tmp, k4);
    for (let i = 0; i < n; i++) tmp[i] = y[i]! + h * (A51 * k1[i]! + A52 * k2[i]! + A53 * k3[i]! + A54 * k4[i]!);
    call(t + C5 * h, tmp, k5);
    for (let i = 0; i < n; i++) {
      tmp[i] = y[i]! + h * (A61 * k1[i]! + A62 * k2[i]! + A63 * k3[i]! + A64 * k4[i]! + A65 * k5[i]!);
    }
    call(t + h, tmp, k6);
    for (let i = 0; i < n; i++) {
      yNew[i] = y[i]! + h * (B1 * k1[i]! + B3 * k3[i]! + B4 * k4[i]! + B5 * k5[i]! + B6 * k6[i]!);
    }
    call(t + h, yNew, k7);
    for (let i = 0; i < n; i++) {
      errVec[i] = h * (E1 * k1[i]! + E3 * k3[i]! + E4 * k4[i]! + E5 * k5[i]! + E6 * k6[i]! + E7 * k7[i]!);
    }
    const err = scaledNorm(errVec, y, yNew, absTol, relTol);

    if (!Number.isFinite(err) || !isFiniteVector(k7)) {
      // A non-finite stage may just mean the step was too long; shrink hard before giving up.
      out.rejected++;
      lastRejected = true;
      h *= FAC_MIN;
      if (Math.abs(h) < 1e-10 * Math.max(span, 1e-300)) return { ...out, status: 'non-finite' };
      continue;
    }
    if (err <= 1) {
      t = dir * (t + h - t1) >= 0 || Math.abs(t1 - (t + h)) <= 1e-14 * Math.max(1, Math.abs(t1)) ? t1 : t + h;
      [y, yNew] = [yNew, y];
      k1.set(k7);
      out.steps++;
      out.t.push(t);
      out.y.push(y.slice());
      if (t === t1) return out;
      if (opts.stopWhen?.(y, t)) return { ...out, status: 'stopped' };
      const fac = Math.min(lastRejected ? 1 : FAC_MAX, Math.max(FAC_MIN, SAFETY * Math.pow(Math.max(err, 1e-10), -1 / 5)));
      h = dir * Math.min(Math.abs(h) * fac, hMax);
      lastRejected = false;
    } else {
      out.rejected++;
      lastRejected = true;
      h *= Math.max(FAC_MIN, SAFETY * Math.pow(err, -1 / 5));
    }
  }
}
