/**
 * Against what a user would otherwise write, on the same model and resolution: the discretised
 * Bratu problem on 20 interior points (bench/reactionDiffusion.ts, bench/reference/bratu.py),
 * lam from 0.1 to 3.4 (below the fold, so that a natural-parameter sweep can get through).
 *
 *   ours:   the library pipeline sweep() (src/sweep.ts) in a fresh process, first run: loadModel,
 *           compile, equilibrium search at lam = 0.1, every branch traced with stability, special
 *           points located, report built (files not written). Node start-up excluded.
 *   theirs: bench/reference/naturalSweep.py (scipy.optimize.root warm-started point to point) and
 *           bench/reference/simulateSweep.py (solve_ivp to steady state at each value), with as many
 *           evenly spaced values as our branch through lam = 0.1's stable state has points.
 *           Timed inside the scripts; interpreter start-up and imports excluded.
 *
 * A second table times the whole run as a user starts it, process start to exit: our command line
 * (`node dist/cli.js sweep`, writing its files) against `python3 <script>` (interpreter start-up and
 * the numpy/scipy imports included), median of WALL_RUNS runs each.
 */
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { loadModel } from '../src/model/loadModel.js';
import { parameterIndex, prepare } from '../src/setup.js';
import { sweep, type SweepResult } from '../src/sweep.js';
import { traceBranches } from '../src/trace/traceBranches.js';
import { traceSettings } from '../src/trace/traceSettings.js';
import type { Trace } from '../src/types.js';
import { BLAS_THREADS, emitFact, emitNote, emitRow, emitTitle, median, ROOT, runPython, sig, timedPython } from './benchOutput.js';
import { bratuModel } from './reactionDiffusion.js';

const TABLE = 'user-script';
const WALL_TABLE = 'user-script-wall';
const WALL_RUNS = 5;
const CLI = join(ROOT, 'dist', 'cli.js');
const POINTS = 20;
const FROM = 0.1;
const TO = 3.4;
const WARM_RUNS = 5;

interface NaturalResult { values: number; seconds: number; converged: number; stable: number; maxResidual: number; scipy: string }
interface SimulateResult { values: number; seconds: number; settled: number; maxResidual: number; rhsCalls: number; scipy: string }

function ourSweep(): { ms: number; trace: Trace; result: SweepResult } {
  const t0 = performance.now();
  const model = loadModel(bratuModel(POINTS).text, 'bratu.yaml');
  const result = sweep(model, { vary: 'lam', from: FROM, to: TO });
  return { ms: performance.now() - t0, trace: result.trace, result };
}

/** The continuation alone (traceBranches from the same start equilibria, same settings), warm. */
function traceOnly(result: SweepResult): number {
  const model = loadModel(bratuModel(POINTS).text, 'bratu.yaml');
  const { params } = prepare(model);
  const k = parameterIndex(model, 'lam');
  const times: number[] = [];
  for (let i = 0; i < WARM_RUNS; i++) {
    const t0 = performance.now();
    traceBranches(result.system, params, traceSettings(k, FROM, TO), result.starts);
    times.push(performance.now() - t0);
  }
  return median(times);
}

/** The parameter interval each branch covers, and why it stopped. */
function reached(trace: Trace): string {
  return trace.branches.map((b) => {
    const ps = b.points.map((q) => q.parameter);
    return `${sig(Math.min(...ps))} → ${sig(Math.max(...ps))} (${b.stopped})`;
  }).join('; ');
}

