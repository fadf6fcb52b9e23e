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
 */
import { loadModel } from '../src/model/loadModel.js';
import { sweep } from '../src/sweep.js';
import type { Trace } from '../src/types.js';
import { BLAS_THREADS, emitFact, emitNote, emitRow, emitTitle, median, runPython, sig } from './benchOutput.js';
import { bratuModel } from './reactionDiffusion.js';

const TABLE = 'user-script';
const POINTS = 20;
const FROM = 0.1;
const TO = 3.4;
const WARM_RUNS = 5;

interface NaturalResult { values: number; seconds: number; converged: number; stable: number; maxResidual: number; scipy: string }
interface SimulateResult { values: number; seconds: number; settled: number; maxResidual: number; rhsCalls: number; scipy: string }

function ourSweep(): { ms: number; trace: Trace } {
  const t0 = performance.now();
  const model = loadModel(bratuModel(POINTS).text, 'bratu.yaml');
  const { trace } = sweep(model, { vary: 'lam', from: FROM, to: TO });
  return { ms: performance.now() - t0, trace };
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
  emitNote(TABLE, 'Ours: load + compile + equilibrium search at the start + all branches with eigenvalues, special points located and classified, report built; no files written.');
  emitNote(TABLE, 'The Python scripts find only the stable branch (a natural sweep cannot pass a fold, a simulation cannot settle on an unstable state) and locate no special points; the root script also computes eigenvalues at every value, the simulation stops when max|f| < 1e-8 (from the previous end state) or at t = 1e4.');
}
