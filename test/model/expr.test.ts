import fc from 'fast-check';
import { all, create, type FunctionNode, type MathNode, type OperatorNode } from 'mathjs';
import { describe, expect, it } from 'vitest';
import { message } from '../../src/errors.js';
import {
  ExpressionSyntaxError, MAX_HEIGHT, MAX_NESTING, formatExpression, parseExpression, symbolsOf,
} from '../../src/model/expr.js';
import { FUNCTION_NAMES, type Expr } from '../../src/types.js';
import { repeatable } from '../helpers/repeatable.js';

/** Test-only evaluator of a parsed tree with plain JavaScript arithmetic. */
function evaluate(e: Expr, scope: Record<string, number>): number {
  switch (e.kind) {
    case 'num':
      return e.value;
    case 'sym':
      return scope[e.name]!;
    case 'neg':
      return -evaluate(e.arg, scope);
    case 'bin': {
      const l = evaluate(e.left, scope);
      const r = evaluate(e.right, scope);
      return e.op === '+' ? l + r : e.op === '-' ? l - r : e.op === '*' ? l * r : e.op === '/' ? l / r : l ** r;
    }
    case 'call': {
      const a = e.args.map((u) => evaluate(u, scope));
      if (e.fn === 'min') return Math.min(...a);
      if (e.fn === 'max') return Math.max(...a);
      if (e.fn === 'pow') return a[0]! ** a[1]!;
      return (Math[e.fn] as (x: number) => number)(a[0]!);
    }
  }
}

/** The tree without positions, for structural comparison. */
function strip(e: Expr): Expr {
  switch (e.kind) {
    case 'num':
      return { kind: 'num', value: e.value };
    case 'sym':
      return { kind: 'sym', name: e.name };
    case 'neg':
      return { kind: 'neg', arg: strip(e.arg) };
    case 'bin':
      return { kind: 'bin', op: e.op, left: strip(e.left), right: strip(e.right) };
    case 'call':
      return { kind: 'call', fn: e.fn, args: e.args.map(strip) };
  }
}

function syntaxError(text: string): ExpressionSyntaxError {
  try {
    parseExpression(text);
  } catch (err) {
    if (err instanceof ExpressionSyntaxError) return err;
    throw err;
  }
  throw new Error(`"${text}" was accepted`);
}

const value = (text: string, scope: Record<string, number> = {}): number => evaluate(parseExpression(text), scope);

describe('parseExpression: numbers, names and constants', () => {
  it.each([
    ['2', 2], ['0.5', 0.5], ['.5', 0.5], ['1e-3', 1e-3], ['2.5E+4', 2.5e4], ['7.', 7],
  ])('reads the number literal %s as %d', (text, expected) => {
    expect(parseExpression(text)).toEqual({ kind: 'num', value: expected, pos: { offset: 1 } });
  });

  it('turns the constants pi and e into numbers', () => {
    expect(strip(parseExpression('pi'))).toEqual({ kind: 'num', value: Math.PI });
    expect(strip(parseExpression('e'))).toEqual({ kind: 'num', value: Math.E });
  });

  it('reads names with letters, digits and underscores as symbols', () => {
    expect(parseExpression('  _k2_b ')).toEqual({ kind: 'sym', name: '_k2_b', pos: { offset: 3 } });
  });
});

