import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { ModelError, message } from '../../src/errors.js';
import { formatExpression } from '../../src/model/expr.js';
import { SECTIONS, loadModel, readModelFile } from '../../src/model/loadModel.js';
import { FUNCTION_NAMES } from '../../src/types.js';

const FILE = 'm.yaml';
const at = (line: number, column: number, what: string): string => message.modelAt({ file: FILE, line, column }, what);
const place = (line: number, column: number): string => `${FILE}:${line}:${column}`;

const TANK = `title: Cooled exothermic tank
about: a test model
states:
  c: 0.2
  T: { start: 0.5, unit: K, about: temperature rise }
parameters:
  D: 0.05
  B: { value: 8, unit: "-", about: heat of reaction group }
definitions:
  rate: D*(1-c)*exp(T)
  gain: B*rate
equations:
  T: -T + gain - 0.3*T
  c: -c + rate
`;

function loadError(text: string): string {
  try {
    loadModel(text, FILE);
  } catch (err) {
    if (err instanceof ModelError) return err.message;
    throw err;
  }
  throw new Error('the model was accepted');
}

describe('loadModel reads a well-formed model', () => {
  const model = loadModel(TANK, FILE);

  it('keeps states and parameters in file order with their numbers, units and descriptions', () => {
    expect(model.states).toEqual([
      { name: 'c', start: 0.2, where: { file: FILE, line: 4, column: 3 } },
      { name: 'T', start: 0.5, unit: 'K', about: 'temperature rise', where: { file: FILE, line: 5, column: 3 } },
    ]);
    expect(model.parameters.map((p) => [p.name, p.value, p.unit])).toEqual([['D', 0.05, undefined], ['B', 8, '-']]);
    expect([model.title, model.about]).toEqual(['Cooled exothermic tank', 'a test model']);
  });

  it('keeps the bounds a state is given, and none where it is given none', () => {
    const model = loadModel('states:\n  c: { start: 0.5, min: 0, unit: mol/L }\n  a: { start: 1, min: -3.5, max: 3.5 }\n  y: 2\nequations:\n  c: -c\n  a: -a\n  y: -y\n', 'b.yaml');
    expect(model.states.map((q) => [q.name, q.min, q.max])).toEqual([['c', 0, undefined], ['a', -3.5, 3.5], ['y', undefined, undefined]]);
  });

  it('orders equations like the states, whatever their order in the file', () => {
    expect(model.equations.map((e) => [e.state, e.text])).toEqual([['c', '-c + rate'], ['T', '-T + gain - 0.3*T']]);
    expect(model.equations[0]!.where).toEqual({ file: FILE, line: 14, column: 6 });
  });

  it('returns definitions in dependency order with parsed trees', () => {
    expect(model.definitions.map((d) => d.name)).toEqual(['rate', 'gain']);
    expect(formatExpression(model.definitions[0]!.expr)).toBe('D * (1 - c) * exp(T)');
  });

  it('reads JSON with the same keys, numbers as equations, and no parameters at all', () => {
    const json = loadModel('{"states": {"x": {"start": 1}}, "equations": {"x": 0}}', 'm.json');
    expect(json.parameters).toEqual([]);
    expect(json.equations[0]!.expr).toEqual({ kind: 'num', value: 0, pos: { offset: 1 } });
  });

  it('reads a file from disk', () => {
    const dir = mkdtempSync(join(tmpdir(), 'branchtrace-model-'));
    const path = join(dir, 'tank.yaml');
    writeFileSync(path, TANK);
    expect(readModelFile(path).states.map((s) => s.name)).toEqual(['c', 'T']);
  });

  it('names the file and the reason when the file cannot be read', () => {
    const path = join(tmpdir(), 'branchtrace-no-such-model.yaml');
    expect(() => readModelFile(path)).toThrow(new ModelError(message.cannotRead(path, 'no such file')));
  });
});

