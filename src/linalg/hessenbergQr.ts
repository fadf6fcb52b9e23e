/**
 * Eigenvalues of a real upper Hessenberg matrix by the Francis double-shift QR iteration, without
 * accumulating transformations: the EISPACK routine `hqr` (Martin, Peters & Wilkinson 1970,
 * "The QR algorithm for real Hessenberg matrices", Numer. Math. 14:219–231; Golub & Van Loan,
 * Matrix Computations, 4th ed., Algorithm 7.5.2 with the deflation test of §7.5.1).
 *
 * Bounded: at most `MAX_SWEEPS_PER_EIGENVALUE` sweeps between two deflations (the EISPACK limit
 * is 30; exceptional shifts at sweeps 10 and 20 as there). On failure the not yet deflated
 * eigenvalues are the current diagonal entries and `converged` is false.
 */

const MAX_SWEEPS_PER_EIGENVALUE = 30;

export interface HessenbergQrResult {
  re: Float64Array;
  im: Float64Array;
  converged: boolean;
  /** Double-shift QR sweeps used in total. */
  sweeps: number;
}

/** Destroys `h` (n×n row-major upper Hessenberg). */
export function hessenbergQr(h: Float64Array, n: number): HessenbergQrResult {
  const re = new Float64Array(n);
  const im = new Float64Array(n);
  const at = (i: number, j: number): number => h[i * n + j]!;
  let anorm = 0;
  for (let i = 0; i < n; i++) for (let j = Math.max(i - 1, 0); j < n; j++) anorm += Math.abs(at(i, j));
  let nn = n - 1;
  let t = 0;
  let its = 0;
  let sweeps = 0;
  while (nn >= 0) {
    // Look for a single small subdiagonal element.
    let l = nn;
    for (; l >= 1; l--) {
      let s = Math.abs(at(l - 1, l - 1)) + Math.abs(at(l, l));
      if (s === 0) s = anorm;
      if (Math.abs(at(l, l - 1)) + s === s) {
        h[l * n + l - 1] = 0;
        break;
      }
    }
    let x = at(nn, nn);
    if (l === nn) {
      re[nn] = x + t;
      im[nn] = 0;
      nn -= 1;
      its = 0;
      continue;
    }
    let y = at(nn - 1, nn - 1);
    let w = at(nn, nn - 1) * at(nn - 1, nn);
    if (l === nn - 1) {
      const p = 0.5 * (y - x);
      const q = p * p + w;
      const z = Math.sqrt(Math.abs(q));
      x += t;
      if (q >= 0) {
        const zz = p + (p >= 0 ? z : -z);
        re[nn - 1] = x + zz;
        re[nn] = zz !== 0 ? x - w / zz : x + zz;
        im[nn - 1] = 0;
        im[nn] = 0;
      } else {
        re[nn - 1] = x + p;
        re[nn] = x + p;
        im[nn - 1] = z;
        im[nn] = -z;
      }
      nn -= 2;
      its = 0;
      continue;
    }
    if (its === MAX_SWEEPS_PER_EIGENVALUE) {
      for (let i = 0; i <= nn; i++) {
        re[i] = at(i, i) + t;
        im[i] = 0;
      }
      return { re, im, converged: false, sweeps };
    }
    if (its === 10 || its === 20) {
      // Exceptional shift (EISPACK hqr).
      t += x;
      for (let i = 0; i <= nn; i++) h[i * n + i]! -= x;
      const s = Math.abs(at(nn, nn - 1)) + Math.abs(at(nn - 1, nn - 2));
      x = 0.75 * s;
      y = x;
      w = -0.4375 * s * s;
    }
    its += 1;
    sweeps += 1;
    francisSweep(h, n, l, nn, x, y, w);
  }
  return { re, im, converged: true, sweeps };
}

/** One implicit double-shift sweep on the active block rows/columns l…nn (shifts from x, y, w). */
function francisSweep(h: Float64Array, n: number, l: number, nn: number, x: number, y: number, w: number): void {
  const at = (i: number, j: number): number => h[i * n + j]!;
  let p = 0;
  let q = 0;
  let r = 0;
  let z = 0;
  // Look for two consecutive small subdiagonal elements.
  let m = nn - 2;
  for (; m >= l; m--) {
    z = at(m, m);
    const rr = x - z;
    const ss = y - z;
    p = (rr * ss - w) / at(m + 1, m) + at(m, m + 1);
    q = at(m + 1, m + 1) - z - rr - ss;
    r = at(m + 2, m + 1);
    const s = Math.abs(p) + Math.abs(q) + Math.abs(r);
    p /= s;
    q /= s;
    r /= s;
    if (m === l) break;
    const u = Math.abs(at(m, m - 1)) * (Math.abs(q) + Math.abs(r));
    const v = Math.abs(p) * (Math.abs(at(m - 1, m - 1)) + Math.abs(z) + Math.abs(at(m + 1, m + 1)));
    if (u + v === v) break;
  }
  for (let i = m + 2; i <= nn; i++) {
    h[i * n + i - 2] = 0;
    if (i !== m + 2) h[i * n + i - 3] = 0;
  }
  for (let k = m; k <= nn - 1; k++) {
    if (k !== m) {
      p = at(k, k - 1);
      q = at(k + 1, k - 1);
      r = k !== nn - 1 ? at(k + 2, k - 1) : 0;
      x = Math.abs(p) + Math.abs(q) + Math.abs(r);
      if (x !== 0) {
        p /= x;
        q /= x;
        r /= x;
      }
    }
    const norm = Math.sqrt(p * p + q * q + r * r);
    const s = p >= 0 ? norm : -norm;
    if (s === 0) continue;
    if (k === m) {
      if (l !== m) h[k * n + k - 1] = -at(k, k - 1);
    } else {
      h[k * n + k - 1] = -s * x;
    }
    p += s;
    x = p / s;
    y = q / s;
    z = r / s;
    q /= p;
    r /= p;
    // Row modification.
    for (let j = k; j <= nn; j++) {
      let pp = at(k, j) + q * at(k + 1, j);
      if (k !== nn - 1) {
        pp += r * at(k + 2, j);
        h[(k + 2) * n + j]! -= pp * z;
      }
      h[(k + 1) * n + j]! -= pp * y;
      h[k * n + j]! -= pp * x;
    }
    // Column modification.
    const mmin = nn < k + 3 ? nn : k + 3;
    for (let i = l; i <= mmin; i++) {
      let pp = x * at(i, k) + y * at(i, k + 1);
      if (k !== nn - 1) {
        pp += z * at(i, k + 2);
        h[i * n + k + 2]! -= pp * r;
      }
      h[i * n + k + 1]! -= pp * q;
      h[i * n + k]! -= pp;
    }
  }
}
