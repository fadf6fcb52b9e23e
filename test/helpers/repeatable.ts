/**
 * fast-check parameters that make a property test repeat exactly: a fixed start for fast-check's
 * random stream (the option below is fast-check's own name for it) and the number of runs. The
 * only place that spells the option, so every property test states just its run number.
 *
 * `npm test` always uses the fixed values. To hunt for failures beyond them, shift every stream and
 * multiply the runs for one session, e.g.
 *   BRANCHTRACE_PROPERTY_SHIFT=101 BRANCHTRACE_PROPERTY_RUNS=4 npx vitest run test/trace
 * and turn each failure found into a fixed test.
 */
import type { Parameters } from 'fast-check';

const shift = Number(process.env.BRANCHTRACE_PROPERTY_SHIFT ?? 0) || 0;
const times = Math.max(1, Number(process.env.BRANCHTRACE_PROPERTY_RUNS ?? 1) || 1);

export function repeatable<T>(run: number, numRuns: number): Parameters<T> {
  return { seed: run + shift, numRuns: numRuns * times };
}
