/**
 * How a benchmark child process talks to bench/run.mjs: one JSON object per stdout line, each
 * naming its table. run.mjs groups the lines by table and prints them; any other stdout line is
 * passed through unchanged.
 *
 *   {"table": id, "title": text}                   the table's heading (first one wins)
 *   {"table": id, "row": {column: cell, ...}}      one row; columns in insertion order
 *   {"table": id, "note": text}                    a line printed under the table
 *   {"table": id, "fact": text}                    a machine or software fact the numbers depend on
 */
import { spawnSync } from 'node:child_process';

export type Cell = string | number;

function emit(line: Record<string, unknown>): void {
  process.stdout.write(`${JSON.stringify(line)}\n`);
}

export function emitTitle(table: string, title: string): void {
  emit({ table, title });
}

export function emitRow(table: string, row: Record<string, Cell>): void {
  emit({ table, row });
}

export function emitNote(table: string, note: string): void {
  emit({ table, note });
}

export function emitFact(table: string, fact: string): void {
  emit({ table, fact });
}

/** A number with `digits` significant digits, in plain notation where that is short. */
export function sig(value: number, digits = 3): string {
  if (!Number.isFinite(value)) return String(value);
  if (value === 0) return '0';
  const magnitude = Math.abs(value);
  if (magnitude >= 1e-3 && magnitude < 1e6) return Number(value.toPrecision(digits)).toString();
  return value.toExponential(digits - 1);
}

/** "1 fold, 2 hopf" from a list of event types, in order of first appearance ("none" when empty). */
export function eventSummary(types: readonly string[]): string {
  const counts = new Map<string, number>();
  for (const type of types) counts.set(type, (counts.get(type) ?? 0) + 1);
  return [...counts].map(([type, count]) => `${count} ${type}`).join(', ') || 'none';
}

/** Median of a non-empty list. */
export function median(values: readonly number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const mid = sorted.length >> 1;
  return sorted.length % 2 ? sorted[mid]! : (sorted[mid - 1]! + sorted[mid]!) / 2;
}

/** The repository root: bench/run.mjs starts every benchmark there. */
export const ROOT = process.cwd();

/**
 * BLAS threads for the Python references: one, like our single-threaded code, unless the caller
 * set OPENBLAS_NUM_THREADS (on a busy machine extra BLAS threads only add noise at these sizes).
 */
export const BLAS_THREADS = process.env.OPENBLAS_NUM_THREADS ?? '1';

/** Runs bench/reference/<script> with python3 and returns its one JSON object. */
export function runPython<T>(script: string, args: readonly (string | number)[]): T {
  return timedPython<T>(script, args).result;
}

/** runPython, and the wall time of the whole python3 process (interpreter start-up and imports included). */
export function timedPython<T>(script: string, args: readonly (string | number)[]): { result: T; wallSeconds: number } {
  const env = { ...process.env, OPENBLAS_NUM_THREADS: BLAS_THREADS, OMP_NUM_THREADS: BLAS_THREADS };
  const t0 = performance.now();
  const result = spawnSync('python3', [`bench/reference/${script}`, ...args.map(String)], {
    cwd: ROOT, encoding: 'utf8', timeout: 120_000, env,
  });
  const wallSeconds = (performance.now() - t0) / 1000;
  if (result.error) throw result.error;
  if (result.status !== 0) throw new Error(`python3 ${script} failed (${result.status}): ${result.stderr.trim()}`);
  const last = result.stdout.trim().split('\n').pop() ?? '';
  return { result: JSON.parse(last) as T, wallSeconds };
}
