/**
 * The `equilibria` command's output: a JSON document (the contract printed by `--json`) and a table
 * for people. Pure functions of the search result; names come from the model.
 */
import type { EquilibriumSearch } from '../equilibria/findEquilibria.js';
import type { Eigenvalue, Equilibrium, ModelInfo } from '../types.js';
import { message } from '../errors.js';
import { CAUTION } from './caution.js';
import { formatEigenvalues, formatNumber } from './formatNumber.js';

export interface EquilibriumJson {
  state: Record<string, number>;
  residual: number;
  iterations: number;
  eigenvalues: Eigenvalue[];
  stable: boolean;
  unstableDimension: number;
  type: string;
  rotation?: 'clockwise' | 'counterclockwise';
  stableDirections?: Record<string, number>[];
  unstableDirections?: Record<string, number>[];
}

export interface EquilibriaJson {
  model: string;
  parameters: Record<string, number>;
  equilibria: EquilibriumJson[];
  caution: string;
  search: Omit<EquilibriumSearch['diagnostics'], 'box'> & { box: { lo: Record<string, number>; hi: Record<string, number> } };
}

const named = (names: readonly string[], v: Float64Array): Record<string, number> =>
  Object.fromEntries(names.map((name, i) => [name, v[i]!]));

function equilibriumJson(e: Equilibrium, names: readonly string[]): EquilibriumJson {
  return {
    state: named(names, e.state),
    residual: e.residual,
    iterations: e.iterations,
    eigenvalues: e.eigenvalues.map((v) => ({ re: v.re, im: v.im })),
    stable: e.stable,
    unstableDimension: e.unstableDimension,
    type: e.type,
    ...(e.rotation !== undefined && { rotation: e.rotation }),
    ...(e.stableDirections !== undefined && { stableDirections: e.stableDirections.map((d) => named(names, d)) }),
    ...(e.unstableDirections !== undefined && { unstableDirections: e.unstableDirections.map((d) => named(names, d)) }),
  };
}

export function equilibriaJson(info: ModelInfo, params: Float64Array, search: EquilibriumSearch): EquilibriaJson {
  const names = info.states.map((s) => s.name);
  const { box, ...rest } = search.diagnostics;
  return {
    model: info.file,
    parameters: named(info.parameters.map((q) => q.name), params),
    equilibria: search.equilibria.map((e) => equilibriumJson(e, names)),
    caution: CAUTION,
    search: { ...rest, box: { lo: named(names, box.lo), hi: named(names, box.hi) } },
  };
}

/** Left-aligned columns separated by two spaces. */
export function textTable(header: readonly string[], rows: readonly (readonly string[])[]): string {
  const widths = header.map((h, j) => Math.max(h.length, ...rows.map((r) => (r[j] ?? '').length)));
  const line = (cells: readonly string[]) => cells.map((c, j) => c.padEnd(widths[j]!)).join('  ').trimEnd();
  return [line(header), line(widths.map((w) => '-'.repeat(w))), ...rows.map(line)].join('\n');
}

function direction(names: readonly string[], d: Float64Array): string {
  return `(${names.map((name, i) => `${name} ${formatNumber(d[i]!, 3)}`).join(', ')})`;
}

export function equilibriaText(info: ModelInfo, params: Float64Array, search: EquilibriumSearch): string {
  const names = info.states.map((s) => s.name);
  const setting = info.parameters.map((q, k) => `${q.name} = ${formatNumber(params[k]!, 6)}`).join(', ');
  const out = [`${info.title ?? info.file}`, `parameters: ${setting}`, ''];
  const eqs = search.equilibria;
  if (eqs.length === 0) {
    out.push(message.noEquilibriumFound(), '', CAUTION);
    return out.join('\n') + '\n';
  }
  out.push(`${eqs.length} equilibri${eqs.length === 1 ? 'um' : 'a'} found:`, '');
  const header = ['#', ...names, 'type', 'stable', 'unstable dims', 'eigenvalues', 'residual'];
  const rows = eqs.map((e, i) => [
    String(i + 1),
    ...names.map((_, j) => formatNumber(e.state[j]!, 6)),
    e.type + (e.rotation !== undefined ? `, turning ${e.rotation}` : ''),
    e.stable ? 'yes' : 'no',
    String(e.unstableDimension),
    formatEigenvalues(e.eigenvalues),
    e.residual.toExponential(1),
  ]);
  out.push(textTable(header, rows));
  for (const [i, e] of eqs.entries()) {
    if (e.stableDirections === undefined && e.unstableDirections === undefined) continue;
    out.push('', `#${i + 1} ${e.type}:`);
    for (const d of e.stableDirections ?? []) out.push(`  stable direction   ${direction(names, d)}`);
    for (const d of e.unstableDirections ?? []) out.push(`  unstable direction ${direction(names, d)}`);
  }
  const diag = search.diagnostics;
  out.push('', `search: ${diag.startsUsed} start points, ${diag.solves} Newton solves, ${diag.iterations} iterations` +
    (diag.budgetExhausted ? ' (iteration budget used up: some equilibria may be missing)' : ''), '', CAUTION);
  return out.join('\n') + '\n';
}
