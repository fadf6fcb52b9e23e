/**
 * Model file text (YAML, or JSON with the same keys) → checked Model.
 *
 *   1. parse YAML with line counting          (ModelSource)
 *   2. check the top-level sections           (title, about, states, parameters, definitions, equations)
 *   3. declare states and parameters          (readQuantities, NameRegistry)
 *   4. parse definitions and equations        (readExpression)
 *   5. resolve names and definition order     (checkReferences)
 *
 * Every problem is a ModelError `file:line:column: what (name)`.
 */
import { readFileSync } from 'node:fs';
import { isMap, isScalar, type Node } from 'yaml';
import { ModelError, message, where } from '../errors.js';
import type { Model } from '../types.js';
import { checkDefinitionOrder, checkSymbols } from './checkReferences.js';
import { asMapping, mapEntries, textField, type MapEntry } from './mapEntries.js';
import { ModelSource } from './modelSource.js';
import { NameRegistry } from './nameRegistry.js';
import { readExpression, type ModelExpression } from './readExpression.js';
import { readQuantities, type Quantity } from './readQuantities.js';

export const SECTIONS = ['title', 'about', 'states', 'parameters', 'definitions', 'equations'] as const;
type Section = (typeof SECTIONS)[number];
type Sections = Map<Section, MapEntry>;

/** The top-level mapping, one entry per section present; states and equations are required. */
function readSections(source: ModelSource): Sections {
  const contents = source.document.contents as Node | null;
  if (contents === null || (isScalar(contents) && contents.value === null)) throw source.error(0, message.modelEmpty());
  if (!isMap(contents)) throw source.error(contents, message.modelNotMapping());
  const sections: Sections = new Map();
  for (const entry of mapEntries(contents)) {
    const section = SECTIONS.find((s) => s === entry.key);
    if (!section) throw source.error(entry.keyNode, message.modelUnknownSection(entry.key, SECTIONS));
    const first = sections.get(section);
    if (first) throw source.error(entry.keyNode, message.modelDuplicateName(section, where(source.refOf(first.keyNode))));
    sections.set(section, entry);
  }
  for (const required of ['states', 'equations'] as const) {
    if (!sections.has(required)) throw source.error(contents, message.modelMissingSection(required));
  }
  return sections;
}

/** The entries of a mapping section (absent or left empty → none). */
function sectionEntries(source: ModelSource, sections: Sections, section: Section): MapEntry[] {
  const entry = sections.get(section);
  if (!entry || (isScalar(entry.value) && entry.value.value === null)) return [];
  return mapEntries(asMapping(source, entry.value, section, entry.keyNode?.range?.[0] ?? 0));
}

/** One equation per state, in the order of the states. */
function readEquations(source: ModelSource, entries: MapEntry[], states: Quantity[], names: NameRegistry): ModelExpression[] {
  const stateNames = states.map((s) => s.name);
  const byState = new Map<string, { keyNode: Node | null; parsed: ModelExpression }>();
  for (const { key, keyNode, value } of entries) {
    if (!stateNames.includes(key)) throw source.error(keyNode, message.modelExtraEquation(key, stateNames));
    const first = byState.get(key);
    if (first) throw source.error(keyNode, message.modelDuplicateName(key, where(source.refOf(first.keyNode))));
    byState.set(key, { keyNode, parsed: readExpression(source, 'equations', key, value, (n) => names.has(n)) });
  }
  return states.map((s) => {
    const found = byState.get(s.name);
    if (!found) throw source.error(s.where, message.modelMissingEquation(s.name));
    return found.parsed;
  });
}

/** Parses and checks a model; `file` is used in messages and as `Model.file`. */
export function loadModel(text: string, file: string): Model {
  const source = new ModelSource(text, file);
  const sections = readSections(source);
  const names = new NameRegistry(source);

  const states = readQuantities(source, names, sectionEntries(source, sections, 'states'), 'start');
  if (states.length === 0) throw source.error(sections.get('states')?.keyNode, message.modelNoStates());
  const parameters = readQuantities(source, names, sectionEntries(source, sections, 'parameters'), 'value');

  const definitionEntries = sectionEntries(source, sections, 'definitions');
  for (const d of definitionEntries) names.declare(d.key, source.refOf(d.keyNode));
  const isDeclared = (n: string): boolean => names.has(n);
  const definitions = definitionEntries.map((d) => readExpression(source, 'definitions', d.key, d.value, isDeclared));
  const equations = readEquations(source, sectionEntries(source, sections, 'equations'), states, names);

  checkSymbols(source, 'definitions', definitions, names.names());
  checkDefinitionOrder(source, definitions);
  checkSymbols(source, 'equations', equations, names.names());

  const model: Model = {
    file,
    states: states.map(({ number, ...rest }) => ({ ...rest, start: number })),
    parameters: parameters.map(({ number, ...rest }) => ({ ...rest, value: number })),
    definitions: definitions.map(({ name, expr, text: t, where: w }) => ({ name, expr, text: t, where: w })),
    equations: equations.map(({ name, expr, text: t, where: w }) => ({ state: name, expr, text: t, where: w })),
  };
  for (const key of ['title', 'about'] as const) {
    const entry = sections.get(key);
    if (entry) model[key] = textField(source, entry.value, key);
  }
  return model;
}

const READ_FAILURES: Readonly<Record<string, string>> = {
  ENOENT: 'no such file',
  EACCES: 'permission denied',
  EISDIR: 'it is a directory',
};

/** Reads and loads a model file; an unreadable file is a ModelError naming the file and the reason. */
export function readModelFile(path: string): Model {
  let text: string;
  try {
    text = readFileSync(path, 'utf8');
  } catch (err) {
    const code = (err as NodeJS.ErrnoException).code ?? '';
    const reason = Object.hasOwn(READ_FAILURES, code) ? READ_FAILURES[code]! : (err as Error).message;
    throw new ModelError(message.cannotRead(path, reason));
  }
  return loadModel(text, path);
}