export async function main(): Promise<void> {
  emitTitle(TABLE, `Ours vs a hand-written scipy script: Bratu problem, ${POINTS} points, lam ${FROM} → ${TO}`);
  const first = ourSweep();
  const warm: number[] = [];
  for (let i = 0; i < WARM_RUNS; i++) warm.push(ourSweep().ms);
  const warmMs = median(warm);

  const branches = first.trace.branches;
  const points = branches.reduce((sum, b) => sum + b.points.length, 0);
  const stableBranch = branches.find((b) => b.points[0]?.stable) ?? branches[0]!;
  const values = stableBranch.points.length;
  const natural = runPython<NaturalResult>('naturalSweep.py', [POINTS, FROM, TO, values]);
  const simulate = runPython<SimulateResult>('simulateSweep.py', [POINTS, FROM, TO, values]);
  emitFact(TABLE, `python3 with scipy ${natural.scipy}, OPENBLAS_NUM_THREADS=${BLAS_THREADS}`);

  const unstable = branches.reduce((sum, b) => sum + b.points.filter((q) => !q.stable).length, 0);
  const ours = (label: string, ms: number): void => emitRow(TABLE, {
    method: label,
    'values on stable branch': values,
    'points in all': points,
    'total ms': sig(ms),
    'ms/point': sig(ms / points),
    'theirs/ours': '-',
    finds: `${branches.length} branch${branches.length === 1 ? '' : 'es'}, ${unstable} unstable points`,
    'special points': first.trace.events.length,
    reached: reached(first.trace),
  });
  ours('branchtrace sweep(), first run in a fresh process', first.ms);
  ours(`branchtrace sweep(), median of ${WARM_RUNS} further runs`, warmMs);
  const traceMs = traceOnly(first.result);
  ours(`branchtrace traceBranches() alone (no equilibrium search, no report), median of ${WARM_RUNS}`, traceMs);
  const theirs = (label: string, seconds: number, count: number, finds: string): void => emitRow(TABLE, {
    method: label,
    'values on stable branch': count,
    'points in all': count,
    'total ms': sig(seconds * 1e3),
    'ms/point': sig((seconds * 1e3) / count),
    'theirs/ours': `${sig((seconds * 1e3) / first.ms)} (warm ${sig((seconds * 1e3) / warmMs)})`,
    finds,
    'special points': 'not located',
    reached: `${FROM} → ${TO}`,
  });
  theirs('scipy.optimize.root, natural sweep', natural.seconds, natural.values,
    `stable only; ${natural.converged}/${natural.values} converged, ${natural.stable} stable`);
  theirs('scipy.integrate.solve_ivp to steady state', simulate.seconds, simulate.values,
    `stable only; ${simulate.settled}/${simulate.values} settled`);

  const short = branches.some((b) => b.stopped !== 'left range' && b.stopped !== 'closed loop');
  if (short) emitNote(TABLE, 'WARNING: a branch of ours stopped before leaving the range (see "reached"), so the point counts do not describe the same resolution.');
  emitNote(TABLE, 'theirs/ours: Python time over our first-run time (in brackets: over our warm median); above 1 means ours is faster.');
  emitNote(TABLE, 'Ours: load + compile + equilibrium searches + all branches with eigenvalues, special points located and classified, report built; no files written.');
  emitNote(TABLE, `Per point, the continuation alone takes ${sig(traceMs / points)} ms against ${sig((natural.seconds * 1e3) / natural.values)} ms for the natural sweep (${sig((natural.seconds * 1e3) / natural.values / (traceMs / points))} times as long); ours computes ${sig(points / values)} times as many points (the unstable branch too) and first searches for every equilibrium at ${first.result.report.settings.searchedAt.length} parameter values (the ends of the range, the nominal value and the probes inside).`);
  emitNote(TABLE, 'The Python scripts find only the stable branch (a natural sweep cannot pass a fold, a simulation cannot settle on an unstable state) and locate no special points; the root script also computes eigenvalues at every value, the simulation stops when max|f| < 1e-8 (from the previous end state) or at t = 1e4.');
  wallTable(values);
}

/** Median wall time of `run` over WALL_RUNS runs, with min and max. */
function wall(run: () => number): { median: number; min: number; max: number } {
  const times = Array.from({ length: WALL_RUNS }, () => run());
  return { median: median(times), min: Math.min(...times), max: Math.max(...times) };
}

/** The whole run as a user starts it: our command line against the python3 scripts. */
function wallTable(values: number): void {
  emitTitle(WALL_TABLE, `The same comparison as a user runs it, process start to exit (median of ${WALL_RUNS})`);
  if (!existsSync(CLI)) {
    emitNote(WALL_TABLE, 'dist/cli.js is missing (run npm run build): no whole-run comparison.');
    return;
  }
  const dir = mkdtempSync(join(tmpdir(), 'branchtrace-bench-'));
  try {
    const model = join(dir, 'bratu.yaml');
    writeFileSync(model, bratuModel(POINTS).text);
    const cli = (extra: readonly string[]) => wall(() => {
      const t0 = performance.now();
      const r = spawnSync(process.execPath, [CLI, 'sweep', model, '--vary', 'lam', '--from', String(FROM), '--to', String(TO), '--out', join(dir, 'out'), ...extra], { encoding: 'utf8' });
      if (r.status !== 0) throw new Error(`branchtrace sweep failed (${r.status}): ${r.stderr.trim()}`);
      return (performance.now() - t0) / 1000;
    });
    const python = (script: string) => wall(() => timedPython(script, [POINTS, FROM, TO, values]).wallSeconds);
    const ours = cli(['--no-diagram']);
    const oursDiagram = cli([]);
    const row = (command: string, output: string, t: { median: number; min: number; max: number }, ratio: string) => emitRow(WALL_TABLE, {
      command, output, 'median s': sig(t.median), 'min s': sig(t.min), 'max s': sig(t.max), 'theirs/ours': ratio,
    });
    row('branchtrace sweep --no-diagram', 'every branch, special points located; report.json, report.md, points.csv', ours, '-');
    row('branchtrace sweep', `the same and the diagram (html, Vega-Lite spec, svg; the norm of the state, the default for ${POINTS} states)`, oursDiagram, '-');
    for (const [script, output] of [
      ['naturalSweep.py', `${values} values on the stable branch, printed`],
      ['simulateSweep.py', `${values} values on the stable branch, printed`],
    ] as const) {
      const t = python(script);
      row(`python3 ${script}`, output, t, `${sig(t.median / ours.median)} (with our diagram ${sig(t.median / oursDiagram.median)})`);
    }
    emitNote(WALL_TABLE, 'theirs/ours: the script\'s median wall time over ours without the diagram (in brackets: over ours with it); above 1 means ours is faster.');
    emitNote(WALL_TABLE, 'Both sides pay their start-up here: Node and our bundle, python3 and its numpy/scipy imports (the first table leaves both out).');
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
