/**
 * The message protocol between the command line and the sweep's worker (src/runSweep.ts), with a
 * stand-in worker: the report comes first, the report files after it; a failure before the report
 * fails the sweep, one after it fails only the files; the worker is stopped once it is done.
 */
import { EventEmitter } from 'node:events';
import { describe, expect, it } from 'vitest';
import { RelayedError, runSweep, type SweepWorker } from '../../src/runSweep.js';
import type { WorkerMessage } from '../../src/sweepWorker.js';
import type { Model, Report } from '../../src/types.js';

class StandInWorker extends EventEmitter {
  posted: unknown[] = [];
  referenced = false;
  terminated = false;
  postMessage(m: unknown): void {
    this.posted.push(m);
  }
  ref(): void {
    this.referenced = true;
  }
  terminate(): Promise<number> {
    this.terminated = true;
    return Promise.resolve(0);
  }
  send(m: WorkerMessage): void {
    this.emit('message', m);
  }
}

const model = { states: [], parameters: [] } as unknown as Model;
const report = { tool: 'branchtrace' } as unknown as Report;
const start = (w: StandInWorker, progress: unknown[] = []) =>
  runSweep(w as unknown as SweepWorker, model, { vary: 'p', from: 0, to: 1 }, (p) => progress.push(p));

describe('runSweep', () => {
  it('posts the job, relays progress, gives the report first and the files when they come, then stops the worker', async () => {
    const w = new StandInWorker();
    const progress: unknown[] = [];
    const running = start(w, progress);
    expect(w.referenced).toBe(true);
    expect(w.posted).toHaveLength(1);
    expect((w.posted[0] as { opts: { vary: string }; stop: SharedArrayBuffer }).opts.vary).toBe('p');
    expect((w.posted[0] as { stop: SharedArrayBuffer }).stop).toBeInstanceOf(SharedArrayBuffer);
    w.send({ kind: 'progress', branch: 1, points: 10, parameter: 0.5, branchesDone: 0 });
    w.send({ kind: 'done', report });
    const outcome = await running;
    expect(progress).toHaveLength(1);
    expect(outcome.report).toBe(report);
    expect(w.terminated).toBe(false);
    const files = [{ name: 'report.json', content: '{}\n' }];
    w.send({ kind: 'files', files });
    await expect(outcome.reportFiles).resolves.toEqual(files);
    expect(w.terminated).toBe(true);
    // The worker's exit after terminate() is expected, not an error.
    w.emit('exit', 1);
  });

  it('fails the sweep with the worker\'s own error and exit status when it fails before the report', async () => {
    const w = new StandInWorker();
    const running = start(w);
    w.send({ kind: 'error', message: 'no equilibrium at p = 0', exitCode: 3 });
    await expect(running).rejects.toEqual(new RelayedError('no equilibrium at p = 0', 3));
    await expect(running.catch((e: RelayedError) => e.exitCode)).resolves.toBe(3);
    expect(w.terminated).toBe(true);
  });

  it('keeps the report but fails the files when the worker fails after the report', async () => {
    const w = new StandInWorker();
    const running = start(w);
    w.send({ kind: 'done', report });
    const outcome = await running;
    w.send({ kind: 'internal', message: 'out of memory', stack: '' });
    await expect(outcome.reportFiles).rejects.toThrow('out of memory');
    expect(w.terminated).toBe(true);
  });

  it('fails the sweep when the worker stops before sending anything', async () => {
    const w = new StandInWorker();
    const running = start(w);
    w.emit('exit', 1);
    await expect(running).rejects.toThrow('the sweep worker stopped with exit code 1 before sending its results');
  });
});
