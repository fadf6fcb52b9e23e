/**
 * A sweep over decades (`--log`): a gain from 0.01 to 100, a feed rate from 1e-4 to 1. Steps that are
 * fractions of the range in the parameter itself would cross the lowest decades in one step; here the
 * continuation runs in u = log10 λ (steps, --step and --max-step in decades) on the same model
 * written in u: f(x, 10^u), with ∂f/∂u = ∂f/∂λ · λ ln 10 and likewise for the mixed derivative. The
 * equilibria, and so the branches, special points and their coefficients (derivatives in x only),
 * are the same; only the parameter values go back from u to λ = 10^u.
 */
import type { CompiledSystem } from './compile/compileModel.js';
import type { Trace } from './types.js';

/** The model with parameter k replaced by its base-10 logarithm (named `log10(NAME)` in messages). */
export function inLogParameter(system: CompiledSystem, k: number): CompiledSystem {
  const scratch = new Float64Array(system.np);
  // The model's parameters with λ = 10^u in place of u (one scratch vector: the calls never nest).
  const linear = (p: Float64Array): Float64Array => {
    scratch.set(p);
    scratch[k] = 10 ** p[k]!;
    return scratch;
  };
  const chain = (p: Float64Array, j: number, out: Float64Array) => {
    if (j !== k) return;
    const factor = 10 ** p[k]! * Math.LN10;
    for (let i = 0; i < out.length; i++) out[i]! *= factor;
  };
  return {
    ...system,
    info: {
      ...system.info,
      parameters: system.info.parameters.map((q, j) => (j === k ? { ...q, name: `log10(${q.name})`, value: Math.log10(q.value) } : q)),
    },
    rhs: (x, p, out) => system.rhs(x, linear(p), out),
    jacobian: (x, p, out) => system.jacobian(x, linear(p), out),
    paramDerivative: (x, p, j, out) => { system.paramDerivative(x, linear(p), j, out); chain(p, j, out); },
    secondDerivative: (x, p, u, v, out) => system.secondDerivative(x, linear(p), u, v, out),
    thirdDerivative: (x, p, u, v, w, out) => system.thirdDerivative(x, linear(p), u, v, w, out),
    mixedDerivative: (x, p, j, v, out) => { system.mixedDerivative(x, linear(p), j, v, out); chain(p, j, out); },
  };
}

/**
 * A trace computed with inLogParameter over [log10 from, log10 to]: parameter values back from u to
 * λ = 10^u, the ends of the range exactly as given (steps stay in decades).
 */
export function traceInParameter(trace: Trace, from: number, to: number): Trace {
  const back = (u: number) => (u === trace.settings.from ? from : u === trace.settings.to ? to : 10 ** u);
  return {
    ...trace,
    settings: { ...trace.settings, from, to },
    branches: trace.branches.map((b) => ({ ...b, points: b.points.map((q) => ({ ...q, parameter: back(q.parameter) })) })),
    events: trace.events.map((e) => ({ ...e, parameter: back(e.parameter) })),
  };
}
