/**
 * Warnings for a branch whose walks did not end in the ordinary way (leaving the parameter range
 * or closing into a loop): where each direction stopped and why.
 */
import { message } from '../errors.js';
import type { StopReason } from '../types.js';
import type { ExtendedSystem } from './extendedSystem.js';
import type { WalkedBranch } from './traceBothWays.js';

export const STOP_WHY: Record<StopReason, string> = {
  'left range': 'it left the parameter range',
  'state bound': 'a state reached a bound the model gives it',
  'closed loop': 'it closed into a loop',
  unbounded: 'a state grew to a hundred times its largest value at the equilibria found and kept growing: the branch ' +
    'runs off to infinity near there (if it comes back, give that state a start value of its size in the model)',
  'point budget': 'the point budget per branch is used up; raise it to follow the branch further, give the ' +
    'states start values of their typical size in the model (steps are measured against them), or give them ' +
    'bounds (min, max) where values beyond mean nothing (a branch running off to infinity or to negative amounts)',
  corner: 'it reached a corner of the model (an abs, min or max switches there) that it cannot turn; a steady ' +
    'state may end there, so look at the branches on either side of it',
  'step too small': 'the step length fell below its smallest value (the corrector kept failing; one cause is a state ' +
    'that grows far beyond its start values, which give its typical size: give it a start value of that size)',
  'non-finite': 'the model gave a value that is not finite',
  interrupted: 'interrupted',
};

export function reportStops(ext: ExtendedSystem, walked: WalkedBranch, id: number, name: string, warnings: string[]): void {
  const { points, stops } = walked;
  const ends = [points[0], points[points.length - 1]];
  stops.forEach((stop, side) => {
    const end = ends[side];
    if (stop === null || stop === 'left range' || stop === 'state bound' || stop === 'closed loop' || stop === 'interrupted' || end === undefined) return;
    warnings.push(message.traceBranchStopped(id, STOP_WHY[stop], name, end.z[ext.n]!));
  });
}
