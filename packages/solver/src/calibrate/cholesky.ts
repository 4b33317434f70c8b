/**
 * Cholesky factorisation A = L L^T of a symmetric positive definite matrix (row-major
 * Float64Array, n x n), with solves and the inverse (Golub & Van Loan, Matrix Computations,
 * 4th ed. 2013, algorithm 4.2.1). Used for the normal equations of least squares, where the
 * matrices are small (one row per rival) and well scaled.
 *
 * A pivot that is not clearly positive (<= tol times its original diagonal) means a column is
 * (nearly) a combination of the earlier ones; the result names that column instead of
 * returning a factor.
 */

export type CholeskyResult = { ok: true; L: Float64Array } | { ok: false; column: number };

export function cholesky(A: Float64Array, n: number, tol = 1e-10): CholeskyResult {
  const L = new Float64Array(n * n);
  for (let j = 0; j < n; j++) {
    let d = A[j * n + j]!;
    for (let k = 0; k < j; k++) d -= L[j * n + k]! * L[j * n + k]!;
    if (!(d > tol * Math.abs(A[j * n + j]!)) || !(d > 0)) return { ok: false, column: j };
    const ljj = Math.sqrt(d);
    L[j * n + j] = ljj;
    for (let i = j + 1; i < n; i++) {
      let s = A[i * n + j]!;
      for (let k = 0; k < j; k++) s -= L[i * n + k]! * L[j * n + k]!;
      L[i * n + j] = s / ljj;
    }
  }
  return { ok: true, L };
}

/** x with L L^T x = b. */
export function choleskySolve(L: Float64Array, n: number, b: ArrayLike<number>): Float64Array {
  const y = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    let s = b[i]!;
    for (let k = 0; k < i; k++) s -= L[i * n + k]! * y[k]!;
    y[i] = s / L[i * n + i]!;
  }
  const x = new Float64Array(n);
  for (let i = n - 1; i >= 0; i--) {
    let s = y[i]!;
    for (let k = i + 1; k < n; k++) s -= L[k * n + i]! * x[k]!;
    x[i] = s / L[i * n + i]!;
  }
  return x;
}

/** (L L^T)^-1, row-major. */
export function choleskyInverse(L: Float64Array, n: number): Float64Array {
  const inv = new Float64Array(n * n);
  const e = new Float64Array(n);
  for (let j = 0; j < n; j++) {
    e.fill(0);
    e[j] = 1;
    const col = choleskySolve(L, n, e);
    for (let i = 0; i < n; i++) inv[i * n + j] = col[i]!;
  }
  return inv;
}