describe('parseExpression: operators and precedence', () => {
  // Analytic: each value follows from the usual precedence rules written out by hand beside it.
  it.each([
    ['1 + 2 * 3', 7], // 1 + (2*3)
    ['(1 + 2) * 3', 9],
    ['8 / 4 / 2', 1], // (8/4)/2, left-associative
    ['8 - 4 - 2', 2], // (8-4)-2
    ['2 ^ 3 ^ 2', 512], // 2^(3^2), right-associative
    ['-2 ^ 2', -4], // -(2^2): power binds tighter than unary minus
    ['2 ^ -1', 0.5], // a signed exponent is allowed
    ['-2 * 3', -6],
    ['2 * -3', -6],
    ['1 - -1', 2],
    ['+3 - +1', 2], // unary plus leaves no node
    ['--2', 2],
    ['pow(2, 10)', 1024],
    ['min(3, -1, 2)', -1], // min and max take 2 or more arguments
    ['max(3, -1)', 3],
    ['exp(0) + log(1) + sqrt(4)', 3],
  ])('evaluates %s to %d', (text, expected) => {
    expect(value(text)).toBeCloseTo(expected, 14);
  });

  it('puts the column of each node\'s first character in pos.offset', () => {
    const e = parseExpression('a + b*(-c)');
    expect(e).toMatchObject({ kind: 'bin', op: '+', pos: { offset: 1 } });
    if (e.kind !== 'bin' || e.right.kind !== 'bin') throw new Error('unexpected shape');
    expect(e.right.pos).toEqual({ offset: 5 });
    expect(e.right.right).toMatchObject({ kind: 'neg', pos: { offset: 8 }, arg: { kind: 'sym', pos: { offset: 9 } } });
  });

  it('agrees with mathjs evaluate (an independent parser) on random expressions', () => {
    // Reference computation: mathjs 15 with {predictable: true}, which parses the same operator set
    // with the same precedence; both must give the same value to rounding. After mathjs has parsed
    // the text, its powers, min and max are evaluated with IEEE Math.pow, Math.min and Math.max:
    // mathjs gives a negative number a real power when the exponent is near a fraction with an odd
    // denominator ((cos 2)^(−e²) = 650.74, where real arithmetic, and ours, has none), and its min and
    // max treat values within 1e-12 (relative) or 1e-15 as equal (min(3, 2.999999999997) = 3).
    const math = create(all!, { predictable: true });
    const ieee: Record<string, (...xs: number[]) => number> = { ieeePow: Math.pow, ieeeMin: Math.min, ieeeMax: Math.max };
    math.import(ieee);
    const exactNumbers = (node: MathNode): MathNode => {
      const args = (node as OperatorNode | FunctionNode).args;
      const name = node.type === 'OperatorNode' && (node as OperatorNode).op === '^' ? 'pow'
        : node.type === 'FunctionNode' ? (node as FunctionNode).fn.name : '';
      const replaced = { pow: 'ieeePow', min: 'ieeeMin', max: 'ieeeMax' }[name];
      return replaced === undefined ? node : new math.FunctionNode(replaced, args.map((a) => a.transform(exactNumbers)));
    };
    const leaf = fc.constantFrom('a', 'b', 'c', '2', '0.5', '.5', '1e-1', '3', 'pi', 'e');
    const { node } = fc.letrec<{ node: string }>((tie) => ({
      node: fc.oneof(
        { depthSize: 'small', withCrossShrink: true },
        leaf,
        fc.tuple(tie('node'), fc.constantFrom('+', '-', '*', '/', '^'), tie('node')).map(([l, op, r]) => `${l} ${op} ${r}`),
        tie('node').map((u) => `-${u}`),
        tie('node').map((u) => `(${u})`),
        fc.tuple(fc.constantFrom('exp', 'sin', 'cos', 'tanh', 'abs'), tie('node')).map(([f, u]) => `${f}(${u})`),
        fc.tuple(fc.constantFrom('min', 'max', 'pow'), tie('node'), tie('node')).map(([f, u, v]) => `${f}(${u}, ${v})`),
      ),
    }));
    const scope = fc.record({
      a: fc.double({ min: -3, max: 3, noNaN: true }),
      b: fc.double({ min: -3, max: 3, noNaN: true }),
      c: fc.double({ min: 0.1, max: 3, noNaN: true }),
    });
    let compared = 0;
    fc.assert(
      fc.property(node, scope, (text, s) => {
        const ours = value(text, s);
        const reference = math.parse(text).transform(exactNumbers).evaluate({ ...s }) as unknown;
        if (typeof reference !== 'number' || !Number.isFinite(reference)) return;
        // A finite reference value must be matched by a finite value of ours (NaN/∞ here is a failure).
        expect(Number.isFinite(ours)).toBe(true);
        compared++;
        expect(Math.abs(ours - reference)).toBeLessThanOrEqual(1e-9 * Math.max(1, Math.abs(reference)));
      }),
      repeatable(20261202, 400),
    );
    expect(compared).toBeGreaterThan(200);
  });
});

describe('formatExpression and symbolsOf', () => {
  const name = fc
    .stringMatching(/^[A-Za-z_][A-Za-z0-9_]{0,4}$/)
    .filter((n) => !(FUNCTION_NAMES as readonly string[]).includes(n) && n !== 'pi' && n !== 'e');
  const { tree } = fc.letrec<{ tree: Expr }>((tie) => ({
    tree: fc.oneof(
      { depthSize: 'small', withCrossShrink: true },
      fc.double({ min: 0, max: 1e300, noNaN: true }).filter((v) => !Object.is(v, -0)).map((v): Expr => ({ kind: 'num', value: v })),
      name.map((n): Expr => ({ kind: 'sym', name: n })),
      tie('tree').map((arg): Expr => ({ kind: 'neg', arg })),
      fc.tuple(fc.constantFrom('+', '-', '*', '/', '^'), tie('tree'), tie('tree'))
        .map(([op, left, right]): Expr => ({ kind: 'bin', op, left, right })),
      fc.tuple(fc.constantFrom('exp', 'log', 'abs', 'tanh'), tie('tree')).map(([fn, a]): Expr => ({ kind: 'call', fn, args: [a] })),
      fc.tuple(fc.constantFrom('min', 'max', 'pow'), tie('tree'), tie('tree'))
        .map(([fn, a, b]): Expr => ({ kind: 'call', fn, args: [a, b] })),
    ),
  }));

  it('prints every tree as text that parses back to the same tree', () => {
    fc.assert(
      fc.property(tree, (t) => {
        expect(strip(parseExpression(formatExpression(t)))).toEqual(t);
      }),
      repeatable(20261202, 500),
    );
  });

  it('adds parentheses only where precedence needs them', () => {
    expect(formatExpression(parseExpression('(a - (b - c)) * -(x^2)^y'))).toBe('(a - (b - c)) * -(x^2)^y');
    expect(formatExpression(parseExpression('((a*b))/(c*d)'))).toBe('a * b / (c * d)');
  });

  it('lists each symbol once and leaves out functions and constants', () => {
    expect([...symbolsOf(parseExpression('k*x*exp(-x/k) + pi*y - e'))].sort()).toEqual(['k', 'x', 'y']);
  });
});

