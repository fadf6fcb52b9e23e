/**
 * Expression text → tokens. Only numbers, names, `+ - * / ^`, parentheses and commas exist;
 * every other character is rejected here with a message that says what it looked like.
 */
import { message } from '../errors.js';
import { ExpressionSyntaxError } from './expressionSyntaxError.js';

export type TokenKind = 'num' | 'name' | 'op' | '(' | ')' | ',' | 'end';

export interface Token {
  kind: TokenKind;
  text: string;
  /** 1-based offset of the first character. */
  offset: number;
}

const NUMBER = /(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?/y;
const NAME = /[A-Za-z_][A-Za-z0-9_]*/y;
const MALFORMED_TAIL = /[0-9.eE+-]*/y;
const WHITESPACE = new Set([' ', '\t', '\n', '\r']);
const OPERATORS = new Set(['+', '-', '*', '/', '^']);
const PUNCTUATION = new Set(['(', ')', ',']);

function matchAt(re: RegExp, text: string, i: number): string {
  re.lastIndex = i;
  return re.exec(text)?.[0] ?? '';
}

/** A number token, or an error when it is malformed (`1.2.3`, `1e+`) or overflows. */
function scanNumber(text: string, i: number): Token {
  const s = matchAt(NUMBER, text, i);
  const after = text[i + s.length];
  const badExponent = (after === 'e' || after === 'E') && /[+-]/.test(text[i + s.length + 1] ?? '');
  if (after === '.' || badExponent) {
    throw new ExpressionSyntaxError(i + 1, message.exprMalformedNumber(s + matchAt(MALFORMED_TAIL, text, i + s.length)));
  }
  if (!Number.isFinite(Number(s))) throw new ExpressionSyntaxError(i + 1, message.exprNumberOverflow(s));
  return { kind: 'num', text: s, offset: i + 1 };
}

/** The message for a character that cannot start any token. */
function rejectCharacter(text: string, i: number): ExpressionSyntaxError {
  const ch = String.fromCodePoint(text.codePointAt(i)!);
  const next = text[i + 1];
  const at = i + 1;
  if (ch === '.') {
    const name = matchAt(NAME, text, i + 1);
    return new ExpressionSyntaxError(at, name ? message.exprPropertyAccess(name) : message.exprCharacter(ch));
  }
  if (ch === '=' || ch === '<' || ch === '>' || ch === '!') {
    if (next === '=') return new ExpressionSyntaxError(at, message.exprComparison(ch + next));
    if (ch === '=') return new ExpressionSyntaxError(at, message.exprAssignment());
    if (ch !== '!') return new ExpressionSyntaxError(at, message.exprComparison(ch));
  }
  if (ch === '"' || ch === "'" || ch === '`') return new ExpressionSyntaxError(at, message.exprQuote());
  if ('[]{}'.includes(ch)) return new ExpressionSyntaxError(at, message.exprBracket(ch));
  return new ExpressionSyntaxError(at, message.exprCharacter(ch));
}

/** All tokens of `text`, ending with one `end` token whose offset is just past the text. */
export function tokenize(text: string): Token[] {
  const tokens: Token[] = [];
  let i = 0;
  while (i < text.length) {
    const ch = text[i]!;
    if (WHITESPACE.has(ch)) {
      i++;
    } else if (/[0-9]/.test(ch) || (ch === '.' && /[0-9]/.test(text[i + 1] ?? ''))) {
      const t = scanNumber(text, i);
      tokens.push(t);
      i += t.text.length;
    } else if (/[A-Za-z_]/.test(ch)) {
      const s = matchAt(NAME, text, i);
      tokens.push({ kind: 'name', text: s, offset: i + 1 });
      i += s.length;
    } else if (OPERATORS.has(ch)) {
      tokens.push({ kind: 'op', text: ch, offset: i + 1 });
      i++;
    } else if (PUNCTUATION.has(ch)) {
      tokens.push({ kind: ch as '(' | ')' | ',', text: ch, offset: i + 1 });
      i++;
    } else {
      throw rejectCharacter(text, i);
    }
  }
  tokens.push({ kind: 'end', text: '', offset: text.length + 1 });
  return tokens;
}
