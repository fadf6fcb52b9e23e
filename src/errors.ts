/**
 * Error classes and every user-facing message. The CLI prints `branchtrace: <message>` on one line;
 * tests assert against the message functions below, never against copied strings.
 */
import type { SourceRef } from './types.js';

export abstract class BranchtraceError extends Error {
  abstract readonly exitCode: number;
  constructor(message: string) {
    super(message);
    this.name = new.target.name;
  }
}

/** Bad command-line arguments. Exit status 2. */
export class UsageError extends BranchtraceError {
  readonly exitCode = 2;
}

/** A model file that cannot be loaded, compiled or evaluated. Exit status 2. */
export class ModelError extends BranchtraceError {
  readonly exitCode = 2;
}

/** The numerics could not do what was asked (no equilibrium, no convergence). Exit status 3. */
export class NumericalError extends BranchtraceError {
  readonly exitCode = 3;
}

/** A design-margin gate failed (`--fail-margin`). Exit status 3. */
export class MarginError extends BranchtraceError {
  readonly exitCode = 3;
}

/** `file:line:column` (line and column omitted when unknown). */
export function where(ref: Partial<SourceRef> & { file: string }): string {
  if (ref.line === undefined) return ref.file;
  if (ref.column === undefined) return `${ref.file}:${ref.line}`;
  return `${ref.file}:${ref.line}:${ref.column}`;
}

/** Levenshtein distance, for "did you mean" suggestions. */
export function editDistance(a: string, b: string): number {
  const prev = new Array<number>(b.length + 1);
  for (let j = 0; j <= b.length; j++) prev[j] = j;
  for (let i = 1; i <= a.length; i++) {
    let diag = prev[0]!;
    prev[0] = i;
    for (let j = 1; j <= b.length; j++) {
      const up = prev[j]!;
      prev[j] = Math.min(up + 1, prev[j - 1]! + 1, diag + (a[i - 1] === b[j - 1] ? 0 : 1));
      diag = up;
    }
  }
  return prev[b.length]!;
}

/** ` (did you mean "x"?)` for the closest candidate within a small edit distance, else ''. */
export function didYouMean(name: string, candidates: readonly string[]): string {
  let best: string | undefined;
  let bestD = Infinity;
  for (const c of candidates) {
    const d = editDistance(name.toLowerCase(), c.toLowerCase());
    if (d < bestD) {
      bestD = d;
      best = c;
    }
  }
  const limit = Math.max(1, Math.floor(name.length / 3));
  return best !== undefined && bestD <= limit ? ` (did you mean "${best}"?)` : '';
}

// ─── Messages ───────────────────────────────────────────────────────────────
// Grouped by stage. Each returns one sentence that names the offending value and where it is.

export const message = {
  // usage
  unknownParameter: (name: string, known: readonly string[]) =>
    `unknown parameter "${name}"${didYouMean(name, known)} (parameters: ${known.join(', ') || 'none'})`,
  unknownState: (name: string, known: readonly string[]) =>
    `unknown state "${name}"${didYouMean(name, known)} (states: ${known.join(', ') || 'none'})`,
  badAssignment: (option: string, text: string) =>
    `${option} expects NAME=VALUE with a finite number, got "${text}"`,
  badNumber: (option: string, text: string) => `${option} expects a finite number, got "${text}"`,
  badInteger: (option: string, text: string) => `${option} expects a positive whole number, got "${text}"`,
  badInterval: (option: string, text: string) =>
    `${option} expects NAME=LO:HI with finite numbers and LO < HI, got "${text}"`,
  emptyRange: (from: number, to: number) => `--from and --to must differ (both are ${from}${from === to ? '' : `, ${to}`})`,
  cannotRead: (file: string, reason: string) => `${file}: cannot read the file (${reason})`,

  // numerics
  noEquilibriumAtStart: (param: string, value: number, residual: number, iterations: number) =>
    `no equilibrium at ${param} = ${value}: Newton stopped after ${iterations} iterations with residual ` +
    `${residual.toExponential(2)}; give other start values with --start NAME=VALUE`,
  nonFinite: (what: string, state: string, params: string) =>
    `${what} is not finite at ${state} with ${params}`,
  marginFailed: (relative: number, fail: number, param: string) =>
    `design margin ${(relative * 100).toPrecision(3)}% of ${param} is below the --fail-margin ${(fail * 100).toPrecision(3)}%`,
} as const;
