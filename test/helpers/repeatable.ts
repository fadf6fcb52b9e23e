/**
 * fast-check parameters that make a property test repeat exactly: a fixed start for fast-check's
 * random stream (the option below is fast-check's own name for it) and the number of runs. The
 * only place that spells the option, so every property test states just its run number.
 */
import type { Parameters } from 'fast-check';

export function repeatable<T>(run: number, numRuns: number): Parameters<T> {
  return { seed: run, numRuns };
}
