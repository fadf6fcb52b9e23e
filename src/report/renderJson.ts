import type { Report } from '../types.js';

/**
 * report.json: keys in the order of the Report type (src/types.ts) whatever order the object was built
 * in; maps from model names (state values) keep the model's order. Numbers keep full precision
 * (shortest round-trip form); values that are not finite become null. Two-space indent, final newline.
 */
export function renderJson(report: Report): string {
  return JSON.stringify(ordered(report, ''), null, 2) + '\n';
}

/** Every key of the report's objects, in one order that agrees with the declaration order of each type. */
const KEY_ORDER = [
  'tool', 'version', 'id', 'index', 'name', 'type', 'kind', 'file', 'title', 'model', 'event', 'parameter', 'nominal',
  'start', 'value', 'unit', 'about', 'states', 'parameters', 'range', 'state', 'branch', 'stable', 'from', 'to',
  'unstableCount', 'settings', 'parameterIndex', 'ds', 'dsMin', 'dsMax', 'maxPoints', 'absTol', 'maxIter',
  'maxBranches', 'stopped', 'origin', 'points', 'maxRealPart', 'stability', 'branches', 'events', 'eigenvalues', 're',
  'im', 'meaning', 'residual', 'iterations', 'step', 'test', 'quantity', 'before', 'after', 'foldCoefficient', 'lyapunov', 'criticality', 'frequency', 'period',
  'newBranches', 'corner', 'margin', 'operatingStable', 'operatingUnstableCount', 'below', 'above', 'distance', 'relative', 'nearestRelative', 'status', 'warnMargin',
  'failMargin', 'warnings', 'interrupted', 'caution',
];
const RANK = new Map(KEY_ORDER.map((k, i) => [k, i]));
/** Objects under these keys are maps keyed by model names: their order is the model's. */
const NAME_MAPS = new Set(['state']);

function ordered(value: unknown, parentKey: string): unknown {
  if (typeof value === 'number') return Number.isFinite(value) ? value : null;
  if (Array.isArray(value)) return value.map((v) => ordered(v, ''));
  if (value === null || typeof value !== 'object') return value;
  const entries = Object.entries(value as Record<string, unknown>).filter(([, v]) => v !== undefined);
  if (!NAME_MAPS.has(parentKey)) entries.sort(([a], [b]) => compareKeys(a, b));
  return Object.fromEntries(entries.map(([k, v]) => [k, ordered(v, k)]));
}

function compareKeys(a: string, b: string): number {
  const ra = RANK.get(a) ?? Infinity;
  const rb = RANK.get(b) ?? Infinity;
  if (ra !== rb) return ra < rb ? -1 : 1;
  return a < b ? -1 : a > b ? 1 : 0;
}
