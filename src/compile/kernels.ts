/**
 * The generated functions of a lowered model: f, its Jacobian, ∂f/∂p_k, and the multilinear
 * forms from sparse term lists. Each writes into `out` and allocates nothing.
 */
import { KernelWriter, type VectorFactor } from './codegen.js';
import { type DerivativeTerm, distinctOrderings } from './derivativeTerms.js';
import { isNum } from './ir.js';
import type { LoweredModel } from './lower.js';

export type VectorFn = (x: Float64Array, p: Float64Array, out: Float64Array) => void;
export type MixedFn = (x: Float64Array, p: Float64Array, v: Float64Array, out: Float64Array) => void;
export type SecondFn = (x: Float64Array, p: Float64Array, u: Float64Array, v: Float64Array, out: Float64Array) => void;
export type ThirdFn = (
  x: Float64Array, p: Float64Array, u: Float64Array, v: Float64Array, w: Float64Array, out: Float64Array,
) => void;

export function rhsKernel({ tape, equations }: LoweredModel): { fn: VectorFn; source: string } {
  const writer = new KernelWriter(tape);
  equations.forEach((f, i) => writer.set(i, f));
  return writer.build<VectorFn>(['x', 'p', 'out']);
}

/** J[i·n + j] = ∂f_i/∂x_j; zero-filled, then only the structurally nonzero entries are written. */
export function jacobianKernel({ tape, equations }: LoweredModel): { fn: VectorFn; source: string } {
  const writer = new KernelWriter(tape);
  writer.zeroFill();
  equations.forEach((f, i) => {
    for (const j of tape.stateDependencies(f)) {
      const d = tape.derivative(f, j);
      if (!isNum(d, 0)) writer.set(i * tape.n + j, d);
    }
  });
  return writer.build<VectorFn>(['x', 'p', 'out']);
}

/** out[i] = ∂f_i/∂p_k. */
export function paramDerivativeKernel({ tape, equations }: LoweredModel, k: number): VectorFn {
  const writer = new KernelWriter(tape);
  writer.zeroFill();
  equations.forEach((f, i) => {
    const d = tape.derivative(f, tape.n + k);
    if (!isNum(d, 0)) writer.set(i, d);
  });
  return writer.build<VectorFn>(['x', 'p', 'out']).fn;
}

/**
 * out_i = Σ over terms of row i: coefficient · Σ over distinct orderings σ of the term's states of
 * Π_m vector_m[σ_m], with vectors (u, v, w) for second and third order, (v) for the mixed form.
 */
export function formKernel<F>(
  lowered: LoweredModel, terms: readonly DerivativeTerm[], vectors: readonly ('u' | 'v' | 'w')[],
): F {
  const writer = new KernelWriter(lowered.tape);
  writer.zeroFill();
  for (const term of terms) {
    const products = distinctOrderings(term.states).map((ordering) =>
      ordering.map((j, m): VectorFactor => [vectors[m]!, j]));
    writer.addProducts(term.row, term.coefficient, products);
  }
  return writer.build<F>(['x', 'p', ...vectors, 'out']).fn;
}
