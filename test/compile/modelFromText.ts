/** Test helper: Model objects from short texts, parsed by the project's expression parser. */
import { parseExpression } from '../../src/model/expr.js';
import type { Model } from '../../src/types.js';

export interface ModelText {
  states: Record<string, number>;
  parameters?: Record<string, number>;
  definitions?: [string, string][];
  equations: Record<string, string>;
}

const at = (line: number) => ({ file: 'test.yaml', line, column: 5 });

export function modelFromText(m: ModelText): Model {
  let line = 1;
  const states = Object.entries(m.states).map(([name, start]) => ({ name, start, where: at(line++) }));
  const parameters = Object.entries(m.parameters ?? {}).map(([name, value]) => ({ name, value, where: at(line++) }));
  const definitions = (m.definitions ?? []).map(([name, text]) => ({ name, text, expr: parseExpression(text), where: at(line++) }));
  const equations = states.map(({ name }) => {
    const text = m.equations[name];
    if (text === undefined) throw new Error(`test helper: no equation for ${name}`);
    return { state: name, text, expr: parseExpression(text), where: at(line++) };
  });
  return { file: 'test.yaml', states, parameters, definitions, equations };
}

/** Start values and parameter values as arrays. */
export function startOf(model: Model): { x: Float64Array; p: Float64Array } {
  return {
    x: Float64Array.from(model.states, (s) => s.start),
    p: Float64Array.from(model.parameters, (q) => q.value),
  };
}
