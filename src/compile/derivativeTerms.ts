/**
 * The nonzero higher partial derivatives of f as sparse term lists, for the multilinear forms
 *
 *   B_i(u, v)    = Σ_jk  ∂²f_i/∂x_j∂x_k u_j v_k
 *   C_i(u, v, w) = Σ_jkl ∂³f_i/∂x_j∂x_k∂x_l u_j v_k w_l
 *   (∂J/∂p_k v)_i = Σ_j  ∂²f_i/∂x_j∂p_k v_j
 *
 * Partial derivatives commute, so each term is kept once, for ascending state indices, and the
 * form sums it over the distinct orderings of those indices. Candidates are found by following
 * dependencies (∂f_i/∂x_j only depends on some states), so the work grows with the nonzero terms.
 */
import { type CExpr, isNum } from './ir.js';
import type { Tape } from './tape.js';

export interface DerivativeTerm {
  row: number;
  /** Ascending state indices j ≤ k (≤ l). */
  states: number[];
  coefficient: CExpr;
}

/**
 * All nonzero terms of the given order (2 or 3), or null once more than `limit` candidate terms
 * have been looked at (the caller then falls back to finite differences).
 */
export function stateDerivativeTerms(
  tape: Tape, equations: readonly CExpr[], order: 2 | 3, limit: number,
): DerivativeTerm[] | null {
  let frontier: DerivativeTerm[] = equations.map((f, row) => ({ row, states: [], coefficient: f }));
  let looked = 0;
  for (let level = 0; level < order; level++) {
    const next: DerivativeTerm[] = [];
    // The frontier is in row order, so duplicates (the same states in another order) share a row.
    let seen = new Set<number>();
    let row = -1;
    for (const term of frontier) {
      if (term.row !== row) [row, seen] = [term.row, new Set()];
      for (const j of tape.stateDependencies(term.coefficient)) {
        const states = [...term.states, j].sort((a, b) => a - b);
        const key = states.reduce((k, s) => k * tape.n + s, 0);
        if (seen.has(key)) continue;
        seen.add(key);
        if (++looked > limit) return null;
        const coefficient = partial(tape, equations[term.row]!, states);
        if (!isNum(coefficient, 0)) next.push({ row: term.row, states, coefficient });
      }
    }
    frontier = next;
  }
  return frontier;
}

/** Terms ∂²f_i/∂x_j∂p_k (states: [j]) for parameter k. */
export function mixedDerivativeTerms(tape: Tape, equations: readonly CExpr[], k: number): DerivativeTerm[] {
  const terms: DerivativeTerm[] = [];
  equations.forEach((f, row) => {
    const dfdp = tape.derivative(f, tape.n + k);
    for (const j of tape.stateDependencies(dfdp)) {
      const coefficient = tape.derivative(tape.derivative(f, j), tape.n + k);
      if (!isNum(coefficient, 0)) terms.push({ row, states: [j], coefficient });
    }
  });
  return terms;
}

/** ∂f/∂x_a∂x_b… taken in ascending order, so every ordering reuses the same remembered steps. */
function partial(tape: Tape, f: CExpr, states: readonly number[]): CExpr {
  return states.reduce((e, j) => tape.derivative(e, j), f);
}

/** The distinct orderings of a short list of indices (1, 3 or 6 of them for three indices). */
export function distinctOrderings(indices: readonly number[]): number[][] {
  if (indices.length <= 1) return [[...indices]];
  const result = new Map<string, number[]>();
  indices.forEach((first, i) => {
    const rest = indices.filter((_, k) => k !== i);
    for (const tail of distinctOrderings(rest)) {
      const ordering = [first, ...tail];
      result.set(ordering.join(','), ordering);
    }
  });
  return [...result.values()];
}
