/**
 * Optimal mixed strategies of a finite two-player zero-sum game (von Neumann's minimax
 * theorem) by linear programming, solved with the primal simplex method on a dense tableau
 * (Dantzig 1951; Bland's 1977 rule takes over after many pivots so degenerate games cannot
 * cycle). The textbook reduction: shift the matrix so every entry is positive, then the column
 * player's problem is max 1'y s.t. A y <= 1, y >= 0, whose slack basis is feasible from the
 * start (no phase one). The column strategy is y / 1'y, the value row' A col, and the row
 * strategy comes from the dual prices of the slack rows. Common practice, no source beyond
 * the textbook reduction (for instance Luce & Raiffa 1957, appendix 5; from memory).
 */

export interface MatrixGameSolution {
  /** row player's optimal mixed strategy (maximiser) */
  row: number[];
  /** column player's optimal mixed strategy (minimiser) */
  col: number[];
  /** value of the game to the row player */
  value: number;
  /** false when the pivot limit was reached (never expected) */
  converged: boolean;
}

/**
 * a[i][j]: payoff to the row player (maximiser) when row i meets column j. Each player's
 * strategy is read from the primal solution of its own programme (the row player's is the
 * column player's of -A'): dual prices lose accuracy when two rows are nearly equal, which the
 * grid refinement of the mixed-equilibrium search produces on purpose.
 */
export function solveMatrixGame(a: readonly (readonly number[])[]): MatrixGameSolution {
  const m = a.length;
  const n = a[0]?.length ?? 0;
  if (m === 0 || n === 0) throw new Error("solveMatrixGame: empty matrix");
  const colSide = columnPlayer(a);
  // a symmetric game (a + a' constant: the same strategy set and payoffs for both sides)
  // has the column player's optimal strategy optimal for the row player too
  const rowSide = symmetric(a)
    ? colSide
    : columnPlayer(Array.from({ length: n }, (_, j) => a.map((row) => -row[j]!)));
  const row = rowSide.col;
  const col = colSide.col;
  // the value as row' A col
  let value = 0;
  for (let i = 0; i < m; i++) {
    if (row[i]! === 0) continue;
    let s = 0;
    for (let j = 0; j < n; j++) s += a[i]![j]! * col[j]!;
    value += row[i]! * s;
  }
  return { row, col, value, converged: colSide.converged && rowSide.converged };
}

/** True when a is square and a[i][j] + a[j][i] is the same for every pair (up to rounding). */
function symmetric(a: readonly (readonly number[])[]): boolean {
  const m = a.length;
  if (a[0]!.length !== m) return false;
  const k = 2 * a[0]![0]!;
  const tol = 1e-12 * Math.max(1, Math.abs(k));
  for (let i = 0; i < m; i++) {
    for (let j = i; j < m; j++) if (Math.abs(a[i]![j]! + a[j]![i]! - k) > tol) return false;
  }
  return true;
}

/** Pivot elements below this are treated as zero (entries of the shifted matrix are >= 1). */
const PIVOT_TOL = 1e-9;

/** The simplex on max 1'y s.t. (A + shift) y <= 1: the column player's optimal strategy. */
function columnPlayer(a: readonly (readonly number[])[]): { col: number[]; converged: boolean } {
  const m = a.length;
  const n = a[0]?.length ?? 0;
  if (m === 0 || n === 0) throw new Error("solveMatrixGame: empty matrix");
  let lo = Infinity;
  for (const row of a) for (const x of row) lo = Math.min(lo, x);
  const shift = 1 - lo; // every shifted entry >= 1
  const width = n + m + 1; // y columns, slack columns, right-hand side
  const t = new Float64Array((m + 1) * width); // last row: objective (reduced costs, negated)
  for (let i = 0; i < m; i++) {
    const row = a[i]!;
    for (let j = 0; j < n; j++) t[i * width + j] = row[j]! + shift;
    t[i * width + n + i] = 1;
    t[i * width + width - 1] = 1;
  }
  const obj = m * width;
  for (let j = 0; j < n; j++) t[obj + j] = -1;
  const basis = Int32Array.from({ length: m }, (_, i) => n + i);
  const maxPivots = 50 * (m + n) + 1000;
  const blandAfter = 10 * (m + n) + 100;
  let converged = false;
  for (let it = 0; it < maxPivots; it++) {
    // entering column: most negative reduced cost (Dantzig), or the first negative (Bland)
    let enter = -1;
    let best = -1e-12;
    for (let j = 0; j < n + m; j++) {
      const c = t[obj + j]!;
      if (c < best) {
        enter = j;
        if (it >= blandAfter) break;
        best = c;
      }
    }
    if (enter < 0) {
      converged = true;
      break;
    }
    // ratio test; among (near-)ties the largest pivot element keeps the tableau well
    // conditioned, or under Bland's rule the smallest basic index
    const bland = it >= blandAfter;
    let leave = -1;
    let ratio = Infinity;
    let size = 0;
    for (let i = 0; i < m; i++) {
      const p = t[i * width + enter]!;
      if (p > PIVOT_TOL) {
        const q = Math.max(0, t[i * width + width - 1]!) / p; // rounding may leave -1e-17
        const tie = Math.abs(q - ratio) <= 1e-12 * Math.max(1, ratio);
        if ((!tie && q < ratio) || (tie && (bland ? basis[i]! < basis[leave]! : p > size))) {
          ratio = Math.min(q, ratio);
          leave = i;
          size = p;
        }
      }
    }
    if (leave < 0) throw new Error("solveMatrixGame: unbounded (cannot happen for A > 0)");
    pivot(t, m + 1, width, leave, enter);
    basis[leave] = enter;
  }
  const y = new Array<number>(n).fill(0);
  for (let i = 0; i < m; i++) {
    const b = basis[i]!;
    if (b < n) y[b] = Math.max(0, t[i * width + width - 1]!);
  }
  const sy = y.reduce((s, v) => s + v, 0);
  return { col: y.map((v) => v / sy), converged };
}

function pivot(t: Float64Array, rows: number, width: number, r: number, c: number): void {
  const base = r * width;
  const p = t[base + c]!;
  // only the pivot row's nonzero columns change the other rows (slack columns are mostly zero)
  const cols: number[] = [];
  for (let j = 0; j < width; j++) {
    const v = t[base + j]!;
    if (v !== 0) {
      t[base + j] = v / p;
      cols.push(j);
    }
  }
  for (let i = 0; i < rows; i++) {
    if (i === r) continue;
    const f = t[i * width + c]!;
    if (f === 0) continue;
    const off = i * width;
    for (const j of cols) t[off + j] = t[off + j]! - f * t[base + j]!;
  }
}