describe('loadModel reports each problem at its line and column', () => {
  const base = (equations: string, extra = ''): string =>
    `states:\n  x: 1\n  y: 2\nparameters:\n  k: 0.5\n${extra}equations:\n${equations}`;
  const xy = '  x: k*x\n  y: -y\n';

  it.each([
    ['a YAML syntax error, at yaml\'s position', 'states: {x: 1\n', at(2, 1, message.modelYamlSyntax(
      'Flow map in block collection must be sufficiently indented and end with a }'))],
    ['an empty file', '', at(1, 1, message.modelEmpty())],
    ['a file of comments only', '# nothing\n', at(1, 1, message.modelEmpty())],
    ['a list instead of a mapping', '- x\n', at(1, 1, message.modelNotMapping())],
    ['an unknown section', `${base(xy)}titel: t\n`, at(9, 1, message.modelUnknownSection('titel', SECTIONS))],
    ['a missing states section', 'equations:\n  x: 1\n', at(1, 1, message.modelMissingSection('states'))],
    ['a missing equations section', 'states:\n  x: 1\n', at(1, 1, message.modelMissingSection('equations'))],
    ['an empty states section', 'states:\nequations:\n', at(1, 1, message.modelNoStates())],
    ['a section that is not a mapping', 'states: [1]\nequations: {}\n', at(1, 9, message.modelSectionNotMapping('states'))],
    ['a text start value', 'states:\n  x: "1"\nequations:\n  x: 1\n', at(2, 6, message.modelBadNumber('x', 'start', '""1""'))],
    ['an infinite parameter value', base(xy).replace('k: 0.5', 'k: .inf'), at(5, 6, message.modelBadNumber('k', 'value', '".inf"'))],
    ['a missing start value', 'states:\n  x:\nequations:\n  x: 1\n', at(2, 5, message.modelBadNumber('x', 'start', 'nothing'))],
    ['an unknown sub-key', base(xy).replace('k: 0.5', 'k: { value: 1, units: s }'),
      at(5, 18, message.modelUnknownField('k', 'units', ['value', 'unit', 'about']))],
    ['a start key on a parameter', base(xy).replace('k: 0.5', 'k: { start: 1 }'),
      at(5, 8, message.modelUnknownField('k', 'start', ['value', 'unit', 'about']))],
    ['a state whose min is not below its max', base(xy).replace('  x: 1\n', '  x: { start: 1, min: 2, max: 2 }\n'),
      at(2, 31, message.modelBadBounds('x', 2, 2))],
    ['a start outside the state\'s bounds', base(xy).replace('  x: 1\n', '  x: { start: -1, min: 0 }\n'),
      at(2, 15, message.modelStartOutsideBounds('x', -1, 0, undefined))],
    ['a text bound', base(xy).replace('  x: 1\n', '  x: { start: 1, max: big }\n'), at(2, 23, message.modelBadNumber('x', 'max', '"big"'))],
    ['a bound on a parameter', base(xy).replace('k: 0.5', 'k: { value: 1, min: 0 }'),
      at(5, 18, message.modelUnknownField('k', 'min', ['value', 'unit', 'about']))],
    ['a detailed entry without its number', base(xy).replace('k: 0.5', 'k: { unit: s }'),
      at(5, 6, message.modelMissingField('k', 'value'))],
    ['a parameter named like a state', base(xy).replace('k: 0.5', 'x: 0.5'), at(5, 3, message.modelDuplicateName('x', place(2, 3)))],
    ['a repeated YAML key', base(xy).replace('  y: 2\n', '  x: 2\n'), at(3, 3, message.modelDuplicateName('x', place(2, 3)))],
    ['a definition shadowing a state', base(xy, 'definitions:\n  y: 2*k\n'), at(7, 3, message.modelDuplicateName('y', place(3, 3)))],
    ['a repeated equation', base(`${xy}  x: 0\n`), at(9, 3, message.modelDuplicateName('x', place(7, 3)))],
    ['a function name as a parameter', base(xy).replace('k: 0.5', 'exp: 0.5'), at(5, 3, message.modelReservedName('exp'))],
    ['a constant name as a state', base(xy).replace('y: 2', 'pi: 2'), at(3, 3, message.modelReservedName('pi'))],
    ['__proto__ as a parameter', base(xy).replace('k: 0.5', '__proto__: 0.5'), at(5, 3, message.modelReservedName('__proto__'))],
    ['constructor as a state', base(xy).replace('y: 2', 'constructor: 2'), at(3, 3, message.modelReservedName('constructor'))],
    ['prototype as a definition', base(xy, 'definitions:\n  prototype: 1\n'), at(7, 3, message.modelReservedName('prototype'))],
    ['a malformed name', base(xy).replace('k: 0.5', '2k: 0.5'), at(5, 3, message.modelBadName('2k'))],
    ['an unknown symbol', base('  x: kk*x\n  y: -y\n'),
      at(7, 6, message.modelInExpression(message.modelUnknownSymbol('kk', ['x', 'y', 'k']), 'equations', 'x'))],
    ['__proto__ used in an expression', base('  x: __proto__\n  y: -y\n'),
      at(7, 6, message.modelInExpression(message.modelUnknownSymbol('__proto__', ['x', 'y', 'k']), 'equations', 'x'))],
    ['a missing equation', base('  x: k*x\n'), at(3, 3, message.modelMissingEquation('y'))],
    ['an equation for a parameter', base(`${xy}  k: 1\n`), at(9, 3, message.modelExtraEquation('k', ['x', 'y']))],
    ['a syntax error inside a plain value', base('  x: k*x +\n  y: -y\n'),
      at(7, 10, message.modelInExpression(message.exprMissingOperand('+'), 'equations', 'x'))],
    ['a syntax error inside a quoted value', base('  x: "k*x; 1"\n  y: -y\n'),
      at(7, 10, message.modelInExpression(message.exprCharacter(';'), 'equations', 'x'))],
    ['a syntax error inside a block value, at the value', base('  x: |\n    k*x +\n  y: -y\n'),
      at(7, 6, message.modelInExpression(message.exprMissingOperand('+'), 'equations', 'x'))],
    ['a call to an unknown function', base('  x: evaluate(x)\n  y: -y\n'),
      at(7, 6, message.modelInExpression(message.exprUnknownFunction('evaluate', FUNCTION_NAMES), 'equations', 'x'))],
    ['a call of a parameter', base('  x: x*k(x + 1)\n  y: -y\n'),
      at(7, 8, message.modelInExpression(message.exprNotAFunction('k'), 'equations', 'x'))],
    ['a mapping as an equation', base('  x: { a: 1 }\n  y: -y\n'), at(7, 6, message.modelBadExpression('x'))],
    ['a definition used before it is defined', base(xy, 'definitions:\n  a: 2*b\n  b: k\n'),
      at(7, 8, message.modelInExpression(message.modelUsedBeforeDefined('b'), 'definitions', 'a'))],
    ['a definition that uses itself', base(xy, 'definitions:\n  a: k + a\n'),
      at(7, 10, message.modelInExpression(message.modelDefinitionCycle(['a', 'a']), 'definitions', 'a'))],
    ['definitions that form a cycle', base(xy, 'definitions:\n  a: k*b\n  b: 1 + c\n  c: a^2\n'),
      at(7, 8, message.modelInExpression(message.modelDefinitionCycle(['a', 'b', 'c', 'a']), 'definitions', 'a'))],
  ])('reports %s', (_what, text, expected) => {
    expect(loadError(text)).toBe(expected);
  });

  it('rejects 10,000 nested parentheses in an equation with the nesting message', () => {
    const deep = `${'('.repeat(10_000)}x${')'.repeat(10_000)}`;
    expect(loadError(base(`  x: ${deep}\n  y: -y\n`))).toBe(
      at(7, 6 + 64, message.modelInExpression(message.exprTooDeep(64), 'equations', 'x')),
    );
  });
});
