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

/** `1 iteration`, `2 iterations`: a count with its noun in the singular or the plural. */
export function countOf(n: number, singular: string, plural = `${singular}s`): string {
  return `${n} ${n === 1 ? singular : plural}`;
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
  logRange: (from: number, to: number) => `--log needs a range of positive values, got ${from} to ${to}`,
  startOutsideBounds: (name: string, value: number, min?: number, max?: number) =>
    `--start ${name}=${value} lies outside the bounds the model gives ${name} (${min ?? '-infinity'} to ${max ?? 'infinity'})`,
  badInteger: (option: string, text: string, least: 0 | 1) =>
    `${option} expects ${least === 1 ? 'a positive whole number' : 'a whole number (0 or more)'}, got "${text}"`,
  badInterval: (option: string, text: string) =>
    `${option} expects NAME=LO:HI with finite numbers and LO < HI, got "${text}"`,
  badPositive: (option: string, text: string) => `${option} expects a positive number, got "${text}"`,
  badWindow: (text: string) =>
    `--window expects X0:X1,Y0:Y1 with finite numbers and X0 < X1, Y0 < Y1, got "${text}"`,
  emptyRange: (from: number, to: number) => `--from and --to must differ (both are ${from}${from === to ? '' : `, ${to}`})`,
  noEquilibriumFound: () =>
    'no equilibrium found in the search box; widen it with --box NAME=LO:HI or give --start NAME=VALUE',
  cannotRead: (file: string, reason: string) => `${file}: cannot read the file (${reason})`,

  // compile (src/compile): `at` is file:line:column, `values` lists the states then the parameters
  compileUnknownName: (at: string, name: string) => `${at}: unknown name "${name}"`,
  compileNonFiniteNumber: (at: string, value: number) => `${at}: the number ${value} is not finite`,
  compileArgumentCount: (at: string, fn: string, expected: string, got: number) =>
    `${at}: ${fn}() takes ${expected} argument${expected === '1' ? '' : 's'}, got ${got}`,
  nonFiniteEquation: (at: string, state: string, value: number, values: string) =>
    `${at}: the equation for "${state}" gives ${value} at ${values}`,
  conservedQuantity: (at: string, sums: readonly string[]) =>
    `${at}: the model conserves ${sums.join(' and ')} (${sums.length === 1 ? 'its rate of change is' : 'their rates of change are'} ` +
    '0 at every state), so the equilibria are not isolated and cannot be found or followed one at a time: for each ' +
    'conserved sum, replace one of its states by the total (a new parameter) minus the others',
  constantDrift: (at: string, sum: string, rate: number) =>
    `${at}: ${sum} changes at the same rate ${rate} at every state, so the model has no equilibrium: check the ` +
    'equations of these states',
  nonFiniteJacobian: (at: string, state: string, by: string, value: number, values: string) =>
    `${at}: the derivative of the equation for "${state}" with respect to "${by}" gives ${value} at ${values}`,

  // model expressions (src/model/expr.ts): the loader prefixes file:line:column
  exprEmpty: () => 'the expression is empty',
  exprCharacter: (ch: string) => `character "${ch}" is not allowed in an expression`,
  exprPropertyAccess: (name: string) => `property access ".${name}" is not allowed in an expression`,
  exprAssignment: () => '"=" is not allowed: an expression cannot assign or define anything',
  exprComparison: (op: string) => `comparison "${op}" is not allowed in an expression`,
  exprQuote: () => 'quoted text is not allowed in an expression',
  exprBracket: (ch: string) => `"${ch}" is not allowed in an expression: group with round parentheses`,
  exprUnknownFunction: (name: string, functions: readonly string[]) =>
    `unknown function "${name}"${didYouMean(name, functions)} (functions: ${functions.join(', ')})`,
  exprNotAFunction: (name: string) => `"${name}" is not a function; write "${name}*(...)" to multiply`,
  exprFunctionAsValue: (name: string) => `function "${name}" needs its arguments in parentheses, as in ${name}(x)`,
  exprArgumentCount: (name: string, expected: string, got: number) =>
    `function "${name}" takes ${expected} argument${expected === '1' ? '' : 's'}, got ${got}`,
  exprImplicitMultiplication: (next: string) => `missing operator before "${next}" (write "*" to multiply)`,
  exprMissingOperand: (after: string) => `expected a number, name or "(" after "${after}"`,
  exprLeadingOperator: (op: string) => `an expression cannot start with "${op}"`,
  exprUnclosed: () => '"(" is never closed',
  exprUnopened: () => '")" has no matching "("',
  exprStrayComma: () => '"," is only allowed between the arguments of a function',
  exprMalformedNumber: (text: string) => `malformed number "${text}"`,
  exprNumberOverflow: (text: string) => `number "${text}" is too large (it overflows to infinity)`,
  exprTooDeep: (limit: number) => `expression is nested too deeply (more than ${limit} levels)`,
  exprTooLarge: (limit: number) => `expression is too large (more than ${limit} levels of operations)`,

  // model file (src/model/loadModel.ts): each is prefixed with file:line:column by message.modelAt
  modelAt: (ref: SourceRef, what: string) => `${where(ref)}: ${what}`,
  modelYamlSyntax: (detail: string) => `YAML syntax error: ${detail}`,
  modelEmpty: () => 'the model file is empty',
  modelNotMapping: () => 'the model file must be a mapping with the sections states, parameters and equations',
  modelUnknownSection: (key: string, known: readonly string[]) =>
    `unknown section "${key}"${didYouMean(key, known)} (sections: ${known.join(', ')})`,
  modelMissingSection: (key: string) => `missing section "${key}"`,
  modelSectionNotMapping: (key: string) => `section "${key}" must be a mapping of names to values`,
  modelNotText: (key: string) => `"${key}" must be text`,
  modelBadName: (name: string) => `"${name}" is not a valid name (letters, digits and _, not starting with a digit)`,
  modelReservedName: (name: string) => `"${name}" is a reserved name; choose another`,
  modelDuplicateName: (name: string, first: string) => `"${name}" is declared twice (first at ${first})`,
  modelBadNumber: (name: string, field: string, text: string) =>
    `${field} of "${name}" must be a finite number, got ${text}`,
  modelUnknownField: (name: string, field: string, known: readonly string[]) =>
    `unknown field "${field}" for "${name}"${didYouMean(field, known)} (fields: ${known.join(', ')})`,
  modelMissingField: (name: string, field: string) => `"${name}" needs a "${field}"`,
  modelBadBounds: (name: string, min: number, max: number) => `min of "${name}" (${min}) must be below its max (${max})`,
  modelStartOutsideBounds: (name: string, start: number, min?: number, max?: number) =>
    `start of "${name}" (${start}) must lie within its bounds (${min ?? '-infinity'} to ${max ?? 'infinity'})`,
  modelBadExpression: (name: string) => `the expression for "${name}" must be text or a number`,
  modelInExpression: (what: string, section: string, name: string) => `${what} (in ${section}.${name})`,
  modelUnknownSymbol: (name: string, known: readonly string[]) =>
    `unknown name "${name}"${didYouMean(name, known)} (known: ${known.join(', ') || 'none'})`,
  modelNoStates: () => 'the model needs at least one state',
  modelMissingEquation: (state: string) => `no equation for state "${state}"`,
  modelExtraEquation: (name: string, states: readonly string[]) =>
    `equation for "${name}", which is not a state${didYouMean(name, states)} (states: ${states.join(', ')})`,
  modelUsedBeforeDefined: (name: string) => `definition "${name}" is used before it is defined`,
  modelDefinitionCycle: (path: readonly string[]) => `definitions form a cycle (${path.join(' -> ')})`,

  // numerics
  noEquilibriumAtStart: (param: string, value: number, residual: number, iterations: number) =>
    `no equilibrium at ${param} = ${value}: Newton stopped after ${countOf(iterations, 'iteration')} with residual ` +
    `${residual.toExponential(2)}; give other start values with --start NAME=VALUE`,
  nonFinite: (what: string, state: string, params: string) =>
    `${what} is not finite at ${state} with ${params}`,
  marginFailed: (relative: number, fail: number, param: string) =>
    `design margin ${(relative * 100).toPrecision(3)}% of ${param} is below the --fail-margin ${(fail * 100).toPrecision(3)}%`,

  // portrait (src/portrait/buildPortrait.ts)
  portraitNeedsTwoStates: (file: string, n: number) =>
    `${file}: a phase portrait needs two states, but the model has ${n}`,
  portraitSameState: (file: string, name: string) =>
    `${file}: --x and --y both name the state "${name}"; choose two different states`,
  portraitBadWindow: (file: string, name: string, lo: number, hi: number) =>
    `${file}: the window for state "${name}" needs finite ends with low < high, got ${lo}:${hi}`,

  // continuation (src/trace): warnings collected in trace.warnings
  traceStartFailed: (param: string, value: number, status: string, residual: number, iterations: number) =>
    `a start point at ${param} = ${value} was dropped: Newton ${status} after ${countOf(iterations, 'iteration')} ` +
    `(residual ${residual.toExponential(2)})`,
  traceNoTangent: (param: string, value: number) =>
    `a start point at ${param} = ${value} was dropped: the branch direction there could not be computed`,
  traceStartNotFinite: (param: string, value: number, states: string) =>
    `a start point at ${param} = ${value} was dropped: the model's derivatives are not finite there (${states}), ` +
    'so its branch cannot be followed (a negative number raised to a varied power, a logarithm at zero); bounds ' +
    '(min, max) on the states keep the search away from such points',
  traceBoundBranchPoint: (param: string, value: number) =>
    `${param} = ${value}, an end of the range, is a branch point (the branch direction is not unique there): ` +
    'a branch that starts or ends there is followed only up to it; widen the range to follow the branches that cross there',
  traceBranchStopped: (branch: number, reason: string, param: string, value: number) =>
    `branch ${branch} stopped at ${param} = ${value.toPrecision(8)}: ${reason}`,
  traceLandFailed: (param: string, bound: number, status: string, residual: number, iterations: number) =>
    `could not place the last point exactly on ${param} = ${bound}: Newton ${status} after ` +
    `${countOf(iterations, 'iteration')} (residual ${residual.toExponential(2)})`,
  traceStateBoundFailed: (state: string, bound: number, param: string, at: number) =>
    `the branch reaches the bound ${state} = ${bound} just after ${param} = ${at}, but the point on it could not be located; the branch ends at the last point before it`,
  traceHiddenCrossings: (param: string, a: number, b: number) =>
    `between ${param} = ${a.toPrecision(8)} and ${b.toPrecision(8)} several eigenvalues cross the imaginary ` +
    `axis together even at the smallest step (a degenerate point, e.g. a double zero eigenvalue); it is not located`,
  traceNarrowWindow: (param: string, a: number, b: number) =>
    `between ${param} = ${a.toPrecision(8)} and ${b.toPrecision(8)} the stability may change and change back within ` +
    'a stretch shorter than the smallest step (the largest real part of the eigenvalues comes to zero there); it is not located',
  traceLocateFailed: (what: string, branch: number, param: string, a: number, b: number, status: string) =>
    `a ${what} on branch ${branch} between ${param} = ${a.toPrecision(8)} and ${b.toPrecision(8)} ` +
    `could not be located (${status}); it is not reported`,
  traceSwitchFailed: (branch: number, param: string, value: number, reason: string) =>
    `no new branch started at the branch point of branch ${branch} at ${param} = ${value.toPrecision(8)}: ${reason}`,
  traceBranchLimit: (limit: number) =>
    `stopped starting new branches after ${countOf(limit, 'branch', 'branches')} (the branch limit); raise it to see more`,
} as const;
