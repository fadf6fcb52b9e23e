/**
 * A syntax error inside one expression text. It knows only the 1-based offset in that text;
 * the model loader turns it into a ModelError naming file:line:column.
 */
export class ExpressionSyntaxError extends Error {
  /**
   * @param offset 1-based column within the expression text.
   * @param detail The message without any place (one of the `message.expr*` functions).
   * @param unknownCall Set when the error is a call to a name that is not a function, so the loader can
   *   say "not a function" when that name is a state, parameter or definition.
   */
  constructor(
    readonly offset: number,
    readonly detail: string,
    readonly unknownCall?: string,
  ) {
    super(`column ${offset}: ${detail}`);
    this.name = 'ExpressionSyntaxError';
  }
}
