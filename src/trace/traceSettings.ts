/**
 * Trace settings from the defaults in src/defaults.ts (TRACE): step lengths are fractions of the
 * sweep range |to − from| (the scaled arclength measures the parameter in its own units, see
 * stateWeights.ts), the rest is copied. `overrides` replaces any field afterwards.
 */
import { TRACE } from '../defaults.js';
import type { TraceSettings } from '../types.js';

export function traceSettings(
  parameterIndex: number, from: number, to: number, overrides: Partial<TraceSettings> = {},
): TraceSettings {
  const range = Math.abs(to - from);
  return {
    parameterIndex,
    from,
    to,
    ds: TRACE.dsFraction * range,
    dsMin: TRACE.dsMinFraction * range,
    dsMax: TRACE.dsMaxFraction * range,
    maxPoints: TRACE.maxPoints,
    absTol: TRACE.absTol,
    maxIter: TRACE.maxIter,
    maxBranches: TRACE.maxBranches,
    ...overrides,
  };
}