describe('parseExpression rejects everything outside the grammar', () => {
  const fns = FUNCTION_NAMES;
  it.each([
    ['', 1, message.exprEmpty()],
    ['   ', 1, message.exprEmpty()],
    ['import(x)', 1, message.exprUnknownFunction('import', fns)],
    ['evaluate(x)', 1, message.exprUnknownFunction('evaluate', fns)],
    ['parse(x)', 1, message.exprUnknownFunction('parse', fns)],
    ['createUnit(x)', 1, message.exprUnknownFunction('createUnit', fns)],
    ['2*expp(x)', 3, message.exprUnknownFunction('expp', fns)],
    ['evaluate("1")', 10, message.exprQuote()],
    ['"str"', 1, message.exprQuote()],
    ["x + 'a'", 5, message.exprQuote()],
    ['a.b', 2, message.exprPropertyAccess('b')],
    ['x = 1', 3, message.exprAssignment()],
    ['f(x) = x', 6, message.exprAssignment()],
    ['x == 1', 3, message.exprComparison('==')],
    ['x < 1', 3, message.exprComparison('<')],
    ['x >= 1', 3, message.exprComparison('>=')],
    ['x != 1', 3, message.exprComparison('!=')],
    ['[1,2]', 1, message.exprBracket('[')],
    ['{a}', 1, message.exprBracket('{')],
    ['x; y', 2, message.exprCharacter(';')],
    ['3!', 2, message.exprCharacter('!')],
    ['7 % 2', 3, message.exprCharacter('%')],
    ['a, b', 2, message.exprStrayComma()],
    ['2x', 2, message.exprImplicitMultiplication('x')],
    ['2 x', 3, message.exprImplicitMultiplication('x')],
    ['a b', 3, message.exprImplicitMultiplication('b')],
    ['(a)(b)', 4, message.exprImplicitMultiplication('(')],
    ['2(a)', 2, message.exprImplicitMultiplication('(')],
    ['x +', 3, message.exprMissingOperand('+')],
    ['x * / y', 5, message.exprMissingOperand('*')],
    ['*x', 1, message.exprLeadingOperator('*')],
    ['()', 2, message.exprMissingOperand('(')],
    ['((x)', 1, message.exprUnclosed()],
    ['x)', 2, message.exprUnopened()],
    ['sin(x', 4, message.exprUnclosed()],
    ['1e999', 1, message.exprNumberOverflow('1e999')],
    ['1.2.3', 1, message.exprMalformedNumber('1.2.3')],
    ['1e+', 1, message.exprMalformedNumber('1e+')],
    ['exp + 1', 1, message.exprFunctionAsValue('exp')],
    ['pi(2)', 1, message.exprNotAFunction('pi')],
    ['sin(a, b)', 1, message.exprArgumentCount('sin', '1', 2)],
    ['pow(a)', 1, message.exprArgumentCount('pow', '2', 1)],
    ['min(a)', 1, message.exprArgumentCount('min', '2 or more', 1)],
  ])('rejects %j at column %d', (text, column, expected) => {
    const err = syntaxError(text);
    expect(err.detail).toBe(expected);
    expect(err.offset).toBe(column);
  });

  it('names the called name when a non-function is called, for the loader to explain', () => {
    expect(syntaxError('k(x + 1)').unknownCall).toBe('k');
  });

  it('rejects 10,000 nested parentheses with the nesting message, not a stack overflow', () => {
    const text = `${'('.repeat(10_000)}x${')'.repeat(10_000)}`;
    const err = syntaxError(text);
    expect(err.detail).toBe(message.exprTooDeep(MAX_NESTING));
    expect(err.offset).toBe(MAX_NESTING + 1);
  });

  it('accepts nesting up to the limit', () => {
    const depth = MAX_NESTING - 1;
    expect(value(`${'('.repeat(depth)}2${')'.repeat(depth)}`)).toBe(2);
  });

  it('rejects deep chains of signs and exponents like deep parentheses', () => {
    expect(syntaxError('-'.repeat(100) + 'x').detail).toBe(message.exprTooDeep(MAX_NESTING));
    expect(syntaxError(Array(100).fill('2').join('^')).detail).toBe(message.exprTooDeep(MAX_NESTING));
  });

  it('rejects a flat sum taller than the height limit', () => {
    const err = syntaxError(Array(MAX_HEIGHT + 5).fill('x').join('+'));
    expect(err.detail).toBe(message.exprTooLarge(MAX_HEIGHT));
  });
});
