/**
 * The `states` and `parameters` sections: each entry is a number, or a mapping with the number
 * (`start` for states, `value` for parameters) and optional `unit` and `about` text; a state may
 * also have bounds `min` and/or `max` (a concentration cannot be negative, an angle stays within a
 * turn), with min < max and the start inside them.
 */
import { isMap, isScalar, type Node, type YAMLMap } from 'yaml';
import { message, where } from '../errors.js';
import type { SourceRef } from '../types.js';
import { mapEntries, textField, type MapEntry } from './mapEntries.js';
import type { ModelSource } from './modelSource.js';
import type { NameRegistry } from './nameRegistry.js';

export interface Quantity {
  name: string;
  number: number;
  unit?: string;
  about?: string;
  /** Bounds of a state (none for parameters). */
  min?: number;
  max?: number;
  where: SourceRef;
}

/** What a non-number looked like, for the message. */
function describe(source: ModelSource, node: Node | null): string {
  if (isMap(node)) return 'a mapping';
  if (isScalar(node) && node.value === null) return 'nothing';
  const text = source.sourceOf(node);
  return text === '' ? 'nothing' : `"${text}"`;
}

function finiteNumber(source: ModelSource, node: Node | null, name: string, field: string): number {
  if (isScalar(node) && typeof node.value === 'number' && Number.isFinite(node.value)) return node.value;
  throw source.error(node, message.modelBadNumber(name, field, describe(source, node)));
}

function readDetailed(source: ModelSource, map: YAMLMap, name: string, field: 'start' | 'value'): Omit<Quantity, 'where'> {
  const known = field === 'start' ? [field, 'min', 'max', 'unit', 'about'] : [field, 'unit', 'about'];
  const seen = new Map<string, MapEntry>();
  for (const entry of mapEntries(map)) {
    if (!known.includes(entry.key)) {
      throw source.error(entry.keyNode, message.modelUnknownField(name, entry.key, known));
    }
    const first = seen.get(entry.key);
    if (first) throw source.error(entry.keyNode, message.modelDuplicateName(entry.key, where(source.refOf(first.keyNode))));
    seen.set(entry.key, entry);
  }
  if (!seen.has(field)) throw source.error(map, message.modelMissingField(name, field));
  const q: Omit<Quantity, 'where'> = { name, number: finiteNumber(source, seen.get(field)?.value ?? null, name, field) };
  for (const side of ['min', 'max'] as const) {
    if (seen.has(side)) q[side] = finiteNumber(source, seen.get(side)?.value ?? null, name, side);
  }
  if (q.min !== undefined && q.max !== undefined && !(q.min < q.max)) {
    throw source.error(seen.get('max')!.value, message.modelBadBounds(name, q.min, q.max));
  }
  if ((q.min !== undefined && q.number < q.min) || (q.max !== undefined && q.number > q.max)) {
    throw source.error(seen.get(field)!.value, message.modelStartOutsideBounds(name, q.number, q.min, q.max));
  }
  if (seen.has('unit')) q.unit = textField(source, seen.get('unit')?.value ?? null, 'unit');
  if (seen.has('about')) q.about = textField(source, seen.get('about')?.value ?? null, 'about');
  return q;
}

/** Reads the entries of one section; `field` names the number (`start` or `value`). */
export function readQuantities(
  source: ModelSource,
  names: NameRegistry,
  entries: readonly MapEntry[],
  field: 'start' | 'value',
): Quantity[] {
  return entries.map(({ key, keyNode, value }) => {
    const ref = source.refOf(keyNode);
    names.declare(key, ref);
    const q = isMap(value) ? readDetailed(source, value, key, field) : { name: key, number: finiteNumber(source, value, key, field) };
    return { ...q, where: ref };
  });
}
