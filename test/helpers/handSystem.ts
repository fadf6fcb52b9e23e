/**
 * Hand-made `System` objects for tests: closed-form rhs and Jacobian written in TypeScript, so
 * numerical stages can be tested without the model compiler.
 *
 * Derivatives not given are approximated by central differences of the given ones (step 1e-6,
 * relative to max(1, |x_j|)); tests that check higher derivatives should pass exact closures.
 */
import type { System } from '../../src/types.js';

type Vec = Float64Array;

export interface HandSystemSpec {
  n: number;
  /** Parameter values (nominal), default none. */
  parameters?: Record<string, number>;
  /** State names and start values, default x1, x2, … starting at 0. */
  states?: Record<string, number>;
  rhs: (x: Vec, p: Vec, out: Vec) => void;
  jacobian: (x: Vec, p: Vec, out: Vec) => void;
  paramDerivative?: System['paramDerivative'];
  secondDerivative?: System['secondDerivative'];
  thirdDerivative?: System['thirdDerivative'];
  mixedDerivative?: System['mixedDerivative'];
  title?: string;
}

const H = 1e-6;

/** out = (g(z + h d) − g(z − h d)) / 2h, with g writing into its last argument. */
function centralDifference(z: Vec, d: Vec, g: (zz: Vec, out: Vec) => void, out: Vec): void {
  let scale = 1;
  for (let i = 0; i < z.length; i++) scale = Math.max(scale, Math.abs(z[i]!));
  const h = H * scale;
  const plus = z.slice();
  const minus = z.slice();
  for (let i = 0; i < z.length; i++) {
    plus[i] = z[i]! + h * d[i]!;
    minus[i] = z[i]! - h * d[i]!;
  }
  const a = new Float64Array(out.length);
  const b = new Float64Array(out.length);
  g(plus, a);
  g(minus, b);
  for (let i = 0; i < out.length; i++) out[i] = (a[i]! - b[i]!) / (2 * h);
}

function matVec(m: Vec, v: Vec, n: number, out: Vec): void {
  for (let i = 0; i < n; i++) {
    let s = 0;
    for (let j = 0; j < n; j++) s += m[i * n + j]! * v[j]!;
    out[i] = s;
  }
}

export function makeSystem(spec: HandSystemSpec): System {
  const { n } = spec;
  const stateEntries = Object.entries(spec.states ?? Object.fromEntries(Array.from({ length: n }, (_, i) => [`x${i + 1}`, 0])));
  const paramEntries = Object.entries(spec.parameters ?? {});
  const np = paramEntries.length;
  const jv = (x: Vec, p: Vec, v: Vec, out: Vec): void => {
    const jac = new Float64Array(n * n);
    spec.jacobian(x, p, jac);
    matVec(jac, v, n, out);
  };
  const unit = (k: number): Vec => {
    const e = new Float64Array(np);
    e[k] = 1;
    return e;
  };
  const secondDerivative: System['secondDerivative'] = spec.secondDerivative ??
    ((x, p, u, v, out) => centralDifference(x, u, (xx, o) => jv(xx, p, v, o), out));
  return {
    info: {
      file: 'hand-made',
      ...(spec.title !== undefined ? { title: spec.title } : {}),
      states: stateEntries.map(([name, start]) => ({ name, start })),
      parameters: paramEntries.map(([name, value]) => ({ name, value })),
    },
    n,
    np,
    rhs: spec.rhs,
    jacobian: spec.jacobian,
    paramDerivative: spec.paramDerivative ??
      ((x, p, k, out) => centralDifference(p, unit(k), (pp, o) => spec.rhs(x, pp, o), out)),
    secondDerivative,
    thirdDerivative: spec.thirdDerivative ??
      ((x, p, u, v, w, out) => centralDifference(x, u, (xx, o) => secondDerivative(xx, p, v, w, o), out)),
    mixedDerivative: spec.mixedDerivative ??
      ((x, p, k, v, out) => centralDifference(p, unit(k), (pp, o) => jv(x, pp, v, o), out)),
  };
}

/** The parameter vector of a hand-made system, in declaration order. */
export function nominalParameters(system: System): Float64Array {
  return Float64Array.from(system.info.parameters.map((q) => q.value));
}
