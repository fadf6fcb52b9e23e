/**
 * The one table that ties each one-argument function to its JavaScript implementation: constant
 * folding calls `FUNCTION_VALUES`, generated code calls `FUNCTION_CODE`, and they name the same
 * `Math` functions, so folded and run-time values agree bit for bit.
 */
import type { UnaryFunction } from './ir.js';

export const FUNCTION_VALUES: Readonly<Record<UnaryFunction, (v: number) => number>> = {
  exp: Math.exp,
  log: Math.log,
  sqrt: Math.sqrt,
  sin: Math.sin,
  cos: Math.cos,
  tan: Math.tan,
  tanh: Math.tanh,
  sinh: Math.sinh,
  cosh: Math.cosh,
  abs: Math.abs,
};

/** Fixed source text for each call; keyed by our own function names, never by user text. */
export const FUNCTION_CODE: Readonly<Record<UnaryFunction | 'min' | 'max' | 'pow', string>> = {
  exp: 'Math.exp',
  log: 'Math.log',
  sqrt: 'Math.sqrt',
  sin: 'Math.sin',
  cos: 'Math.cos',
  tan: 'Math.tan',
  tanh: 'Math.tanh',
  sinh: 'Math.sinh',
  cosh: 'Math.cosh',
  abs: 'Math.abs',
  min: 'Math.min',
  max: 'Math.max',
  pow: 'Math.pow',
};
