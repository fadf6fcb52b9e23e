/**
 * The compile stage's private expression tree. It is the user's `Expr` with every name replaced
 * by an index (so no user text can reach generated code) plus one node kind that never comes from
 * user text:
 *
 *   select(l, r, a, b) = a when l ≤ r, b when l > r, NaN when l or r is NaN.
 *
 * `select` carries the one-sided derivatives of abs, min and max (see differentiate.ts).
 * Variables are numbered states first, then parameters: variable v is x[v] for v < n, else p[v − n].
 */
import type { BinaryOperator, FunctionName } from '../types.js';

export type CExpr =
  | { kind: 'num'; value: number }
  /** A state (x[index]) or parameter (p[index]). */
  | { kind: 'state'; index: number }
  | { kind: 'param'; index: number }
  /** A temporary: a definition, or a derivative of one (t<index> in generated code). */
  | { kind: 'temp'; index: number }
  | { kind: 'neg'; arg: CExpr }
  | { kind: 'bin'; op: BinaryOperator; left: CExpr; right: CExpr }
  | { kind: 'call'; fn: UnaryFunction | 'min' | 'max'; args: CExpr[] }
  | { kind: 'select'; l: CExpr; r: CExpr; ifLe: CExpr; ifGt: CExpr };

/** Functions of one argument (pow becomes `^`, min and max have two). */
export type UnaryFunction = Exclude<FunctionName, 'min' | 'max' | 'pow'>;

export const ZERO: CExpr = { kind: 'num', value: 0 };
export const ONE: CExpr = { kind: 'num', value: 1 };

export function num(value: number): CExpr {
  return { kind: 'num', value };
}

export function isNum(e: CExpr, value?: number): e is { kind: 'num'; value: number } {
  return e.kind === 'num' && (value === undefined || Object.is(e.value, value) || e.value === value);
}

/** Leaves that cost nothing to repeat: numbers and references. */
export function isLeaf(e: CExpr): boolean {
  return e.kind === 'num' || e.kind === 'state' || e.kind === 'param' || e.kind === 'temp';
}

/** Same leaf (number with the same value, or reference to the same slot); false for other nodes. */
export function sameLeaf(a: CExpr, b: CExpr): boolean {
  if (a.kind === 'num' && b.kind === 'num') return Object.is(a.value, b.value);
  if ((a.kind === 'state' || a.kind === 'param' || a.kind === 'temp') && a.kind === b.kind) {
    return a.index === b.index;
  }
  return false;
}
