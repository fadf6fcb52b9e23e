/**
 * Cost of one computed branch point against a LAPACK floor.
 *
 * For each model: loadModel → compileModel → traceBranches from a known start (corrected by
 * Newton inside traceBranches), default settings (src/trace/traceSettings.ts). Wall time of
 * traceBranches only (compiling excluded) divided by the points computed on all branches, so
 * correction, eigenvalues, detection, location, coefficients and branch switching are all included.
 * One warm-up run, then the median of timed runs.
 *
 * Floor: bench/reference/floor.py, one numpy.linalg.solve + one numpy.linalg.eigvals of a random
 * well-conditioned n×n matrix (median of many repeats) — what one point of any method that solves
 * a linear system and computes the spectrum must spend at least. Target: ratio ≤ 3 for n = 20 and 100.
 */
import { compileModel } from '../src/compile/compileModel.js';
import { loadModel } from '../src/model/loadModel.js';
import { traceBranches } from '../src/trace/traceBranches.js';
import { traceSettings } from '../src/trace/traceSettings.js';
import type { Trace } from '../src/types.js';
import { BLAS_THREADS, emitFact, emitNote, emitRow, emitTitle, eventSummary, median, runPython, sig } from './benchOutput.js';
import {
  bratuExpected, bratuModel, brusselatorExpected, brusselatorModel, type BenchModelText, type ExpectedPoint,
} from './reactionDiffusion.js';

const TABLE = 'sweep-cost';
const TARGET = 3;
/** Timed runs per model: at least MIN_RUNS, more while the total stays under BUDGET_MS. */
const MIN_RUNS = 2;
const MAX_RUNS = 5;
const BUDGET_MS = 4000;

interface Floor { n: number; floorMs: number; solveMs: number; eigvalsMs: number; python: string; numpy: string; blas: string }

interface Case { model: BenchModelText; from: number; to: number; expected: ExpectedPoint[] }

export const CASES: Case[] = [
  { model: bratuModel(2), from: 0.1, to: 4, expected: bratuExpected(2) },
  { model: brusselatorModel(1), from: 1.5, to: 3.5, expected: brusselatorExpected(1, 1.5, 3.5) },
  { model: bratuModel(20), from: 0.1, to: 4, expected: bratuExpected(20) },
  { model: brusselatorModel(10), from: 1.5, to: 3.5, expected: brusselatorExpected(10, 1.5, 3.5) },
  { model: bratuModel(100), from: 0.1, to: 4, expected: bratuExpected(100) },
  { model: brusselatorModel(50), from: 1.5, to: 3.5, expected: brusselatorExpected(50, 1.5, 3.5) },
];

function pointsOf(trace: Trace): number {
  return trace.branches.reduce((sum, b) => sum + b.points.length, 0);
}

const BRANCH_TYPES = new Set(['transcritical', 'pitchfork', 'branch-point']);

/** How many of the analytic special points the trace found on its first branch (the one through the start). */
function analyticCheck(trace: Trace, expected: readonly ExpectedPoint[]): string {
  const events = trace.events.filter((e) => e.branch === 1);
  const missed = expected.filter((x) => !events.some((e) =>
    (x.kind === 'branch point' ? BRANCH_TYPES.has(e.type) : e.type === x.kind) &&
    Math.abs(e.parameter - x.at) <= x.relTol * Math.abs(x.at)));
  const text = `${expected.length - missed.length}/${expected.length}`;
  return missed.length ? `${text}, missed ${missed.map((x) => `${x.kind} ${sig(x.at, 5)}`).join(', ')}` : text;
}

function benchCase(c: Case, floors: Map<number, Floor>): string[] {
  const model = loadModel(c.model.text, `${c.model.name}.yaml`);
  const system = compileModel(model);
  const k = model.parameters.findIndex((q) => q.name === c.model.vary);
  const params = Float64Array.from(model.parameters.map((q) => q.value));
  const settings = traceSettings(k, c.from, c.to);
  const starts = [c.model.start(c.from)];
  const run = (): { ms: number; trace: Trace } => {
    const t0 = performance.now();
    const trace = traceBranches(system, params, settings, starts);
    return { ms: performance.now() - t0, trace };
  };

  const first = run();
  const points = pointsOf(first.trace);
  const perPoint: number[] = [];
  let spent = 0;
  while (perPoint.length < MIN_RUNS || (perPoint.length < MAX_RUNS && spent < BUDGET_MS)) {
    const { ms, trace } = run();
    spent += ms;
    perPoint.push(ms / pointsOf(trace));
  }
  const ms = median(perPoint);
  const floor = floors.get(system.n)!;
  const ratio = ms / floor.floorMs;
  const targeted = system.n >= 20;
  emitRow(TABLE, {
    model: c.model.name,
    n: system.n,
    range: `${c.model.vary} ${c.from} → ${c.to}`,
    points,
    'ms/point': sig(ms),
    'floor ms': sig(floor.floorMs),
    ratio: sig(ratio),
    target: targeted ? `≤ ${TARGET}` : '-',
    met: targeted ? (ratio <= TARGET ? 'yes' : 'NO') : '-',
    'first run ms/point': sig(first.ms / points),
    branches: first.trace.branches.length,
    events: eventSummary(first.trace.events.map((e) => e.type)),
    'analytic check': analyticCheck(first.trace, c.expected),
    warnings: first.trace.warnings.length,
  });
  return first.trace.warnings.map((w) => `${c.model.name}: ${w}`);
}

export async function main(): Promise<void> {
  emitTitle(TABLE, 'Sweep cost per computed point vs a LAPACK floor (solve + eigvals of one n×n matrix)');
  const floors = new Map<number, Floor>();
  for (const c of CASES) {
    const n = c.model.start(c.from).length;
    if (!floors.has(n)) floors.set(n, runPython<Floor>('floor.py', [n]));
  }
  const any = [...floors.values()][0]!;
  emitFact(TABLE, `python ${any.python}, numpy ${any.numpy}, BLAS ${any.blas}, OPENBLAS_NUM_THREADS=${BLAS_THREADS}`);
  const warnings = CASES.flatMap((c) => benchCase(c, floors));
  for (const f of floors.values()) {
    const overhead = f.n <= 2 ? '; numpy call overhead dominates at this size' : '';
    emitNote(TABLE, `floor n = ${f.n}: solve ${sig(f.solveMs)} ms + eigvals ${sig(f.eigvalsMs)} ms (medians${overhead})`);
  }
  emitNote(TABLE, 'ms/point: median over timed runs after one warm-up run of traceBranches (compiling excluded), divided by the points on all branches; events found, located and classified, and branch switching, are inside that time.');
  emitNote(TABLE, 'analytic check: special points in closed form (bench/reactionDiffusion.ts: Bratu 2 points exactly, larger Bratu by the continuum fold 3.51383 within 2h², Brusselator trivial branch mode by mode) found on the branch through the start.');
  emitNote(TABLE, 'warnings: entries in Trace.warnings of the first run, listed below.');
  emitNote(TABLE, 'first run ms/point: the warm-up run itself (includes the JavaScript engine compiling the hot code).');
  for (const w of warnings) emitNote(TABLE, `warning, ${w}`);
}
