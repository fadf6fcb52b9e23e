import type { StopReason } from '../types.js';

/** Why a branch stopped, in words. */
export function stopWords(reason: StopReason): string {
  switch (reason) {
    case 'left range':
      return 'it left the parameter range';
    case 'state bound':
      return 'a state reached a bound the model gives it (min or max)';
    case 'closed loop':
      return 'it closed on itself (a loop)';
    case 'unbounded':
      return 'a state grew without bound (a hundred times its typical size)';
    case 'point budget':
      return 'it used up its point budget';
    case 'corner':
      return 'it reached a corner of the model (an abs, min or max switches) that it cannot turn';
    case 'step too small':
      return 'the step length fell below its smallest allowed value';
    case 'non-finite':
      return 'the model gave values that are not finite';
    case 'interrupted':
      return 'the run was interrupted';
  }
}
