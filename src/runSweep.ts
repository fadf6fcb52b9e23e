/**
 * The CLI side of a sweep: start the worker (sweepWorker.ts), hand it the job, relay progress to a
 * callback, turn the first Ctrl-C into a cooperative stop (results kept, marked as interrupted) and
 * a second one into an immediate exit, and rethrow the worker's errors as the same kind of error here.
 * The worker sends the report, then renders report.json, report.md and points.csv while this thread
 * renders the diagram.
 *
 * Starting a worker takes about 45 ms, the longest single wait of a short sweep, so cli.ts starts it
 * before the rest of the command line loads (startSweepWorker); it waits, unreferenced (it does not
 * keep the process alive if the command fails before the sweep), until runSweep posts the job.
 */
import { Worker } from 'node:worker_threads';
import { BranchtraceError } from './errors.js';
import type { SweepOptions } from './sweep.js';
import type { SweepJob, WorkerMessage } from './sweepWorker.js';
import type { OutputFile } from './report/writeFiles.js';
import type { Model, Report } from './types.js';

/** An error the worker raised, with its exit status. */
export class RelayedError extends BranchtraceError {
  constructor(message: string, readonly exitCode: number) {
    super(message);
  }
}

export type Progress = Extract<WorkerMessage, { kind: 'progress' }>;

/** A started worker waiting for its job. */
export type SweepWorker = Worker;

/** Starts the worker from its bundled file (dist/sweepWorker.js), unreferenced, waiting for a job. */
export function startSweepWorker(file: URL): SweepWorker {
  // A larger young generation than the default: the trace allocates many short-lived arrays, and
  // scavenges were a sixth of a short sweep's time (measured with --cpu-prof).
  const worker = new Worker(file, { resourceLimits: { maxYoungGenerationSizeMb: 64 } });
  worker.unref();
  return worker;
}

/** What a sweep gives back: the report at once, its files (report.json, .md, .csv) when the worker has rendered them. */
export interface SweepOutcome {
  report: Report;
  reportFiles: Promise<OutputFile[]>;
}

export function runSweep(
  worker: SweepWorker, model: Model, opts: SweepOptions, onProgress: (p: Progress) => void,
): Promise<SweepOutcome> {
  const stop = new SharedArrayBuffer(4);
  const flag = new Int32Array(stop);
  const job: SweepJob = { model, opts, stop };
  worker.ref();
  worker.postMessage(job);
  const onSigint = () => {
    if (Atomics.load(flag, 0) !== 0) process.exit(130);
    Atomics.store(flag, 0, 1);
  };
  process.on('SIGINT', onSigint);
  let filesSettle: { resolve: (f: OutputFile[]) => void; reject: (e: unknown) => void } | undefined;
  const reportFiles = new Promise<OutputFile[]>((resolve, reject) => {
    filesSettle = { resolve, reject };
  });
  reportFiles.catch(() => undefined); // rejected only after the report came; whoever awaits it sees the error
  const outcome = new Promise<SweepOutcome>((resolve, reject) => {
    let stage: 'running' | 'report' | 'finished' = 'running';
    // Before the report, a failure rejects the sweep; after it, the files.
    const fail = (err: unknown) => {
      if (stage === 'running') reject(err);
      else if (stage === 'report') filesSettle!.reject(err);
      stage = 'finished';
      void worker.terminate();
    };
    worker.on('message', (m: WorkerMessage) => {
      if (m.kind === 'progress') return onProgress(m);
      if (m.kind === 'done') {
        stage = 'report';
        process.off('SIGINT', onSigint);
        return resolve({ report: m.report, reportFiles });
      }
      if (m.kind === 'files') {
        stage = 'finished';
        filesSettle!.resolve(m.files);
        return void worker.terminate();
      }
      fail(m.kind === 'error' ? new RelayedError(m.message, m.exitCode) : Object.assign(new Error(m.message), { stack: m.stack }));
    });
    worker.on('error', fail);
    worker.on('exit', (code) => {
      if (stage !== 'finished') fail(new Error(`the sweep worker stopped with exit code ${code} before sending its results`));
    });
  });
  return outcome.finally(() => {
    process.off('SIGINT', onSigint);
  });
}
