/**
 * The parameter sweep, one straight pipeline:
 *
 *   Model ─prepare→ CompiledSystem, parameters, guess      (src/setup.ts, src/compile/)
 *         (a slow model in a longer time unit: src/timeUnit.ts)
 *         ─findEquilibria at from, nominal, to, probes→ starts (src/equilibria/)
 *         ─traceBranches→ Trace: branches, special points  (src/trace/, src/detect/)
 *         ─buildReport→ Report (margin included)           (src/report/)
 *
 * Rendering and writing files are the caller's business (src/commands.ts, or a library user); this
 * function touches neither the file system nor the terminal. It returns the intermediate results too.
 */
import type { CompiledSystem } from './compile/compileModel.js';
import { EQUILIBRIA, MARGIN, NEWTON } from './defaults.js';
import { findEquilibria } from './equilibria/findEquilibria.js';
import { message, NumericalError, UsageError } from './errors.js';
import { buildReport } from './report/buildReport.js';
import { assertIsolatedEquilibria, parameterIndex, prepare } from './setup.js';
import { newton } from './solve/newton.js';
import { traceBranches, type StartEquilibrium } from './trace/traceBranches.js';
import { traceSettings } from './trace/traceSettings.js';
import type { Model, NewtonResult, Report, Trace, TraceHooks, TraceSettings } from './types.js';
import { inLogParameter, traceInParameter } from './logParameter.js';
import { inLongerTime, timeFactor, traceInModelTime } from './timeUnit.js';
import { VERSION } from './version.js';

export interface SweepOptions {
  /** The parameter to vary, and its range (from ≠ to; either order). */
  vary: string;
  from: number;
  to: number;
  /** Other parameters replacing the model's values (`--set`). */
  set?: Readonly<Record<string, number>>;
  /** Start guesses replacing the model's (`--start`). */
  start?: Readonly<Record<string, number>>;
  /** First and largest step along the branch (scaled arclength, in parameter units). */
  step?: number;
  maxStep?: number;
  /** Point budget per branch. */
  maxPoints?: number;
  /** Sweep over decades: steps in log10 of the parameter (from and to must be positive). */
  log?: boolean;
  /** How many values inside the range equilibria are searched for at too (searchValues; default: probeCount). */
  probes?: number;
  warnMargin?: number;
  failMargin?: number;
}

export interface SweepResult {
  system: CompiledSystem;
  starts: StartEquilibrium[];
  trace: Trace;
  report: Report;
}

function newtonAt(system: CompiledSystem, p: Float64Array, x0: Float64Array): NewtonResult {
  return newton(
    (x, out) => system.rhs(x, p, out),
    (x, out) => system.jacobian(x, p, out),
    x0,
    NEWTON,
  );
}

/** How many probes a model of n states gets by default (EQUILIBRIA.probes). */
export function probeCount(n: number): number {
  return n <= EQUILIBRIA.probeStates ? EQUILIBRIA.probes : EQUILIBRIA.probesLarge;
}

/**
 * Where equilibria are searched for: the start of the range, the nominal value (if inside) and the
 * end (`main`, in this order), then `count` probes inside, one in each of `count` equal parts of the range at
 * the golden-section point of the part (0.382 of it), so that none falls on a round value such as 0
 * or the middle, where special points often sit (a start on a branch point has no unique direction).
 * Probes within a thousandth of the range of the nominal value are left out: that search is done.
 */
export function searchValues(from: number, to: number, nominal: number, count: number): { main: number[]; probes: number[] } {
  const lo = Math.min(from, to);
  const hi = Math.max(from, to);
  const inside = nominal > lo && nominal < hi;
  const probes = Array.from({ length: count }, (_, i) => from + ((to - from) * (i + GOLDEN_SECTION)) / count)
    .filter((v) => !inside || Math.abs(v - nominal) > 1e-3 * (hi - lo));
  return { main: [from, ...(inside ? [nominal] : []), to], probes };
}

/** (3 − √5)/2: the golden-section fraction, far from every simple ratio (common practice). */
const GOLDEN_SECTION = (3 - Math.sqrt(5)) / 2;

