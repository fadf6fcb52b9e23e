/**
 * One expression value of the model file (a definition or an equation) → parsed tree with its place.
 *
 * `where` is the place of the expression text's first character. When the text sits on one line,
 * plain or quoted without escapes, a node's column is `where.column + pos.offset - 1`; otherwise
 * (block scalars, escapes, several lines) errors point at the value's start.
 */
import { isScalar, type Node } from 'yaml';
import { message } from '../errors.js';
import type { Expr, SourceRef } from '../types.js';
import { ExpressionSyntaxError, parseExpression } from './expr.js';
import type { ModelSource } from './modelSource.js';

export interface ModelExpression {
  name: string;
  text: string;
  expr: Expr;
  where: SourceRef;
  /** Whether node offsets map exactly onto file columns from `where`. */
  exact: boolean;
}

/** The expression text and where its first character is, or a ModelError for a non-text value. */
function locateText(source: ModelSource, node: Node | null, name: string): { text: string; where: SourceRef; exact: boolean } {
  if (!isScalar(node) || (typeof node.value !== 'string' && typeof node.value !== 'number')) {
    throw source.error(node, message.modelBadExpression(name));
  }
  const start = node.range?.[0] ?? 0;
  const raw = source.sourceOf(node);
  const text = typeof node.value === 'number' ? raw : node.value;
  const oneLine = !raw.includes('\n');
  if (node.type === 'PLAIN' && oneLine) return { text, where: source.at(start), exact: raw === text };
  const quoted = node.type === 'QUOTE_SINGLE' || node.type === 'QUOTE_DOUBLE';
  if (quoted && oneLine && raw.slice(1, -1) === text) return { text, where: source.at(start + 1), exact: true };
  return { text, where: source.at(start), exact: false };
}

/** The file place of a node at `offset` within the expression. */
export function placeOf(e: Pick<ModelExpression, 'where' | 'exact'>, offset: number): SourceRef {
  return e.exact ? { ...e.where, column: e.where.column + offset - 1 } : e.where;
}

/**
 * Parses the value of `section.name`. `isDeclared` tells whether a name called like a function is
 * a model name (then the message says it is not a function).
 */
export function readExpression(
  source: ModelSource,
  section: string,
  name: string,
  node: Node | null,
  isDeclared: (name: string) => boolean,
): ModelExpression {
  const located = locateText(source, node, name);
  try {
    return { name, ...located, expr: parseExpression(located.text) };
  } catch (err) {
    if (!(err instanceof ExpressionSyntaxError)) throw err;
    const detail =
      err.unknownCall !== undefined && isDeclared(err.unknownCall) ? message.exprNotAFunction(err.unknownCall) : err.detail;
    throw source.error(placeOf(located, err.offset), message.modelInExpression(detail, section, name));
  }
}
