/** Compiles a model from models/ for the continuation tests. */
import { readFileSync } from 'node:fs';
import { compileModel } from '../../src/compile/compileModel.js';
import { loadModel } from '../../src/model/loadModel.js';
import type { System } from '../../src/types.js';

export function modelSystem(file: string, set: Record<string, number> = {}): { system: System; params: Float64Array } {
  const path = new URL(`../../models/${file}`, import.meta.url);
  const system = compileModel(loadModel(readFileSync(path, 'utf8'), file));
  const params = Float64Array.from(system.info.parameters.map((q) => set[q.name] ?? q.value));
  return { system, params };
}

export function parameterIndex(system: System, name: string): number {
  const k = system.info.parameters.findIndex((q) => q.name === name);
  if (k < 0) throw new Error(`no parameter ${name}`);
  return k;
}

/** Compiles a model given as text (a test's own model). */
export function textSystem(text: string): System {
  return compileModel(loadModel(text, 'test.yaml'));
}
