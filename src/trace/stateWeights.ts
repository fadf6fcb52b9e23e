/**
 * Weights of the scaled arclength. States and the parameter can differ by orders of magnitude
 * (a reactor temperature near 350 against a Damköhler number near 0.1; a pressure range of 1e5 Pa
 * against a mole fraction below 1), so the continuation works in z = (w ⊙ x, λ) with a weighted
 * norm (Allgower & Georg, Numerical Continuation Methods, 1990, §2.1; scaling each unknown by a
 * typical size of it is common practice). With R = |to − from| and σ_i the largest |x_i| over
 * the equilibria found at the start and the model's start values, the weight brings each state's
 * size into the range of sizes the steps (fractions of R, traceSettings.ts) can resolve:
 *
 *   w_i σ_i = min(σ_i, R)                  for σ_i ≥ a R  (a = TRACE.smallestStateShare = 0.1),
 *   w_i σ_i = a R                          for σ_i < a R.
 *
 * A state much larger than R is shrunk so that a change by its own size counts as much as the
 * whole sweep. A state much smaller than R is enlarged to a tenth of it: otherwise a branch of
 * such states lies closer to its neighbours than one step (a pitchfork at λ = 1000 whose new states
 * reach ±1 at λ = 2000), and the new branch cannot be started or slides back onto the old one.
 * States in between keep the weight 1: enlarging them all the way to R would count every grid
 * value of a discretised field as a quantity of its own and multiply the points of such models
 * (the 20-point Bratu sweep: 336 → 870 points) for no gain in what is found.
 *
 * A state that is zero at every equilibrium found and in the model (σ_i at or below
 * ZERO_SIZE · R, which also catches zeros found only to rounding) has no typical size: it keeps the
 * weight 1. The price of enlarging: a state that grows far beyond its largest value at the starts
 * (a hundredfold, say) needs that many times more points; the point-budget warning then says that
 * start values of typical size in the model help.
 */
import { TRACE } from '../defaults.js';
import { largestMagnitudes } from '../linalg/norm.js';

const ZERO_SIZE = 1e-8;

export function stateWeights(starts: readonly Float64Array[], n: number, from: number, to: number): Float64Array {
  const range = Math.abs(to - from);
  const size = largestMagnitudes(starts, n);
  const smallest = TRACE.smallestStateShare * range;
  return Float64Array.from(size, (s) => (s > ZERO_SIZE * range ? Math.max(smallest, Math.min(s, range)) / s : 1));
}
