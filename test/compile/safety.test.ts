/**
 * Generated code is built from indices, never from model text: hostile names cannot inject code,
 * and the emitted source uses only the fixed vocabulary of codegen.ts.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { literal } from '../../src/compile/codegen.js';
import { compileModel } from '../../src/compile/compileModel.js';
import { jacobianKernel, rhsKernel } from '../../src/compile/kernels.js';
import { lowerModel } from '../../src/compile/lower.js';
import type { Expr, Model } from '../../src/types.js';
import { repeatable } from '../helpers/repeatable.js';

const HOSTILE = ['x', 'out', 'Math', 'constructor', '__proto__', "a'); globalThis.pwned = 1; ('", 't0', 'sel'];

const sym = (name: string): Expr => ({ kind: 'sym', name });
const at = { file: 'evil.yaml', line: 1, column: 1 };

/** States named by HOSTILE; each equation is −(own state) + (next state)·k. */
function hostileModel(): Model {
  const k = 'process.exit(1)';
  return {
    file: 'evil.yaml',
    states: HOSTILE.map((name, i) => ({ name, start: i, where: at })),
    parameters: [{ name: k, value: 2, where: at }],
    definitions: [{ name: 'require("fs")', text: 'ignored', expr: sym(k), where: at }],
    equations: HOSTILE.map((name, i) => ({
      state: name,
      text: '"); throw 1; ("',
      expr: {
        kind: 'bin', op: '+',
        left: { kind: 'neg', arg: sym(name) },
        right: { kind: 'bin', op: '*', left: sym(HOSTILE[(i + 1) % HOSTILE.length]!), right: sym('require("fs")') },
      },
      where: at,
    })),
  };
}

const VOCABULARY = new Set([
  'use', 'strict', 'return', 'function', 'const', 'x', 'p', 'out', 'fill', 'Math', 'sel',
  'exp', 'log', 'sqrt', 'sin', 'cos', 'tan', 'tanh', 'sinh', 'cosh', 'abs', 'min', 'max', 'pow',
]);

describe('code generation safety', () => {
  it('a model with hostile names compiles to source made only of the fixed vocabulary', () => {
    const lowered = lowerModel(hostileModel());
    for (const { source } of [rhsKernel(lowered), jacobianKernel(lowered)]) {
      const identifiers = source.match(/[A-Za-z_$][\w$]*/g) ?? [];
      const foreign = identifiers.filter((id) => !VOCABULARY.has(id) && !/^t\d+$/.test(id));
      expect(foreign).toEqual([]);
      expect(source).not.toMatch(/['`]|process|require|pwned|__proto__|constructor/);
    }
  });

  it('the hostile model evaluates to the values its equations describe and runs nothing else', () => {
    const system = compileModel(hostileModel());
    const n = HOSTILE.length;
    const x = Float64Array.from({ length: n }, (_, i) => i + 1);
    const out = new Float64Array(n);
    system.rhs(x, Float64Array.of(2), out);
    // Analytic: f_i = −x_i + 2·x_{i+1 mod n}.
    expect(Array.from(out)).toEqual(Array.from(x, (xi, i) => -xi + 2 * x[(i + 1) % n]!));
    expect((globalThis as Record<string, unknown>).pwned).toBeUndefined();
  });

  it('numeric literals read back to the same double, negatives in parentheses', () => {
    fc.assert(
      fc.property(fc.double({ noNaN: true, noDefaultInfinity: true }), (v) => {
        const text = literal(v);
        expect(Object.is(Function(`"use strict"; return ${text};`)() as number, v)).toBe(true);
        expect(v < 0 || Object.is(v, -0) ? /^\(-.*\)$/.test(text) : /^[0-9]/.test(text)).toBe(true);
      }),
      repeatable(7, 300),
    );
  });

  it('a non-finite literal is refused', () => {
    expect(() => literal(Infinity)).toThrow(/non-finite/);
    expect(() => literal(NaN)).toThrow(/non-finite/);
  });
});
