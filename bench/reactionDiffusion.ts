/**
 * Model texts for the benchmarks: two reaction–diffusion problems on (0, 1), discretised by
 * second-order central differences, written out as branchtrace model files (YAML) so that they go
 * through the same loadModel → compileModel path as a user's model.
 *
 * Bratu:  u_t = u_xx + lam e^u, u(0) = u(1) = 0, on N interior points, h = 1/(N+1):
 *   du_i/dt = d (u_{i-1} − 2u_i + u_{i+1}) + lam exp(u_i),  d = 1/h²,  u_0 = u_{N+1} = 0.
 * (bench/reference/bratu.py is the same model in numpy.)
 *
 * Brusselator (Prigogine & Lefever 1968) with diffusion, two species on `cells` interior points:
 *   du_i/dt = du (u_{i-1} − 2u_i + u_{i+1}) + a − (b+1) u_i + u_i² v_i
 *   dv_i/dt = dv (v_{i-1} − 2v_i + v_{i+1}) + b u_i − u_i² v_i
 * with du = Du/h², dv = Dv/h² and Dirichlet values at the homogeneous state u = a, v = b/a on both
 * ends, so (u, v) ≡ (a, b/a) is an equilibrium for every b (the trivial branch).
 */

export interface BenchModelText {
  name: string;
  text: string;
  /** The swept parameter. */
  vary: string;
  /** Start states at the beginning of the sweep (corrected by Newton in traceBranches). */
  start: (from: number) => Float64Array;
}

function yamlMap(entries: [string, string | number][]): string {
  return entries.map(([key, value]) => `  ${key}: ${value}`).join('\n');
}

export function bratuModel(points: number): BenchModelText {
  const u = (i: number): string => (i < 1 || i > points ? '0' : `u${i}`);
  const states: [string, number][] = [];
  const equations: [string, string][] = [];
  for (let i = 1; i <= points; i++) {
    states.push([u(i), 0]);
    const left = u(i - 1) === '0' ? '' : `${u(i - 1)} `;
    const right = u(i + 1) === '0' ? '' : ` + ${u(i + 1)}`;
    const sum = left === '' ? `-2*${u(i)}${right}` : `${left}- 2*${u(i)}${right}`;
    equations.push([u(i), `d*(${sum}) + lam*exp(${u(i)})`]);
  }
  const text = [
    `title: Bratu problem on ${points} interior points`,
    'states:', yamlMap(states),
    'parameters:', yamlMap([['lam', 1], ['d', (points + 1) ** 2]]),
    'equations:', yamlMap(equations),
  ].join('\n');
  return { name: `Bratu, ${points} points`, text, vary: 'lam', start: () => new Float64Array(points) };
}

export const BRUSSELATOR = { a: 1, Du: 0.01, Dv: 0.02 } as const;

export function brusselatorModel(cells: number): BenchModelText {
  const inv = (cells + 1) ** 2;
  const at = (s: 'u' | 'v', i: number): string => (i >= 1 && i <= cells ? `${s}${i}` : s === 'u' ? 'a' : '(b/a)');
  const states: [string, number][] = [];
  const equations: [string, string][] = [];
  for (const s of ['u', 'v'] as const) {
    for (let i = 1; i <= cells; i++) states.push([`${s}${i}`, s === 'u' ? BRUSSELATOR.a : 2 / BRUSSELATOR.a]);
  }
  for (let i = 1; i <= cells; i++) {
    const u = at('u', i);
    const v = at('v', i);
    equations.push([u, `du*(${at('u', i - 1)} - 2*${u} + ${at('u', i + 1)}) + a - (b + 1)*${u} + ${u}^2*${v}`]);
  }
  for (let i = 1; i <= cells; i++) {
    const u = at('u', i);
    const v = at('v', i);
    equations.push([v, `dv*(${at('v', i - 1)} - 2*${v} + ${at('v', i + 1)}) + b*${u} - ${u}^2*${v}`]);
  }
  const text = [
    `title: Brusselator with diffusion on ${cells} interior points`,
    'states:', yamlMap(states),
    'parameters:',
    yamlMap([['b', 2], ['a', BRUSSELATOR.a], ['du', BRUSSELATOR.Du * inv], ['dv', BRUSSELATOR.Dv * inv]]),
    'equations:', yamlMap(equations),
  ].join('\n');
  const start = (from: number): Float64Array => {
    const x = new Float64Array(2 * cells);
    x.fill(BRUSSELATOR.a, 0, cells);
    x.fill(from / BRUSSELATOR.a, cells);
    return x;
  };
  return { name: `Brusselator, ${cells} cell${cells === 1 ? '' : 's'}`, text, vary: 'b', start };
}

