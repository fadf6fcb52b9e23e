/**
 * The command-line entry. For `branchtrace sweep` it starts the sweep's worker thread first, so that
 * the worker's start-up (about 45 ms) overlaps with loading the rest of the command line and
 * reading the model; then it runs the commands (commands.ts). The worker's file is named here,
 * beside this file (the build puts both in dist/; shared code goes to dist/chunks/).
 */
import { startSweepWorker, type SweepWorker } from './runSweep.js';

const workerUrl = new URL('./sweepWorker.js', import.meta.url);
let early: SweepWorker | undefined = process.argv[2] === 'sweep' ? startSweepWorker(workerUrl) : undefined;
const sweepWorker = (): SweepWorker => {
  const worker = early ?? startSweepWorker(workerUrl);
  early = undefined;
  return worker;
};
const { main } = await import('./commands.js');
await main(process.argv, sweepWorker);
