/**
 * Analytic comparative statics of the ratio-form contest with r = 1 and any number of rivals
 * (Hillman & Riley 1989, Economics & Politics 1; Stein 2002, Public Choice 113; volume numbers
 * from memory). With a_i = m_i / (w_i v_i), active set K of size k, S = sum_K a_j:
 *   Y = (k - 1) / S,   w_i e_i = Y (1 - a_i Y),   p_i = 1 - a_i Y,   u_i = v_i (1 - a_i Y)^2.
 * Differentiating (derived here; checked against numerical derivatives in the tests), for i, j in K:
 *   dY/da_j   = -Y^2 / (k - 1)
 *   de_i/da_j = (1 - 2 a_i Y) / w_i * dY/da_j - [i = j] Y^2 / w_i
 *   du_i/da_j = -2 v_i (1 - a_i Y) (a_i dY/da_j + [i = j] Y)
 * and zero when i or j is outside K (a locally stable active set). Parameters enter through
 * a_j (da_j/dm_j = a_j/m_j, da_j/dw_j = -a_j/w_j, da_j/dv_j = -a_j/v_j), plus the direct terms
 * e_i = y_i / w_i (weight) and u_i = v_i p_i^2 (value).
 * Two rivals with common v and w = 1 give e_1 = v m_2 / (m_1 + m_2)^2 and
 * de_1/dm_2 = v (m_1 - m_2) / (m_1 + m_2)^3, which changes sign at m_1 = m_2.
 */
import type { Contest } from "../types";

export interface ActiveSetState {
  a: number[];
  active: boolean[];
  k: number;
  Y: number;
}

/** Margin by which an active set must be strictly interior for the derivative to exist. */
const MARGIN = 1e-9;

/**
 * Reads the active set and aggregate from an equilibrium profile and checks the conditions
 * under which the formulas above hold: ratio form with every r_i = 1, no leader, no binding
 * budget, every rival strictly inside or strictly outside. Returns null otherwise.
 */
export function hillmanRileyStaticsState(
  contest: Contest,
  efforts: readonly number[],
): ActiveSetState | null {
  if (contest.csf.kind !== "ratio" || contest.leader !== null) return null;
  const n = contest.rivals.length;
  const a: number[] = [];
  const active: boolean[] = [];
  let Y = 0;
  for (let i = 0; i < n; i++) {
    const r = contest.rivals[i]!;
    const e = efforts[i]!;
    if (r.r !== 1) return null;
    if (Number.isFinite(r.maxEffort) && e >= r.maxEffort * (1 - 1e-9)) return null;
    a.push(r.cost / (r.weight * r.value));
    active.push(e > 0);
    Y += r.weight * e;
  }
  const k = active.filter(Boolean).length;
  if (k < 2 || !(Y > 0)) return null;
  for (let i = 0; i < n; i++) {
    const aY = a[i]! * Y;
    if (active[i] ? aY > 1 - MARGIN : aY < 1 + MARGIN) return null;
  }
  return { a, active, k, Y };
}

/** d e_i / d a_j and d u_i / d a_j for every rival i, for one rival j. */
export function hillmanRileyDerivatives(contest: Contest, s: ActiveSetState, j: number) {
  const n = contest.rivals.length;
  const de = new Array<number>(n).fill(0);
  const du = new Array<number>(n).fill(0);
  if (!s.active[j]) return { de, du };
  const { a, Y, k } = s;
  const dY = (-Y * Y) / (k - 1);
  for (let i = 0; i < n; i++) {
    if (!s.active[i]) continue;
    const r = contest.rivals[i]!;
    const same = i === j ? 1 : 0;
    const ai = a[i]!;
    de[i] = ((1 - 2 * ai * Y) * dY - same * Y * Y) / r.weight;
    du[i] = -2 * r.value * (1 - ai * Y) * (ai * dY + same * Y);
  }
  return { de, du };
}
