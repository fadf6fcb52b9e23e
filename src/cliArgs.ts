/**
 * Parsing of command-line values: numbers, NAME=VALUE assignments and NAME=LO:HI boxes.
 * Every failure is a UsageError naming the option and the text it got.
 */
import { UsageError, message } from './errors.js';

/** A finite number from the whole text (no trailing junk, no empty string). */
export function parseNumber(option: string, text: string): number {
  const t = text.trim();
  const v = t === '' ? NaN : Number(t);
  if (!Number.isFinite(v)) throw new UsageError(message.badNumber(option, text));
  return v;
}

/** A whole number of at least `least` (a count: 1 or more, or 0 or more). */
export function parseWholeNumber(option: string, text: string, least: 0 | 1 = 1): number {
  const t = text.trim();
  const v = t === '' ? NaN : Number(t);
  if (!Number.isInteger(v) || v < least) throw new UsageError(message.badInteger(option, text, least));
  return v;
}

/** `NAME=VALUE` → [name, value]. */
export function parseAssignment(option: string, text: string): [string, number] {
  const m = /^\s*([A-Za-z_][A-Za-z0-9_]*)\s*=\s*(.+)$/.exec(text);
  if (!m) throw new UsageError(message.badAssignment(option, text));
  const v = Number(m[2]!.trim());
  if (!Number.isFinite(v)) throw new UsageError(message.badAssignment(option, text));
  return [m[1]!, v];
}

/** `NAME=LO:HI` → [name, lo, hi] with lo < hi. */
export function parseInterval(option: string, text: string): [string, number, number] {
  const m = /^\s*([A-Za-z_][A-Za-z0-9_]*)\s*=\s*([^:]+):(.+)$/.exec(text);
  const lo = m ? Number(m[2]!.trim()) : NaN;
  const hi = m ? Number(m[3]!.trim()) : NaN;
  if (!m || !Number.isFinite(lo) || !Number.isFinite(hi) || !(lo < hi)) {
    throw new UsageError(message.badInterval(option, text));
  }
  return [m[1]!, lo, hi];
}

/** Collector for repeatable options (commander's `collect` pattern). */
export function collect(value: string, previous: string[] = []): string[] {
  return [...previous, value];
}