function settingsFor(k: number, opts: SweepOptions): TraceSettings {
  const overrides: Partial<TraceSettings> = {};
  if (opts.step !== undefined) overrides.ds = opts.step;
  if (opts.maxStep !== undefined) overrides.dsMax = opts.maxStep;
  if (opts.maxPoints !== undefined) overrides.maxPoints = opts.maxPoints;
  const settings = traceSettings(k, opts.from, opts.to, overrides);
  if (settings.ds > settings.dsMax) settings.ds = settings.dsMax;
  return settings;
}

export function sweep(model: Model, opts: SweepOptions, hooks: TraceHooks = {}): SweepResult {
  const k = parameterIndex(model, opts.vary);
  if (!(opts.from !== opts.to)) throw new UsageError(message.emptyRange(opts.from, opts.to));
  const log = opts.log === true;
  if (log && !(opts.from > 0 && opts.to > 0)) throw new UsageError(message.logRange(opts.from, opts.to));
  const prepared = prepare(model, opts);
  assertIsolatedEquilibria(prepared);
  const { params, guess } = prepared;
  const nominal = params[k]!;
  // The continuation runs in λ itself, or with --log in u = log10 λ (logParameter.ts); a slow model
  // in a longer time unit, its rates given back in its own (timeUnit.ts).
  const toU = (v: number) => (log ? Math.log10(v) : v);
  const [from, to] = [toU(opts.from), toU(opts.to)];
  // Back from u to λ, exactly the values given where u came from one.
  const fromU = (u: number) => (!log ? u : u === from ? opts.from : u === to ? opts.to : u === toU(nominal) ? nominal : 10 ** u);
  const r = timeFactor(prepared.system, params, guess);
  const system = inLongerTime(log ? inLogParameter(prepared.system, k) : prepared.system, r);

  // 1. Every equilibrium the search finds at the start of the range (the guess is tried first),
  //    then at the nominal value, at the end of the range and at the probes inside it, for branches
  //    that do not reach the start of the range (the far side of an S-curve, an isola). Starts on a
  //    branch already traced are skipped by the trace.
  const at = (u: number) => {
    const q = params.slice();
    q[k] = u;
    return q;
  };
  const { main: [first, ...ends], probes } = searchValues(from, to, toU(nominal), opts.probes ?? probeCount(system.n));
  const fromStarts = findEquilibria(system, at(first!), { guess, keepOutsideBox: true }).equilibria.map((e) => e.state);
  if (fromStarts.length === 0) {
    const tried = newtonAt(system, at(from), guess);
    throw new NumericalError(message.noEquilibriumAtStart(opts.vary, opts.from, tried.residual, tried.iterations));
  }
  const searchAt = (u: number, starts: number) =>
    findEquilibria(system, at(u), { guess, starts, keepOutsideBox: true }).equilibria.map((e) => ({ state: e.state, parameter: u }));
  const further = [
    ...ends.flatMap((u) => searchAt(u, EQUILIBRIA.extraStarts)),
    ...probes.flatMap((u) => searchAt(u, EQUILIBRIA.probeStarts)),
  ];
  const starts = [...fromStarts, ...further];

  // 2. Follow every branch through them.
  const traced = traceInModelTime(traceBranches(system, at(toU(nominal)), settingsFor(k, { ...opts, from, to }), starts, hooks), r);
  const trace = log ? traceInParameter(traced, opts.from, opts.to) : traced;

  // 3. The operating state: where Newton from the guess lands at the nominal value.
  const operating = newtonAt(system, at(toU(nominal)), guess);
  const report = buildReport(trace, prepared.system.info, {
    parameter: opts.vary,
    version: VERSION,
    warnMargin: opts.warnMargin ?? MARGIN.warn,
    failMargin: opts.failMargin ?? MARGIN.fail,
    nominal,
    searchedAt: [first!, ...ends, ...probes].map(fromU),
    parameterScale: log ? 'log' : 'linear',
    ...(operating.status === 'converged' && { operatingState: operating.x }),
  });
  return { system: prepared.system, starts, trace, report };
}
