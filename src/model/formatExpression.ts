/**
 * Expr tree → text, and the names a tree uses.
 *
 * formatExpression prints text that parseExpression reads back to the same tree (positions aside),
 * adding parentheses only where precedence or associativity needs them. One exception: a number
 * node with a negative value prints as `(-2)`, which reads back as the negation of 2: the same
 * value, a different tree (the parser never makes negative number nodes).
 */
import type { Expr } from '../types.js';

/** Binding strength: sums 1, products 2, negation 3, powers 4, atoms and calls 5. */
function precedence(e: Expr): number {
  switch (e.kind) {
    case 'bin':
      return e.op === '+' || e.op === '-' ? 1 : e.op === '^' ? 4 : 2;
    case 'neg':
      return 3;
    case 'num':
      return e.value < 0 || Object.is(e.value, -0) ? 3 : 5;
    default:
      return 5;
  }
}

function wrap(text: string, needed: boolean): string {
  return needed ? `(${text})` : text;
}

function formatNumber(value: number): string {
  return value < 0 || Object.is(value, -0) ? `(-${String(-value)})` : String(value);
}

export function formatExpression(e: Expr): string {
  switch (e.kind) {
    case 'num':
      return formatNumber(e.value);
    case 'sym':
      return e.name;
    case 'call':
      return `${e.fn}(${e.args.map(formatExpression).join(', ')})`;
    case 'neg':
      // `-(-x)` rather than `--x`: both parse the same, the first reads better.
      return `-${wrap(formatExpression(e.arg), precedence(e.arg) <= 3)}`;
    case 'bin': {
      const p = precedence(e);
      const left = formatExpression(e.left);
      const right = formatExpression(e.right);
      if (e.op === '^') {
        // The base must be an atom; the exponent is parsed as a unary, so signs and powers need no parentheses.
        return `${wrap(left, precedence(e.left) <= 4)}^${wrap(right, precedence(e.right) < 3)}`;
      }
      return `${wrap(left, precedence(e.left) < p)} ${e.op} ${wrap(right, precedence(e.right) <= p)}`;
    }
  }
}

/** Every symbol name the tree uses (constants are numbers by now, functions are not symbols). */
export function symbolsOf(e: Expr): Set<string> {
  const names = new Set<string>();
  const stack: Expr[] = [e];
  for (let node = stack.pop(); node !== undefined; node = stack.pop()) {
    if (node.kind === 'sym') names.add(node.name);
    else if (node.kind === 'neg') stack.push(node.arg);
    else if (node.kind === 'bin') stack.push(node.left, node.right);
    else if (node.kind === 'call') stack.push(...node.args);
  }
  return names;
}
