/**
 * Ratio form with r = 1 and any costs, values and weights: the active-set solution of
 * Hillman & Riley 1989 (Economics & Politics 1) as stated by Stein 2002 (Public Choice 113);
 * volume numbers from memory. With a_i = m_i / (w_i v_i) sorted ascending, the active set is
 * the largest k with a_k < (a_1 + ... + a_k) / (k - 1); then Y = (k - 1) / (a_1 + ... + a_k)
 * and each active rival's effective effort is w_i e_i = Y (1 - a_i Y); the rest spend nothing.
 * Two rivals with common v and w: e_1 = v m_2 / (m_1 + m_2)^2.
 */
import type { Contest } from "./types";

export interface HillmanRileySolution {
  efforts: number[];
  /** Y = sum w_i e_i */
  aggregate: number;
  active: boolean[];
}

/** The unconstrained r = 1 solution (budgets ignored), or null if not ratio form with all r = 1. */
export function hillmanRileySolution(contest: Contest): HillmanRileySolution | null {
  const rivals = contest.rivals;
  const n = rivals.length;
  if (contest.csf.kind !== "ratio" || n < 2 || rivals.some((x) => x.r !== 1)) return null;
  const a = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const x = rivals[i]!;
    a[i] = x.cost / (x.weight * x.value);
  }
  // the active set is a prefix of the sorted a's; a rival outside it has a_i >= 1/Y, which
  // makes Y (1 - a_i Y) <= 0, so no permutation is needed
  const sorted = Float64Array.from(a).sort();
  let sum = sorted[0]! + sorted[1]!;
  let k = 2; // the two lowest always take part
  for (let j = 2; j < n; j++) {
    const aj = sorted[j]!;
    if (aj < (sum + aj) / j) {
      sum += aj;
      k = j + 1;
    } else break;
  }
  const Y = (k - 1) / sum;
  const efforts = new Array<number>(n);
  const active = new Array<boolean>(n);
  for (let i = 0; i < n; i++) {
    const y = Y * (1 - a[i]! * Y);
    efforts[i] = y > 0 ? y / rivals[i]!.weight : 0;
    active[i] = y > 0;
  }
  return { efforts, aggregate: Y, active };
}

/** Efforts of the r = 1 equilibrium, or null when it does not apply or a budget binds. */
export function hillmanRileyEquilibrium(contest: Contest): number[] | null {
  const sol = hillmanRileySolution(contest);
  if (!sol) return null;
  if (sol.efforts.some((e, i) => e > contest.rivals[i]!.maxEffort)) return null;
  return sol.efforts;
}
