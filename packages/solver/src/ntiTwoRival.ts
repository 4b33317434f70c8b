/**
 * Two rivals, ratio form with common decisiveness r <= 1 and different values: Nti 1999
 * (Public Choice 98; volume from memory). With unit costs and weights,
 *     e_1 = r v_1^(1+r) v_2^r / (v_1^r + v_2^r)^2   (and symmetrically for rival 2).
 * Costs and weights by rescaling (derived here): dividing u_i by m_i leaves the game with unit
 * cost and value v_i / m_i; writing w_i e_i^r = (w_i^(1/r) e_i)^r turns weights into a change
 * of effort units, effective effort E_i = w_i^(1/r) e_i at unit price m_i w_i^(-1/r). So with
 * V_i = v_i w_i^(1/r) / m_i, the game in E is Nti's with values V_i, and
 *     e_i = w_i^(-1/r) r V_i^(1+r) V_j^r / (V_i^r + V_j^r)^2.
 * With r = 1 and common v, w this is v m_2 / (m_1 + m_2)^2 (Hillman & Riley 1989).
 */
import type { Contest } from "./types";

/** Nti's unit-cost formula for rival 1 against rival 2. */
export function ntiEffort(v1: number, v2: number, r: number): number {
  const d = Math.pow(v1, r) + Math.pow(v2, r);
  return (r * Math.pow(v1, 1 + r) * Math.pow(v2, r)) / (d * d);
}

/** Efforts of both rivals, or null unless ratio form, n = 2, common r <= 1, budgets not binding. */
export function ntiTwoRival(contest: Contest): number[] | null {
  const [a, b] = contest.rivals;
  if (contest.csf.kind !== "ratio" || contest.rivals.length !== 2 || !a || !b) return null;
  const r = a.r;
  if (b.r !== r || r > 1) return null;
  const va = (a.value * Math.pow(a.weight, 1 / r)) / a.cost;
  const vb = (b.value * Math.pow(b.weight, 1 / r)) / b.cost;
  const ea = ntiEffort(va, vb, r) / Math.pow(a.weight, 1 / r);
  const eb = ntiEffort(vb, va, r) / Math.pow(b.weight, 1 / r);
  if (ea > a.maxEffort || eb > b.maxEffort) return null;
  return [ea, eb];
}
