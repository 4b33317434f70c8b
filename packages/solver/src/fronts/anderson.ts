/**
 * Anderson acceleration of a fixed-point iteration u <- G(u): Walker & Ni 2011, "Anderson
 * acceleration for fixed-point iterations", SIAM Journal on Numerical Analysis 49 (volume from
 * memory). With residuals f_j = G(u_j) - u_j of the last m + 1 iterates, the next iterate is
 *   u+ = G(u_k) - sum_j gamma_j (G(u_j+1) - G(u_j)),
 *   gamma = argmin || f_k - sum_j gamma_j (f_j+1 - f_j) ||_2,
 * solved here by the normal equations with a small ridge (m is a handful). Restarts the history
 * when the residual grows, so a bad extrapolation costs one plain step.
 */

export interface Anderson {
  /** the next iterate from the current one and its image G(u) */
  next(u: readonly number[], g: readonly number[]): number[];
}

export function anderson(depth = 5): Anderson {
  const us: number[][] = [];
  const gs: number[][] = [];
  let lastNorm = Infinity;
  return {
    next(u, g) {
      const f = g.map((x, i) => x - u[i]!);
      const norm = Math.hypot(...f);
      if (norm > 2 * lastNorm) {
        us.length = 0;
        gs.length = 0;
      }
      lastNorm = norm;
      us.push(u.slice());
      gs.push(g.slice());
      if (us.length > depth + 1) {
        us.shift();
        gs.shift();
      }
      const m = us.length - 1;
      if (m === 0) return g.slice();
      const res = (j: number) => gs[j]!.map((x, i) => x - us[j]![i]!);
      const dF: number[][] = [];
      const dG: number[][] = [];
      for (let j = 0; j < m; j++) {
        const a = res(j);
        const b = res(j + 1);
        dF.push(b.map((x, i) => x - a[i]!));
        dG.push(gs[j + 1]!.map((x, i) => x - gs[j]![i]!));
      }
      // normal equations (dF^T dF + ridge) gamma = dF^T f
      const A = dF.map((p) => dF.map((q) => p.reduce((s, x, i) => s + x * q[i]!, 0)));
      const rhs = dF.map((p) => p.reduce((s, x, i) => s + x * f[i]!, 0));
      const trace = A.reduce((s, row, j) => s + row[j]!, 0);
      for (let j = 0; j < m; j++) A[j]![j] = A[j]![j]! + 1e-12 * trace + 1e-300;
      const gamma = solveSmall(A, rhs);
      if (!gamma) return g.slice();
      return g.map((x, i) => x - dG.reduce((s, col, j) => s + gamma[j]! * col[i]!, 0));
    },
  };
}

/** Gaussian elimination with partial pivoting; null when singular. */
function solveSmall(A: number[][], b: number[]): number[] | null {
  const m = b.length;
  const M = A.map((row, j) => [...row, b[j]!]);
  for (let c = 0; c < m; c++) {
    let p = c;
    for (let r = c + 1; r < m; r++) if (Math.abs(M[r]![c]!) > Math.abs(M[p]![c]!)) p = r;
    if (!(Math.abs(M[p]![c]!) > 0)) return null;
    [M[c], M[p]] = [M[p]!, M[c]!];
    for (let r = c + 1; r < m; r++) {
      const k = M[r]![c]! / M[c]![c]!;
      for (let q = c; q <= m; q++) M[r]![q] = M[r]![q]! - k * M[c]![q]!;
    }
  }
  const x = new Array<number>(m).fill(0);
  for (let c = m - 1; c >= 0; c--) {
    let s = M[c]![m]!;
    for (let q = c + 1; q < m; q++) s -= M[c]![q]! * x[q]!;
    x[c] = s / M[c]![c]!;
  }
  return x.every(Number.isFinite) ? x : null;
}
