/**
 * Radical inverse (van der Corput) of i in base b, in [0, 1): the base-b digits of i mirrored about
 * the radix point. Coordinate d of the Halton sequence is radicalInverse(i, d-th prime) (Halton 1960,
 * Numer. Math. 2:84–90).
 */
export function radicalInverse(i: number, b: number): number {
  let f = 1;
  let r = 0;
  for (let k = i; k > 0; k = Math.floor(k / b)) {
    f /= b;
    r += f * (k % b);
  }
  return r;
}