export type ExpectedKind = 'fold' | 'hopf' | 'branch point';

/** A special point known in closed form, with the relative tolerance a match must meet. */
export interface ExpectedPoint {
  kind: ExpectedKind;
  at: number;
  relTol: number;
}

/**
 * Special points on the branch through the start, analytic.
 *
 * Bratu, 2 points (h = 1/3, d = 9): on the symmetric branch u1 = u2 = u, f = −9u + lam e^u = 0, so
 * lam = 9u e^(−u). The Jacobian [[−18 + lam e^u, 9], [9, −18 + lam e^u]] has eigenvalues
 * lam e^u − 9 = 9(u − 1) (symmetric vector) and lam e^u − 27 = 9(u − 3) (antisymmetric vector):
 * a fold at u = 1, lam = 9/e, and a symmetry-breaking branch point at u = 3, lam = 27 e^(−3).
 *
 * Bratu, N points, N large: the continuum fold of u'' + lam e^u = 0, u(0) = u(1) = 0. With
 * u = 2 ln(cosh θ / cosh(θ(1 − 2x))), lam = 8θ²/cosh²θ, largest where θ tanh θ = 1 (θ ≈ 1.1997),
 * lam ≈ 3.51383. The difference scheme moves it by O(h²), hence the tolerance.
 */
export function bratuExpected(points: number): ExpectedPoint[] {
  if (points === 2) {
    return [
      { kind: 'fold', at: 9 / Math.E, relTol: 1e-6 },
      { kind: 'branch point', at: 27 * Math.exp(-3), relTol: 1e-6 },
    ];
  }
  let theta = 1.2;
  for (let i = 0; i < 50; i++) {
    const g = theta * Math.tanh(theta) - 1;
    const dg = Math.tanh(theta) + theta / Math.cosh(theta) ** 2;
    theta -= g / dg;
  }
  const h = 1 / (points + 1);
  return [{ kind: 'fold', at: (8 * theta * theta) / Math.cosh(theta) ** 2, relTol: Math.max(1e-4, 2 * h * h) }];
}

/**
 * Special points on the trivial branch (u, v) ≡ (a, b/a) of the Brusselator with diffusion, from
 * its linearisation mode by mode. The discrete Dirichlet Laplacian on `cells` points has
 * eigenvalues μ_k = −4(cells+1)² sin²(kπ / (2(cells+1))), k = 1..cells, and mode k has the 2×2 matrix
 *   J_k = [[b − 1 + Du μ_k, a²], [−b, −a² + Dv μ_k]].
 * Hopf: trace J_k = 0 with det J_k > 0, b = 1 + a² − (Du + Dv) μ_k.
 * Branch point: det J_k = 0, (b − 1 + Du μ_k)(−a² + Dv μ_k) + a² b = 0, b = (1 − Du μ_k)(Dv μ_k − a²)/(Dv μ_k).
 */
export function brusselatorExpected(cells: number, from: number, to: number): ExpectedPoint[] {
  const { a, Du, Dv } = BRUSSELATOR;
  const lo = Math.min(from, to);
  const hi = Math.max(from, to);
  const found: ExpectedPoint[] = [];
  for (let k = 1; k <= cells; k++) {
    const mu = -4 * (cells + 1) ** 2 * Math.sin((k * Math.PI) / (2 * (cells + 1))) ** 2;
    const hopf = 1 + a * a - (Du + Dv) * mu;
    const det = (hopf - 1 + Du * mu) * (-a * a + Dv * mu) + a * a * hopf;
    if (hopf >= lo && hopf <= hi && det > 0) found.push({ kind: 'hopf', at: hopf, relTol: 1e-6 });
    const branch = ((1 - Du * mu) * (Dv * mu - a * a)) / (Dv * mu);
    if (branch >= lo && branch <= hi) found.push({ kind: 'branch point', at: branch, relTol: 1e-6 });
  }
  return found.sort((x, y) => x.at - y.at);
}
