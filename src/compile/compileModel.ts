/**
 * Stage 2: Model → System. Lowers the model (names → indices), then generates f and its exact
 * Jacobian at once, and each other derivative on its first use (a `check` or a sweep of a large
 * model never pays for third derivatives it does not need).
 *
 * Second and third derivatives are symbolic unless the model has more than `termLimit` candidate
 * terms of that order; then they come from central differences of the exact Jacobian, and
 * `derivativeMethod` says so.
 */
import type { Model, ModelInfo, SourceRef, System } from '../types.js';
import { mixedDerivativeTerms, stateDerivativeTerms } from './derivativeTerms.js';
import { finiteDifferenceForms } from './finiteDifferenceForms.js';
import {
  formKernel, jacobianKernel, type MixedFn, paramDerivativeKernel, rhsKernel, type SecondFn, type ThirdFn,
  type VectorFn,
} from './kernels.js';
import { lowerModel } from './lower.js';

/** Above this many candidate terms of one order, fall back to finite differences. Common practice. */
export const SYMBOLIC_TERM_LIMIT = 200_000;

export type DerivativeMethod = 'symbolic' | 'finite differences of the exact Jacobian' | 'not compiled yet';

export interface CompiledSystem extends System {
  /** Where each equation is written, in the order of the states (for messages). */
  readonly equationSources: readonly SourceRef[];
  /** How second and third derivatives are computed; decided on their first use. */
  readonly derivativeMethod: { second: DerivativeMethod; third: DerivativeMethod };
}

export interface CompileOptions {
  termLimit?: number;
}

export function compileModel(model: Model, options: CompileOptions = {}): CompiledSystem {
  const termLimit = options.termLimit ?? SYMBOLIC_TERM_LIMIT;
  const lowered = lowerModel(model);
  const n = model.states.length;
  const np = model.parameters.length;
  const rhs = rhsKernel(lowered).fn;
  const jacobian = jacobianKernel(lowered).fn;
  const paramKernels: (VectorFn | undefined)[] = [];
  const mixedKernels: (MixedFn | undefined)[] = [];
  const method = { second: 'not compiled yet' as DerivativeMethod, third: 'not compiled yet' as DerivativeMethod };
  let fallback: ReturnType<typeof finiteDifferenceForms> | undefined;
  let second: SecondFn | undefined;
  let third: ThirdFn | undefined;

  const finiteDifferences = () => (fallback ??= finiteDifferenceForms(jacobian, n));

  function compileSecond(): SecondFn {
    const terms = stateDerivativeTerms(lowered.tape, lowered.equations, 2, termLimit);
    method.second = terms ? 'symbolic' : 'finite differences of the exact Jacobian';
    return terms ? formKernel<SecondFn>(lowered, terms, ['u', 'v']) : finiteDifferences().second;
  }

  function compileThird(): ThirdFn {
    const terms = stateDerivativeTerms(lowered.tape, lowered.equations, 3, termLimit);
    method.third = terms ? 'symbolic' : 'finite differences of the exact Jacobian';
    return terms ? formKernel<ThirdFn>(lowered, terms, ['u', 'v', 'w']) : finiteDifferences().third;
  }

  return {
    info: modelInfo(model),
    n,
    np,
    equationSources: model.equations.map((eq) => eq.where),
    derivativeMethod: method,
    rhs,
    jacobian,
    paramDerivative(x, p, k, out) {
      (paramKernels[parameterIndex(k, np)] ??= paramDerivativeKernel(lowered, k))(x, p, out);
    },
    mixedDerivative(x, p, k, v, out) {
      const kernel = (mixedKernels[parameterIndex(k, np)] ??=
        formKernel<MixedFn>(lowered, mixedDerivativeTerms(lowered.tape, lowered.equations, k), ['v']));
      kernel(x, p, v, out);
    },
    secondDerivative(x, p, u, v, out) {
      (second ??= compileSecond())(x, p, u, v, out);
    },
    thirdDerivative(x, p, u, v, w, out) {
      (third ??= compileThird())(x, p, u, v, w, out);
    },
  };
}

function parameterIndex(k: number, np: number): number {
  if (!Number.isInteger(k) || k < 0 || k >= np) throw new RangeError(`internal: parameter index ${k} of ${np}`);
  return k;
}

/** Names and metadata, no expressions. */
export function modelInfo(model: Model): ModelInfo {
  const optional = (o: { unit?: string; about?: string }) => ({
    ...(o.unit !== undefined && { unit: o.unit }),
    ...(o.about !== undefined && { about: o.about }),
  });
  return {
    file: model.file,
    ...(model.title !== undefined && { title: model.title }),
    ...(model.about !== undefined && { about: model.about }),
    states: model.states.map((s) => ({
      name: s.name, start: s.start,
      ...(s.min !== undefined && { min: s.min }),
      ...(s.max !== undefined && { max: s.max }),
      ...optional(s),
    })),
    parameters: model.parameters.map((q) => ({ name: q.name, value: q.value, ...optional(q) })),
  };
}
