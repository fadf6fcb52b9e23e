import { IMAG_TOL } from '../defaults.js';
import type { Eigenvalue } from '../types.js';

const MINUS = '\u2212';

/**
 * A number for people to read: `digits` significant digits, trailing zeros dropped, exponent form
 * outside 1e-4 … 1e6, a true minus sign, and words for values that are not finite.
 */
export function formatNumber(x: number, digits = 4): string {
  if (Number.isNaN(x)) return 'not a number';
  if (!Number.isFinite(x)) return x > 0 ? 'infinity' : `${MINUS}infinity`;
  if (x === 0) return '0';
  const a = Math.abs(x);
  const text = a >= 1e-4 && a < 1e6 ? trimZeros(a.toPrecision(digits)) : exponentForm(a, digits);
  return x < 0 ? MINUS + text : text;
}

function trimZeros(s: string): string {
  return s.includes('.') ? s.replace(/\.?0+$/, '') : s;
}

function exponentForm(a: number, digits: number): string {
  const [mantissa = '', exponent = ''] = a.toExponential(digits - 1).split('e');
  return `${trimZeros(mantissa)}e${exponent.replace('+', '').replace('-', MINUS)}`;
}

/**
 * Eigenvalues in one short line, a complex pair written once: "−0.12 ± 1.3i, −2". Pairs are recognised
 * by a matching eigenvalue with opposite imaginary part (relative tolerance IMAG_TOL of src/defaults.ts).
 */
export function formatEigenvalues(values: readonly Eigenvalue[], digits = 3): string {
  const used = new Array<boolean>(values.length).fill(false);
  const parts: string[] = [];
  values.forEach((v, i) => {
    if (used[i]) return;
    used[i] = true;
    if (v.im === 0) {
      parts.push(formatNumber(v.re, digits));
      return;
    }
    const j = values.findIndex((w, k) => !used[k] && isConjugate(v, w));
    if (j >= 0) used[j] = true;
    const sign = j >= 0 ? '\u00b1' : v.im > 0 ? '+' : MINUS;
    parts.push(`${formatNumber(v.re, digits)} ${sign} ${formatNumber(Math.abs(v.im), digits)}i`);
  });
  return parts.join(', ');
}

function isConjugate(a: Eigenvalue, b: Eigenvalue): boolean {
  const scale = Math.max(Math.abs(a.re), Math.abs(a.im), 1e-300);
  return Math.abs(a.re - b.re) <= IMAG_TOL * scale && Math.abs(a.im + b.im) <= IMAG_TOL * scale;
}
