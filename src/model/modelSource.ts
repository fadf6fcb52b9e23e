/**
 * The model text as a YAML document, with every node's place in the file.
 * Errors made here name file:line:column through `message.modelAt`.
 */
import { LineCounter, parseDocument, type Document, type Node } from 'yaml';
import { ModelError, message } from '../errors.js';
import type { SourceRef } from '../types.js';

export class ModelSource {
  readonly document: Document.Parsed;
  private readonly lines = new LineCounter();

  /** Parses `text`; a YAML syntax error becomes a ModelError at yaml's own position. */
  constructor(
    readonly text: string,
    readonly file: string,
  ) {
    // uniqueKeys: false so that repeated names reach our own "declared twice" check with both places.
    this.document = parseDocument(text, { lineCounter: this.lines, uniqueKeys: false, prettyErrors: false });
    const first = this.document.errors[0];
    if (first) throw this.error(first.pos[0], message.modelYamlSyntax(firstLine(first.message)));
  }

  /** The place of a 0-based character offset in the text. */
  at(offset: number): SourceRef {
    const { line, col } = this.lines.linePos(offset);
    return { file: this.file, line, column: col };
  }

  /** The place where a node starts (the file start when the node has no range). */
  refOf(node: Node | null | undefined): SourceRef {
    return this.at(node?.range?.[0] ?? 0);
  }

  /** The node's own text in the file, as written (for messages). */
  sourceOf(node: Node | null | undefined): string {
    const range = node?.range;
    return range ? this.text.slice(range[0], range[1]).trim() : '';
  }

  error(where: number | Node | null | undefined | SourceRef, what: string): ModelError {
    const ref = typeof where === 'number' ? this.at(where) : where && 'file' in where ? where : this.refOf(where);
    return new ModelError(message.modelAt(ref, what));
  }
}

/** yaml's messages end with " at line L, column C:" and a code frame; keep the first sentence only. */
function firstLine(text: string): string {
  return (text.split('\n')[0] ?? '').replace(/ at line \d+, column \d+:?$/, '').trim();
}
