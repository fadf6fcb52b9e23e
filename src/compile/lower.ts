/**
 * Model → the compile stage's tree: each name becomes an index (state, parameter or the
 * definition's temporary), `pow(a, b)` becomes `a ^ b`, and min/max of more than two arguments
 * become nested pairs. After this step no user text is left in anything that reaches codegen.
 */
import { message, ModelError, where } from '../errors.js';
import type { Expr, Model, SourceRef } from '../types.js';
import type { CExpr } from './ir.js';
import { binary, call, minMax, neg } from './simplify.js';
import { Tape } from './tape.js';

export interface LoweredModel {
  tape: Tape;
  /** f_i, in the order of the model's states. */
  equations: CExpr[];
}

export function lowerModel(model: Model): LoweredModel {
  const tape = new Tape(model.states.length, model.parameters.length);
  const names = new Map<string, CExpr>();
  model.states.forEach((s, index) => names.set(s.name, { kind: 'state', index }));
  model.parameters.forEach((q, index) => names.set(q.name, { kind: 'param', index }));
  for (const d of model.definitions) {
    names.set(d.name, tape.add(lowerExpr(d.expr, names, d.where)));
  }
  const equations = model.equations.map((eq) => lowerExpr(eq.expr, names, eq.where));
  return { tape, equations };
}

/** Where a node is in the file: the expression's own place, moved right by the node's offset. */
function nodeWhere(e: Expr, at: SourceRef): string {
  return where(e.pos ? { ...at, column: at.column + e.pos.offset - 1 } : at);
}

function lowerExpr(e: Expr, names: ReadonlyMap<string, CExpr>, at: SourceRef): CExpr {
  const lower = (u: Expr): CExpr => lowerExpr(u, names, at);
  switch (e.kind) {
    case 'num':
      if (!Number.isFinite(e.value)) throw new ModelError(message.compileNonFiniteNumber(nodeWhere(e, at), e.value));
      return { kind: 'num', value: e.value };
    case 'sym': {
      const found = names.get(e.name);
      if (!found) throw new ModelError(message.compileUnknownName(nodeWhere(e, at), e.name));
      return found;
    }
    case 'neg':
      return neg(lower(e.arg));
    case 'bin':
      return binary(e.op, lower(e.left), lower(e.right));
    case 'call': {
      const args = e.args.map(lower);
      const [a, b] = args;
      if (e.fn === 'min' || e.fn === 'max') {
        if (a === undefined) throw new ModelError(message.compileArgumentCount(nodeWhere(e, at), e.fn, 'at least 1', 0));
        return args.slice(1).reduce((acc, u) => minMax(e.fn as 'min' | 'max', acc, u), a);
      }
      const expected = e.fn === 'pow' ? 2 : 1;
      if (args.length !== expected || a === undefined) {
        throw new ModelError(message.compileArgumentCount(nodeWhere(e, at), e.fn, String(expected), args.length));
      }
      return e.fn === 'pow' ? binary('^', a, b!) : call(e.fn, a);
    }
  }
}
