/**
 * Building blocks that simplify as they build: constant folding (only when the result is finite,
 * so an overflow stays visible at run time), x + 0, x − 0, 0 − x, x·0, x·1, x·(−1), 0/x, x/1,
 * x^0, x^1, −(−x), and select with equal branches. `x·0 → 0` drops a NaN that x might produce;
 * the value itself (rhs) still reports it.
 */
import type { BinaryOperator } from '../types.js';
import { type CExpr, isNum, num, ONE, sameLeaf, type UnaryFunction, ZERO } from './ir.js';
import { FUNCTION_VALUES } from './functionValues.js';

function folded(value: number, otherwise: () => CExpr): CExpr {
  return Number.isFinite(value) ? num(value) : otherwise();
}

export function neg(a: CExpr): CExpr {
  if (a.kind === 'num') return num(-a.value);
  if (a.kind === 'neg') return a.arg;
  return { kind: 'neg', arg: a };
}

export function add(a: CExpr, b: CExpr): CExpr {
  if (a.kind === 'num' && b.kind === 'num') return folded(a.value + b.value, () => bin('+', a, b));
  if (isNum(a, 0)) return b;
  if (isNum(b, 0)) return a;
  if (b.kind === 'neg') return sub(a, b.arg);
  if (a.kind === 'neg') return sub(b, a.arg);
  return bin('+', a, b);
}

export function sub(a: CExpr, b: CExpr): CExpr {
  if (a.kind === 'num' && b.kind === 'num') return folded(a.value - b.value, () => bin('-', a, b));
  if (isNum(b, 0)) return a;
  if (isNum(a, 0)) return neg(b);
  if (b.kind === 'neg') return add(a, b.arg);
  return bin('-', a, b);
}

export function mul(a: CExpr, b: CExpr): CExpr {
  if (a.kind === 'num' && b.kind === 'num') return folded(a.value * b.value, () => bin('*', a, b));
  if (isNum(a, 0) || isNum(b, 0)) return ZERO;
  if (isNum(a, 1)) return b;
  if (isNum(b, 1)) return a;
  if (isNum(a, -1)) return neg(b);
  if (isNum(b, -1)) return neg(a);
  if (a.kind === 'neg') return neg(mul(a.arg, b));
  if (b.kind === 'neg') return neg(mul(a, b.arg));
  return bin('*', a, b);
}

export function div(a: CExpr, b: CExpr): CExpr {
  if (a.kind === 'num' && b.kind === 'num') return folded(a.value / b.value, () => bin('/', a, b));
  if (isNum(a, 0)) return ZERO;
  if (isNum(b, 1)) return a;
  if (a.kind === 'neg') return neg(div(a.arg, b));
  return bin('/', a, b);
}

export function pow(a: CExpr, b: CExpr): CExpr {
  if (a.kind === 'num' && b.kind === 'num') return folded(Math.pow(a.value, b.value), () => bin('^', a, b));
  if (isNum(b, 0)) return ONE;
  if (isNum(b, 1)) return a;
  return bin('^', a, b);
}

export function call(fn: UnaryFunction, arg: CExpr): CExpr {
  if (arg.kind === 'num') return folded(FUNCTION_VALUES[fn](arg.value), () => ({ kind: 'call', fn, args: [arg] }));
  return { kind: 'call', fn, args: [arg] };
}

export function minMax(fn: 'min' | 'max', a: CExpr, b: CExpr): CExpr {
  if (a.kind === 'num' && b.kind === 'num') return num(Math[fn](a.value, b.value));
  return { kind: 'call', fn, args: [a, b] };
}

export function select(l: CExpr, r: CExpr, ifLe: CExpr, ifGt: CExpr): CExpr {
  // Folded numbers are finite, so the comparison is decided.
  if (l.kind === 'num' && r.kind === 'num') return l.value <= r.value ? ifLe : ifGt;
  if (sameLeaf(ifLe, ifGt)) return ifLe;
  return { kind: 'select', l, r, ifLe, ifGt };
}

const BUILD: Record<BinaryOperator, (a: CExpr, b: CExpr) => CExpr> = { '+': add, '-': sub, '*': mul, '/': div, '^': pow };

export function binary(op: BinaryOperator, a: CExpr, b: CExpr): CExpr {
  return BUILD[op](a, b);
}

function bin(op: BinaryOperator, left: CExpr, right: CExpr): CExpr {
  return { kind: 'bin', op, left, right };
}
