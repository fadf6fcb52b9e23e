/** Plain bisection to the rounding level, for reference values computed inside tests. */
export function bisect(g: (x: number) => number, a: number, b: number): number {
  let ga = g(a);
  if (ga * g(b) > 0) throw new Error(`no sign change in [${a}, ${b}]`);
  for (let i = 0; i < 200; i++) {
    const m = 0.5 * (a + b);
    if (m === a || m === b) break;
    const gm = g(m);
    if (gm === 0) return m;
    if (gm * ga < 0) b = m;
    else {
      a = m;
      ga = gm;
    }
  }
  return 0.5 * (a + b);
}
