import type { Report } from '../types.js';

/**
 * report.json: keys in the order of the Report type (src/types.ts) whatever order the object was built
 * in; maps from model names (state values) keep the model's order. Numbers keep full precision
 * (shortest round-trip form); values that are not finite become null. Two-space indent, final newline:
 * the layout of `JSON.stringify(value, null, 2)`, written directly (a sweep's report holds thousands
 * of points, and reordering each object before stringifying took most of the file's time).
 */
export function renderJson(report: Report): string {
  const out: string[] = [];
  write(report, '', '', out);
  out.push('\n');
  return out.join('');
}

/** Every key of the report's objects, in one order that agrees with the declaration order of each type. */
const KEY_ORDER = [
  'tool', 'version', 'id', 'index', 'name', 'type', 'kind', 'file', 'title', 'model', 'event', 'parameter', 'nominal',
  'start', 'value', 'min', 'max', 'unit', 'about', 'states', 'parameters', 'range', 'state', 'branch', 'stable', 'from', 'to',
  'unstableCount', 'settings', 'parameterIndex', 'ds', 'dsMin', 'dsMax', 'maxPoints', 'absTol', 'maxIter',
  'maxBranches', 'stopped', 'origin', 'points', 'maxRealPart', 'stability', 'branches', 'events', 'eigenvalues', 're',
  'im', 'meaning', 'residual', 'iterations', 'step', 'test', 'quantity', 'before', 'after', 'foldCoefficient', 'lyapunov', 'criticality', 'frequency', 'period',
  'newBranches', 'corner', 'margin', 'operatingStable', 'operatingUnstableCount', 'below', 'above', 'distance', 'relative', 'nearestRelative', 'status', 'warnMargin',
  'failMargin', 'searchedAt', 'parameterScale', 'warnings', 'interrupted', 'caution',
];
const RANK = new Map(KEY_ORDER.map((k, i) => [k, i]));
/** Objects under these keys are maps keyed by model names: their order is the model's. */
const NAME_MAPS = new Set(['state']);

function write(value: unknown, parentKey: string, indent: string, out: string[]): void {
  switch (typeof value) {
    case 'number':
      out.push(Number.isFinite(value) ? String(value) : 'null');
      return;
    case 'string':
      out.push(JSON.stringify(value));
      return;
    case 'boolean':
      out.push(value ? 'true' : 'false');
      return;
  }
  if (value === null || typeof value !== 'object') {
    out.push('null'); // as JSON.stringify writes undefined in an array
    return;
  }
  const inner = `${indent}  `;
  if (Array.isArray(value)) {
    if (value.length === 0) return void out.push('[]');
    out.push('[\n');
    for (let i = 0; i < value.length; i++) {
      out.push(inner);
      write(value[i], '', inner, out);
      out.push(i + 1 < value.length ? ',\n' : '\n');
    }
    out.push(indent, ']');
    return;
  }
  const record = value as Record<string, unknown>;
  const keys = Object.keys(record).filter((k) => record[k] !== undefined);
  if (keys.length === 0) return void out.push('{}');
  const order = NAME_MAPS.has(parentKey) ? keys : keys.sort(compareKeys);
  out.push('{\n');
  for (let i = 0; i < order.length; i++) {
    const k = order[i]!;
    out.push(inner, JSON.stringify(k), ': ');
    write(record[k], k, inner, out);
    out.push(i + 1 < order.length ? ',\n' : '\n');
  }
  out.push(indent, '}');
}

function compareKeys(a: string, b: string): number {
  const ra = RANK.get(a) ?? Infinity;
  const rb = RANK.get(b) ?? Infinity;
  if (ra !== rb) return ra < rb ? -1 : 1;
  return a < b ? -1 : a > b ? 1 : 0;
}
