/**
 * Symbolic derivative of a compile-stage expression with respect to one variable, built through
 * the simplifying constructors so that derivatives stay small and the derivative of anything that
 * does not depend on the variable is exactly 0.
 *
 * Temporaries (definitions) are not expanded: their derivative is asked of the context, which
 * returns another temporary or 0 (the chain rule, see tape.ts). The outer factor of a function's
 * derivative (cos u for sin u, w·u^(w−1) for u^w) is made a shared temporary too, so a Jacobian
 * row evaluates it once instead of once per entry.
 *
 * Where abs, min and max switch, the derivative is one-sided by convention:
 *   abs(u)'    = (u ≥ 0 ? 1 : −1)·u'     at u = 0: the derivative of the branch +u
 *   min(a, b)' = (a ≤ b ? a' : b')       at a = b: the first argument's derivative
 *   max(a, b)' = (a ≥ b ? a' : b')       at a = b: the first argument's derivative
 */
import { type CExpr, isNum, num, ONE, type UnaryFunction, ZERO } from './ir.js';
import { add, call, div, mul, neg, pow, select, sub } from './simplify.js';

export interface DerivativeContext {
  /** Number of states: variable v < n is x[v], otherwise p[v − n]. */
  readonly n: number;
  /** Derivative of temporary `index` with respect to variable `v` (0 when it does not depend on it). */
  tempDerivative(index: number, v: number): CExpr;
  /** `build()` for this node and purpose, built once and kept as a temporary unless it is a leaf. */
  shared(node: CExpr, purpose: 'outer' | 'power', build: () => CExpr): CExpr;
}

export function differentiate(e: CExpr, v: number, ctx: DerivativeContext): CExpr {
  const d = (u: CExpr): CExpr => differentiate(u, v, ctx);
  switch (e.kind) {
    case 'num':
      return ZERO;
    case 'state':
      return e.index === v ? ONE : ZERO;
    case 'param':
      return e.index + ctx.n === v ? ONE : ZERO;
    case 'temp':
      return ctx.tempDerivative(e.index, v);
    case 'neg':
      return neg(d(e.arg));
    case 'bin':
      return binaryDerivative(e, d(e.left), d(e.right), ctx);
    case 'select':
      return select(e.l, e.r, d(e.ifLe), d(e.ifGt));
    case 'call': {
      const [a, b] = e.args as [CExpr, CExpr?];
      if (e.fn === 'min') return select(a, b ?? a, d(a), d(b ?? a));
      if (e.fn === 'max') return select(b ?? a, a, d(a), d(b ?? a));
      const fn = e.fn;
      const da = d(a);
      return isNum(da, 0) ? ZERO : mul(ctx.shared(e, 'outer', () => outerDerivative(fn, a, e)), da);
    }
  }
}

/** f'(u) for f(u) = `whole`, u = a. */
function outerDerivative(fn: UnaryFunction, a: CExpr, whole: CExpr): CExpr {
  switch (fn) {
    case 'exp':
      return whole;
    case 'log':
      return div(ONE, a);
    case 'sqrt':
      return div(num(0.5), whole);
    case 'sin':
      return call('cos', a);
    case 'cos':
      return neg(call('sin', a));
    case 'tan':
      return div(ONE, pow(call('cos', a), num(2)));
    case 'tanh':
      return sub(ONE, pow(whole, num(2)));
    case 'sinh':
      return call('cosh', a);
    case 'cosh':
      return call('sinh', a);
    case 'abs':
      return select(ZERO, a, ONE, num(-1));
  }
}

function binaryDerivative(e: CExpr & { kind: 'bin' }, du: CExpr, dw: CExpr, ctx: DerivativeContext): CExpr {
  const { left: u, right: w } = e;
  switch (e.op) {
    case '+':
      return add(du, dw);
    case '-':
      return sub(du, dw);
    case '*':
      return add(mul(du, w), mul(u, dw));
    case '/':
      // (u/w)' = u'/w − u·w'/w²
      if (isNum(dw, 0)) return div(du, w);
      return sub(div(du, w), div(mul(u, dw), pow(w, num(2))));
    default:
      return powerDerivative(e, du, dw, ctx);
  }
}

/**
 * (u^w)': power rule when w does not depend on the variable (w·u^(w−1)·u', also at u = 0);
 * u^w·ln(u)·w' when u does not; otherwise u^w·(w'·ln u + w·u'/u).
 */
function powerDerivative(e: CExpr & { kind: 'bin' }, du: CExpr, dw: CExpr, ctx: DerivativeContext): CExpr {
  const { left: u, right: w } = e;
  if (isNum(dw, 0)) return mul(ctx.shared(e, 'power', () => mul(w, pow(u, sub(w, ONE)))), du);
  const whole = pow(u, w);
  if (isNum(du, 0)) return mul(mul(whole, call('log', u)), dw);
  return mul(whole, add(mul(dw, call('log', u)), div(mul(w, du), u)));
}
