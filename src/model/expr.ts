/**
 * Expression text → Expr tree, by recursive descent over this grammar (lowest precedence first):
 *
 *   sum     := product (('+' | '-') product)*          left-associative
 *   product := unary (('*' | '/') unary)*              left-associative
 *   unary   := ('-' | '+') unary | power               so -x^2 = -(x^2)
 *   power   := primary ('^' unary)?                    right-associative; 2^-1 is allowed
 *   primary := number | name | function '(' args ')' | '(' sum ')'
 *
 * Functions are the closed set FUNCTION_NAMES: pow takes exactly 2 arguments, min and max take
 * 2 or more, the others exactly 1. The constants `pi` and `e` become number nodes; unary plus
 * leaves no node. Nesting (parentheses, unary signs, calls, exponents) deeper than MAX_NESTING
 * and trees taller than MAX_HEIGHT are rejected before any recursion can overflow the stack.
 * Every node carries `pos.offset`, the 1-based column of its first character in the text.
 */
import { message } from '../errors.js';
import { CONSTANTS, FUNCTION_NAMES, isFunctionName, type Expr, type FunctionName } from '../types.js';
import { ExpressionSyntaxError } from './expressionSyntaxError.js';
import { tokenize, type Token } from './tokenize.js';

export { ExpressionSyntaxError } from './expressionSyntaxError.js';
export { formatExpression, symbolsOf } from './formatExpression.js';

/** Most nested parentheses, signs, calls and exponents. Common practice (no model needs more). */
export const MAX_NESTING = 64;
/** Tallest tree (long chains such as a+b+c+... count one level per operator). Common practice. */
export const MAX_HEIGHT = 1000;

/** Parse one expression; throws ExpressionSyntaxError with the 1-based column of the problem. */
export function parseExpression(text: string): Expr {
  return new Parser(tokenize(text)).parseAll();
}

function argumentCountOk(fn: FunctionName, n: number): [boolean, string] {
  if (fn === 'min' || fn === 'max') return [n >= 2, '2 or more'];
  if (fn === 'pow') return [n === 2, '2'];
  return [n === 1, '1'];
}

class Parser {
  private i = 0;
  private depth = 0;
  private readonly heights = new WeakMap<Expr, number>();

  constructor(private readonly tokens: readonly Token[]) {}

  parseAll(): Expr {
    const first = this.peek();
    if (first.kind === 'end') throw new ExpressionSyntaxError(1, message.exprEmpty());
    const e = this.sum();
    const t = this.peek();
    if (t.kind !== 'end') throw this.unexpected(t);
    return e;
  }

  private peek(): Token {
    return this.tokens[this.i]!;
  }

  private next(): Token {
    const t = this.tokens[this.i]!;
    if (t.kind !== 'end') this.i++;
    return t;
  }

  private isOp(...ops: string[]): boolean {
    const t = this.peek();
    return t.kind === 'op' && ops.includes(t.text);
  }

  /** Records the node's height and rejects trees taller than MAX_HEIGHT. */
  private node<T extends Expr>(e: T, children: readonly Expr[]): T {
    let h = 0;
    for (const c of children) h = Math.max(h, this.heights.get(c) ?? 1);
    if (h + 1 > MAX_HEIGHT) throw new ExpressionSyntaxError(e.pos?.offset ?? 1, message.exprTooLarge(MAX_HEIGHT));
    this.heights.set(e, h + 1);
    return e;
  }

  private nested<T>(offset: number, inner: () => T): T {
    if (++this.depth > MAX_NESTING) throw new ExpressionSyntaxError(offset, message.exprTooDeep(MAX_NESTING));
    const result = inner();
    this.depth--;
    return result;
  }

  /** What went wrong when `t` follows a complete operand. */
  private unexpected(t: Token): ExpressionSyntaxError {
    if (t.kind === ')') return new ExpressionSyntaxError(t.offset, message.exprUnopened());
    if (t.kind === ',') return new ExpressionSyntaxError(t.offset, message.exprStrayComma());
    return new ExpressionSyntaxError(t.offset, message.exprImplicitMultiplication(t.text));
  }

