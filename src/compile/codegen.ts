/**
 * Compile-stage tree → JavaScript function, through `new Function`.
 *
 * Safety: the emitted text is made only of numeric literals (checked finite), the fixed argument
 * names below, temporaries named by index (`t12`, or `t[12]` in a scratch array), `[integer]`
 * indices, operators, the `sel` helper and the `Math.*` names of FUNCTION_CODE. No model name or
 * text is ever concatenated into code: lowering has already replaced every name by an index.
 *
 * Size: V8 does not optimise very large functions, so a kernel longer than CHUNK_CHARS is split
 * into several functions that share their temporaries through one Float64Array allocated
 * when the kernel is built (calls still allocate nothing).
 */
import { FUNCTION_CODE } from './functionValues.js';
import type { CExpr } from './ir.js';
import type { Tape } from './tape.js';

export type KernelArg = 'x' | 'p' | 'u' | 'v' | 'w' | 'out';
/** One factor of a multilinear term: vector u, v or w at an index. */
export type VectorFactor = readonly ['u' | 'v' | 'w', number];

type Statement =
  | { kind: 'zero' }
  | { kind: 'set'; slot: number; e: CExpr }
  | { kind: 'add'; slot: number; e: CExpr; products: readonly (readonly VectorFactor[])[] };

/**
 * Most source characters per generated function: V8 stops optimising at about 60 kB of bytecode,
 * roughly that many characters of this code (measured, not documented; a rule of thumb).
 */
const CHUNK_CHARS = 20_000;

/** select(l, r, a, b): a when l ≤ r, b when l > r, NaN when either is NaN. */
function sel(l: number, r: number, ifLe: number, ifGt: number): number {
  return l <= r ? ifLe : l > r ? ifGt : NaN;
}

function integer(i: number): string {
  if (!Number.isSafeInteger(i) || i < 0) throw new Error(`internal: bad index ${i}`);
  return String(i);
}

/** A finite number as a literal that reads back to the same double. */
export function literal(value: number): string {
  if (!Number.isFinite(value)) throw new Error(`internal: non-finite literal ${value}`);
  if (Object.is(value, -0)) return '(-0)';
  return value < 0 ? `(${String(value)})` : String(value);
}

export class KernelWriter {
  private readonly statements: Statement[] = [];
  /** How a temporary is referenced; set by build(). */
  private tempRef: (index: number) => string = (i) => `t${integer(i)}`;

  constructor(private readonly tape: Tape) {}

  /** out.fill(0). */
  zeroFill(): void {
    this.statements.push({ kind: 'zero' });
  }

  /** out[slot] = e. */
  set(slot: number, e: CExpr): void {
    this.statements.push({ kind: 'set', slot, e });
  }

  /** out[slot] += e · Σ_products Π_factors (each inner list is one product of vector entries). */
  addProducts(slot: number, e: CExpr, products: readonly (readonly VectorFactor[])[]): void {
    this.statements.push({ kind: 'add', slot, e, products });
  }

  /** The finished function and its source text. */
  build<F>(args: readonly KernelArg[]): { fn: F; source: string } {
    const temps = this.tempsNeeded();
    const params = args.map(fixedName).join(', ');
    this.tempRef = (i) => `t${integer(i)}`;
    const single = [...temps.map((i) => `const ${this.tempRef(i)} = ${this.expr(this.tape.temps[i]!)};`), ...this.render()];
    const source = sourceLength(single) <= CHUNK_CHARS
      ? `"use strict";\nreturn function (${params}) {\n${single.join('\n')}\n};`
      : this.chunkedSource(temps, params);
    const fn = new Function('sel', source)(sel) as F;
    return { fn, source };
  }

  /** Several functions of at most about CHUNK_CHARS each, sharing temporaries in one scratch array. */
  private chunkedSource(temps: readonly number[], params: string): string {
    const slots = new Map(temps.map((t, k) => [t, k]));
    this.tempRef = (i) => `t[${integer(slots.get(i)!)}]`;
    const lines = [...temps.map((i) => `${this.tempRef(i)} = ${this.expr(this.tape.temps[i]!)};`), ...this.render()];
    const chunks: string[][] = [[]];
    let size = 0;
    for (const line of lines) {
      if (size + line.length > CHUNK_CHARS && chunks.at(-1)!.length > 0) {
        chunks.push([]);
        size = 0;
      }
      chunks.at(-1)!.push(line);
      size += line.length + 1;
    }
    const functions = chunks.map((body, k) => `function c${k}(${params}) {\n${body.join('\n')}\n}`);
    const calls = chunks.map((_, k) => `c${k}(${params});`).join('\n');
    return `"use strict";\nconst t = new Float64Array(${integer(temps.length)});\n${functions.join('\n')}\n` +
      `return function (${params}) {\n${calls}\n};`;
  }

  private render(): string[] {
    return this.statements.map((s) => {
      if (s.kind === 'zero') return 'out.fill(0);';
      if (s.kind === 'set') return `out[${integer(s.slot)}] = ${this.expr(s.e)};`;
      const sum = s.products
        .map((factors) => factors.map(([vec, i]) => `${fixedName(vec)}[${integer(i)}]`).join(' * '))
        .join(' + ');
      return `out[${integer(s.slot)}] += ${this.expr(s.e)} * (${sum});`;
    });
  }

  /** Source text of `e`. */
  private expr(e: CExpr): string {
    switch (e.kind) {
      case 'num':
        return literal(e.value);
      case 'state':
        return `x[${integer(e.index)}]`;
      case 'param':
        return `p[${integer(e.index)}]`;
      case 'temp':
        return this.tempRef(e.index);
      case 'neg':
        return `(-${this.expr(e.arg)})`;
      case 'bin':
        return e.op === '^'
          ? `${FUNCTION_CODE.pow}(${this.expr(e.left)}, ${this.expr(e.right)})`
          : `(${this.expr(e.left)} ${e.op} ${this.expr(e.right)})`;
      case 'call':
        return `${FUNCTION_CODE[e.fn]}(${e.args.map((a) => this.expr(a)).join(', ')})`;
      case 'select':
        return `sel(${[e.l, e.r, e.ifLe, e.ifGt].map((a) => this.expr(a)).join(', ')})`;
    }
  }

  /** Every temporary the statements use, with the ones those use, in evaluation order. */
  private tempsNeeded(): number[] {
    const needed = new Set<number>();
    const stack: number[] = [];
    const visit = (e: CExpr): void => {
      if (e.kind === 'temp') stack.push(e.index);
      else if (e.kind === 'neg') visit(e.arg);
      else if (e.kind === 'bin') [e.left, e.right].forEach(visit);
      else if (e.kind === 'call') e.args.forEach(visit);
      else if (e.kind === 'select') [e.l, e.r, e.ifLe, e.ifGt].forEach(visit);
    };
    for (const s of this.statements) if (s.kind !== 'zero') visit(s.e);
    while (stack.length > 0) {
      const i = stack.pop()!;
      if (needed.has(i)) continue;
      needed.add(i);
      visit(this.tape.temps[i]!);
    }
    return [...needed].sort((a, b) => a - b);
  }
}

function sourceLength(lines: readonly string[]): number {
  return lines.reduce((sum, line) => sum + line.length + 1, 0);
}

const ARG_NAMES: Readonly<Record<KernelArg, string>> = { x: 'x', p: 'p', u: 'u', v: 'v', w: 'w', out: 'out' };

/** One of the fixed argument names (checked at run time too). */
function fixedName(a: KernelArg): string {
  const name = ARG_NAMES[a];
  if (name === undefined) throw new Error('internal: bad argument name');
  return name;
}
