/**
 * The key/value entries of a YAML mapping, with keys as text, and the checks shared by all sections.
 */
import { isMap, isScalar, type Node, type YAMLMap } from 'yaml';
import { message } from '../errors.js';
import type { ModelSource } from './modelSource.js';

export interface MapEntry {
  key: string;
  keyNode: Node | null;
  value: Node | null;
}

/** The node as a mapping, or a ModelError at the node naming the section. */
export function asMapping(source: ModelSource, node: Node | null | undefined, section: string, fallback: number): YAMLMap {
  if (isMap(node)) return node;
  throw source.error(node ?? fallback, message.modelSectionNotMapping(section));
}

export function mapEntries(map: YAMLMap): MapEntry[] {
  return map.items.map((pair) => {
    const keyNode = (pair.key ?? null) as Node | null;
    const value = (pair.value ?? null) as Node | null;
    const key = isScalar(keyNode) ? String(keyNode.value ?? '') : '';
    return { key, keyNode, value };
  });
}

/** A text field (numbers are taken as their text, e.g. a unit `1`), or a ModelError at the value. */
export function textField(source: ModelSource, node: Node | null, key: string): string {
  if (isScalar(node) && typeof node.value === 'string') return node.value;
  if (isScalar(node) && typeof node.value === 'number') return source.sourceOf(node);
  throw source.error(node, message.modelNotText(key));
}
