/**
 * The names a model declares (states, parameters, definitions), checked as they are declared:
 * well-formed, not reserved, and declared once across all sections.
 */
import { message, where } from '../errors.js';
import { CONSTANTS, FUNCTION_NAMES, type SourceRef } from '../types.js';
import type { ModelSource } from './modelSource.js';

const NAME = /^[A-Za-z_][A-Za-z0-9_]*$/;

/**
 * Names that would be unsafe as keys of plain JavaScript objects (reports map state names to
 * values) or that read as something else: functions and constants. Common practice.
 */
const OBJECT_HAZARDS = [
  'constructor', 'prototype', 'hasOwnProperty', 'isPrototypeOf', 'propertyIsEnumerable',
  'toString', 'toLocaleString', 'valueOf',
];

export function isReservedName(name: string): boolean {
  return (
    name.startsWith('__') ||
    OBJECT_HAZARDS.includes(name) ||
    (FUNCTION_NAMES as readonly string[]).includes(name) ||
    Object.hasOwn(CONSTANTS, name)
  );
}

export class NameRegistry {
  private readonly declared = new Map<string, SourceRef>();

  constructor(private readonly source: ModelSource) {}

  /** Checks and records `name`, declared at `ref`; throws a ModelError at `ref` otherwise. */
  declare(name: string, ref: SourceRef): void {
    if (!NAME.test(name)) throw this.source.error(ref, message.modelBadName(name));
    if (isReservedName(name)) throw this.source.error(ref, message.modelReservedName(name));
    const first = this.declared.get(name);
    if (first) throw this.source.error(ref, message.modelDuplicateName(name, where(first)));
    this.declared.set(name, ref);
  }

  has(name: string): boolean {
    return this.declared.has(name);
  }

  /** All names in declaration order. */
  names(): string[] {
    return [...this.declared.keys()];
  }
}
