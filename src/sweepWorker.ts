/**
 * Worker-thread entry for the CLI's sweep. The trace is one long synchronous computation, so the
 * main thread could not see Ctrl-C while it runs; here it runs in a worker, and the main thread
 * (runSweep.ts) keeps its event loop free: it sets a flag in shared memory on SIGINT, which the
 * trace checks at every point and then returns what it computed, marked as interrupted.
 */
import { parentPort } from 'node:worker_threads';
import { BranchtraceError } from './errors.js';
import { reportFiles } from './report/outputFiles.js';
import type { OutputFile } from './report/writeFiles.js';
import { sweep, type SweepOptions } from './sweep.js';
import type { Model, Report } from './types.js';

export interface SweepJob {
  /** The loaded model (plain data: structured clone carries it to the worker). */
  model: Model;
  opts: SweepOptions;
  /** Int32Array(1) over a SharedArrayBuffer: non-zero means stop. */
  stop: SharedArrayBuffer;
}

export type WorkerMessage =
  | { kind: 'progress'; branch: number; points: number; parameter: number; branchesDone: number }
  | { kind: 'done'; report: Report }
  | { kind: 'files'; files: OutputFile[] }
  | { kind: 'error'; message: string; exitCode: number }
  | { kind: 'internal'; message: string; stack: string };

/** Progress messages at most this often (ms); common practice for a terminal status line. */
const PROGRESS_INTERVAL = 100;

function run(job: SweepJob, post: (m: WorkerMessage) => void): void {
  const stop = new Int32Array(job.stop);
  let last = 0;
  try {
    const { report } = sweep(job.model, job.opts, {
      shouldStop: () => Atomics.load(stop, 0) !== 0,
      onProgress: (p) => {
        const now = Date.now();
        if (now - last < PROGRESS_INTERVAL) return;
        last = now;
        post({ kind: 'progress', ...p });
      },
    });
    post({ kind: 'done', report });
    // Then the report files, while the main thread renders the diagram (two cores at work).
    post({ kind: 'files', files: reportFiles(report) });
  } catch (err) {
    if (err instanceof BranchtraceError) post({ kind: 'error', message: err.message, exitCode: err.exitCode });
    else post({ kind: 'internal', message: String((err as Error)?.message ?? err), stack: String((err as Error)?.stack ?? '') });
  }
}

// The job comes as the first message (the worker may start before the model is read: runSweep.ts).
if (parentPort !== null) {
  const port = parentPort;
  port.once('message', (job: SweepJob) => run(job, (m) => port.postMessage(m)));
}
