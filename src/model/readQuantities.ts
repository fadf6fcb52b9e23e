/**
 * The `states` and `parameters` sections: each entry is a number, or a mapping with the number
 * (`start` for states, `value` for parameters) and optional `unit` and `about` text.
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
  const known = [field, 'unit', 'about'];
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