  private binaryChain(ops: string[], operand: () => Expr): Expr {
    const start = this.peek().offset;
    let left = operand();
    while (this.isOp(...ops)) {
      const op = this.next().text as '+' | '-' | '*' | '/';
      const right = operand();
      left = this.node({ kind: 'bin', op, left, right, pos: { offset: start } }, [left, right]);
    }
    return left;
  }

  private sum(): Expr {
    return this.binaryChain(['+', '-'], () => this.product());
  }

  private product(): Expr {
    return this.binaryChain(['*', '/'], () => this.unary());
  }

  private unary(): Expr {
    if (!this.isOp('-', '+')) return this.power();
    const sign = this.next();
    const arg = this.nested(sign.offset, () => this.unary());
    if (sign.text === '+') return arg;
    return this.node({ kind: 'neg', arg, pos: { offset: sign.offset } }, [arg]);
  }

  private power(): Expr {
    const start = this.peek().offset;
    const base = this.primary();
    if (!this.isOp('^')) return base;
    const caret = this.next();
    const exponent = this.nested(caret.offset, () => this.unary());
    return this.node({ kind: 'bin', op: '^', left: base, right: exponent, pos: { offset: start } }, [base, exponent]);
  }

  private primary(): Expr {
    const t = this.next();
    const pos = { offset: t.offset };
    if (t.kind === 'num') return this.node({ kind: 'num', value: Number(t.text), pos }, []);
    if (t.kind === 'name') {
      if (this.peek().kind === '(') return this.call(t);
      if (isFunctionName(t.text)) throw new ExpressionSyntaxError(t.offset, message.exprFunctionAsValue(t.text));
      const constant = CONSTANTS[t.text];
      if (constant !== undefined && Object.hasOwn(CONSTANTS, t.text)) {
        return this.node({ kind: 'num', value: constant, pos }, []);
      }
      return this.node({ kind: 'sym', name: t.text, pos }, []);
    }
    if (t.kind === '(') return this.nested(t.offset, () => this.group(t));
    throw this.missingOperand(t);
  }

  private missingOperand(t: Token): ExpressionSyntaxError {
    const prev = this.tokens[this.i - 1];
    if (t.kind === 'end' && prev) return new ExpressionSyntaxError(prev.offset, message.exprMissingOperand(prev.text));
    const before = prev === t ? this.tokens[this.i - 2] : prev;
    if (before) return new ExpressionSyntaxError(t.offset, message.exprMissingOperand(before.text));
    if (t.kind === ')') return new ExpressionSyntaxError(t.offset, message.exprUnopened());
    if (t.kind === ',') return new ExpressionSyntaxError(t.offset, message.exprStrayComma());
    return new ExpressionSyntaxError(t.offset, message.exprLeadingOperator(t.text));
  }

  private group(open: Token): Expr {
    const e = this.sum();
    this.close(open);
    return e;
  }

  /** Consume the `)` that matches `open`. */
  private close(open: Token): void {
    const t = this.peek();
    if (t.kind === 'end') throw new ExpressionSyntaxError(open.offset, message.exprUnclosed());
    if (t.kind !== ')') throw this.unexpected(t);
    this.next();
  }

  private call(name: Token): Expr {
    const fn = name.text;
    if (!isFunctionName(fn)) {
      if (Object.hasOwn(CONSTANTS, fn)) throw new ExpressionSyntaxError(name.offset, message.exprNotAFunction(fn));
      throw new ExpressionSyntaxError(name.offset, message.exprUnknownFunction(fn, FUNCTION_NAMES), fn);
    }
    const open = this.next();
    const args = this.nested(name.offset, () => this.callArguments(open));
    const [ok, expected] = argumentCountOk(fn, args.length);
    if (!ok) throw new ExpressionSyntaxError(name.offset, message.exprArgumentCount(fn, expected, args.length));
    return this.node({ kind: 'call', fn, args, pos: { offset: name.offset } }, args);
  }

  private callArguments(open: Token): Expr[] {
    const args: Expr[] = [];
    if (this.peek().kind === ')') {
      this.next();
      return args;
    }
    args.push(this.sum());
    while (this.peek().kind === ',') {
      this.next();
      args.push(this.sum());
    }
    this.close(open);
    return args;
  }
}
