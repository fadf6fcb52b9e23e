/**
 * Reduction to upper Hessenberg form by Householder reflections, H = QᵀAQ (Golub & Van Loan,
 * Matrix Computations, 4th ed., Algorithm 7.4.2). Q is not accumulated: only eigenvalues are
 * wanted. Works in place on row-major Float64Array storage; entries below the subdiagonal are
 * set to exactly zero.
 */

/** Reduce the n×n row-major matrix to upper Hessenberg form in place. `v` is scratch of length ≥ n. */
export function hessenbergInPlace(a: Float64Array, n: number, v: Float64Array = new Float64Array(n)): void {
  for (let k = 0; k < n - 2; k++) {
    // Householder vector for the column below the subdiagonal, rows k+1 … n−1.
    let scale = 0;
    for (let i = k + 1; i < n; i++) scale += Math.abs(a[i * n + k]!);
    if (scale === 0) continue;
    let sigma = 0;
    for (let i = k + 1; i < n; i++) {
      const x = a[i * n + k]! / scale;
      v[i] = x;
      sigma += x * x;
    }
    const x0 = v[k + 1]!;
    const alpha = x0 >= 0 ? -Math.sqrt(sigma) : Math.sqrt(sigma);
    v[k + 1] = x0 - alpha;
    // vᵀv = σ − 2 x0 α + α² = 2(σ − x0 α).
    const vtv = 2 * (sigma - x0 * alpha);
    if (vtv === 0) continue;
    const beta = 2 / vtv;
    // Left: rows k+1…n−1 of columns k+1…n−1 (column k is set directly below).
    for (let j = k + 1; j < n; j++) {
      let s = 0;
      for (let i = k + 1; i < n; i++) s += v[i]! * a[i * n + j]!;
      s *= beta;
      if (s === 0) continue;
      for (let i = k + 1; i < n; i++) a[i * n + j]! -= s * v[i]!;
    }
    // Right: all rows, columns k+1…n−1.
    for (let i = 0; i < n; i++) {
      const ri = i * n;
      let s = 0;
      for (let j = k + 1; j < n; j++) s += a[ri + j]! * v[j]!;
      s *= beta;
      if (s === 0) continue;
      for (let j = k + 1; j < n; j++) a[ri + j]! -= s * v[j]!;
    }
    a[(k + 1) * n + k] = alpha * scale;
    for (let i = k + 2; i < n; i++) a[i * n + k] = 0;
  }
}
