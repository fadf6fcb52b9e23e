/**
 * The list of temporaries a compiled model evaluates, and the chain rule over it.
 *
 * Each definition becomes a temporary; so does each nonzero derivative of a temporary with
 * respect to a variable, created on first use and remembered, so that a shared subexpression
 * (a definition and its partial derivatives) is written and evaluated once per call however many
 * equations use it. Every temporary records the variables it depends on, transitively, so a
 * derivative with respect to anything else is 0 without looking at the expression.
 *
 * A temporary only refers to earlier ones, so index order is evaluation order.
 */
import { type DerivativeContext, differentiate } from './differentiate.js';
import { type CExpr, isLeaf, ZERO } from './ir.js';

export class Tape implements DerivativeContext {
  readonly temps: CExpr[] = [];
  private readonly tempDeps: ReadonlySet<number>[] = [];
  private readonly tempDerivatives = new Map<number, CExpr>();
  private readonly exprDerivatives = new WeakMap<CExpr, Map<number, CExpr>>();
  private readonly exprDeps = new WeakMap<CExpr, ReadonlySet<number>>();
  private readonly sharedFactors = new WeakMap<CExpr, Map<string, CExpr>>();

  /** n states (variables 0..n−1) and np parameters (variables n..n+np−1). */
  constructor(readonly n: number, readonly np: number) {}

  /** Append a temporary; returns its reference. */
  add(e: CExpr): CExpr {
    this.temps.push(e);
    this.tempDeps.push(this.dependencies(e));
    return { kind: 'temp', index: this.temps.length - 1 };
  }

  /** The variables `e` depends on, through temporaries. */
  dependencies(e: CExpr): ReadonlySet<number> {
    if (e.kind === 'temp') return this.tempDeps[e.index] ?? new Set();
    const known = this.exprDeps.get(e);
    if (known) return known;
    const found = new Set<number>();
    const visit = (u: CExpr): void => {
      switch (u.kind) {
        case 'num':
          return;
        case 'state':
          found.add(u.index);
          return;
        case 'param':
          found.add(u.index + this.n);
          return;
        case 'temp':
          for (const v of this.tempDeps[u.index] ?? []) found.add(v);
          return;
        case 'neg':
          return visit(u.arg);
        case 'bin':
          visit(u.left);
          return visit(u.right);
        case 'call':
          return u.args.forEach(visit);
        case 'select':
          [u.l, u.r, u.ifLe, u.ifGt].forEach(visit);
      }
    };
    visit(e);
    this.exprDeps.set(e, found);
    return found;
  }

  /** The states `e` depends on, ascending. */
  stateDependencies(e: CExpr): number[] {
    return [...this.dependencies(e)].filter((v) => v < this.n).sort((a, b) => a - b);
  }

  /** ∂e/∂(variable v), remembered per expression object. */
  derivative(e: CExpr, v: number): CExpr {
    if (!this.dependencies(e).has(v)) return ZERO;
    let memo = this.exprDerivatives.get(e);
    if (!memo) this.exprDerivatives.set(e, (memo = new Map()));
    const known = memo.get(v);
    if (known) return known;
    const d = differentiate(e, v, this);
    memo.set(v, d);
    return d;
  }

  shared(node: CExpr, purpose: string, build: () => CExpr): CExpr {
    let memo = this.sharedFactors.get(node);
    if (!memo) this.sharedFactors.set(node, (memo = new Map()));
    const known = memo.get(purpose);
    if (known) return known;
    const built = build();
    const ref = isLeaf(built) ? built : this.add(built);
    memo.set(purpose, ref);
    return ref;
  }

  readonly tempDerivative = (index: number, v: number): CExpr => {
    if (!this.tempDeps[index]?.has(v)) return ZERO;
    const key = index * (this.n + this.np) + v;
    const known = this.tempDerivatives.get(key);
    if (known) return known;
    const d = differentiate(this.temps[index]!, v, this);
    const ref = isLeaf(d) ? d : this.add(d);
    this.tempDerivatives.set(key, ref);
    return ref;
  };
}
