/**
 * Name resolution: every symbol is a declared name, and each definition uses only earlier ones.
 * A definition that uses a later one is either part of a cycle (reported with its path) or simply
 * used before it is defined.
 */
import { message } from '../errors.js';
import type { Expr } from '../types.js';
import type { ModelSource } from './modelSource.js';
import { placeOf, type ModelExpression } from './readExpression.js';

type SymNode = Extract<Expr, { kind: 'sym' }>;

/** The symbol nodes of a tree in text order. */
function symbolNodes(e: Expr): SymNode[] {
  const found: SymNode[] = [];
  const stack: Expr[] = [e];
  for (let node = stack.pop(); node !== undefined; node = stack.pop()) {
    if (node.kind === 'sym') found.push(node);
    else if (node.kind === 'neg') stack.push(node.arg);
    else if (node.kind === 'bin') stack.push(node.right, node.left);
    else if (node.kind === 'call') stack.push(...[...node.args].reverse());
  }
  return found;
}

/** Every symbol of every expression is in `known` (states, parameters, definitions). */
export function checkSymbols(source: ModelSource, section: string, list: readonly ModelExpression[], known: readonly string[]): void {
  const knownSet = new Set(known);
  for (const item of list) {
    const bad = symbolNodes(item.expr).find((s) => !knownSet.has(s.name));
    if (bad) {
      const what = message.modelInExpression(message.modelUnknownSymbol(bad.name, known), section, item.name);
      throw source.error(placeOf(item, bad.pos?.offset ?? 1), what);
    }
  }
}

/** Shortest chain of definition names from `from` to `to` following "uses", or null. */
function usePath(uses: readonly (readonly number[])[], names: readonly string[], from: number, to: number): string[] | null {
  const parent = new Map<number, number>([[from, -1]]);
  const queue = [from];
  for (let k = 0; k < queue.length; k++) {
    const at = queue[k]!;
    if (at === to) {
      const path: string[] = [];
      for (let i = at; i !== -1; i = parent.get(i)!) path.unshift(names[i]!);
      return path;
    }
    for (const next of uses[at] ?? []) {
      if (!parent.has(next)) {
        parent.set(next, at);
        queue.push(next);
      }
    }
  }
  return null;
}

/** Each definition uses only definitions above it; otherwise a cycle or a use before definition. */
export function checkDefinitionOrder(source: ModelSource, definitions: readonly ModelExpression[]): void {
  const names = definitions.map((d) => d.name);
  const index = new Map(names.map((n, i) => [n, i]));
  const uses = definitions.map((d) =>
    [...new Set(symbolNodes(d.expr).map((s) => index.get(s.name)))].filter((i): i is number => i !== undefined),
  );
  definitions.forEach((d, i) => {
    for (const s of symbolNodes(d.expr)) {
      const j = index.get(s.name);
      if (j === undefined || j < i) continue;
      const cycle = usePath(uses, names, j, i);
      const what = cycle
        ? message.modelDefinitionCycle([d.name, ...cycle])
        : message.modelUsedBeforeDefined(s.name);
      throw source.error(placeOf(d, s.pos?.offset ?? 1), message.modelInExpression(what, 'definitions', d.name));
    }
  });
}
