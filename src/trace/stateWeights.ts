/**
 * Weights of the scaled arclength. States and the parameter can differ by orders of magnitude
 * (a reactor temperature near 350 against a Damköhler number near 0.1), so the continuation works
 * in z = (w ⊙ x, λ) with a weighted norm (Allgower & Georg, Numerical Continuation Methods, 1990,
 * §2.1; the choice of weights is common practice):
 *
 *   w_i = min(1, R / σ_i),  R = |to − from|,  σ_i = max over the starts of |x_i|.
 *
 * A state much larger than the parameter range is shrunk so that a change by its own size counts
 * as much as the whole sweep; every other state keeps the plain Euclidean weight 1. States are
 * never weighted up: the size of a state at the start says little about how far it moves along a
 * branch (the 1-D Bratu solution grows a hundredfold from λ = 0.1 to the fold; the Lorenz rolls
 * grow from zero), and a weight of R/σ for a small σ would make such branches need huge numbers
 * of points. Steps stay controlled by the corrector and the turning angle either way.
 */
export function stateWeights(starts: readonly Float64Array[], n: number, from: number, to: number): Float64Array {
  const range = Math.abs(to - from);
  const w = new Float64Array(n).fill(1);
  for (const x of starts) {
    for (let i = 0; i < n; i++) {
      const size = Math.abs(x[i]!);
      if (Number.isFinite(size) && size > range) w[i] = Math.min(w[i]!, range / size);
    }
  }
  return w;
}
