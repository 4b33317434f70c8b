/**
 * Two rivals, one commits first (Dixit 1987, American Economic Review 77; volume from memory),
 * for the cases without a closed form:
 * - ratio form with any decisiveness, or logit (Hirshleifer 1989): the follower's reply to
 *   each commitment is its exact global best response (bestResponse.ts), and the leader's
 *   commitment maximises its payoff against that reply over [0, min(budget, value / cost)] by
 *   a dense grid with Brent refinement (gridMaximize). The follower's reply can jump (to zero
 *   when r > 1), which the grid sees; the result is a numerical search, said so in its note.
 * - all-pay auction, leader unable to pre-empt (derived here, continuing allPayLeader.ts): any
 *   commitment below the follower's V_F = v_F / m_F is outbid and wasted, and one at or above
 *   V_F costs the leader at least its whole value (V_L <= V_F) or exceeds its budget, so the
 *   leader commits nothing and the follower wins with the smallest positive bid.
 */
import { bestResponse } from "./bestResponse";
import { payoffs } from "./csf";
import { gridMaximize } from "./gridMaximize";
import type { Contest } from "./types";

/** Smallest positive bid as a fraction of value / cost: its cost is the follower's only regret. */
const STEP = 1e-9;

/** The follower's exact reply to the leader's effort e (two rivals). */
function profileAt(contest: Contest, L: number, e: number): number[] {
  const F = 1 - L;
  const prof = [0, 0];
  prof[L] = e;
  prof[F] = bestResponse(contest, F, prof).effort;
  return prof;
}

/** Efforts of the subgame-perfect outcome, or null when not two rivals of ratio/logit form. */
export function leaderTwoRivalNumeric(contest: Contest, gridPoints = 2001): number[] | null {
  const L = contest.leader;
  if (L === null || contest.rivals.length !== 2 || contest.csf.kind === "allpay") return null;
  const l = contest.rivals[L]!;
  const hi = Math.min(l.maxEffort, l.value / l.cost);
  const best = gridMaximize((e) => payoffs(contest, profileAt(contest, L, e))[L]!, hi, gridPoints);
  return profileAt(contest, L, best.x);
}

/** All-pay auction, two rivals, the leader cannot pre-empt: [leader 0, follower one step]. */
export function allPayLeaderNoPreemption(contest: Contest): number[] | null {
  const L = contest.leader;
  if (L === null || contest.rivals.length !== 2 || contest.csf.kind !== "allpay") return null;
  if (contest.rivals.some((x) => x.weight !== 1)) return null;
  const F = 1 - L;
  const l = contest.rivals[L]!;
  const f = contest.rivals[F]!;
  const vF = f.value / f.cost;
  const canPreempt = l.value / l.cost > vF && l.maxEffort >= vF;
  const step = Math.min(STEP * vF, f.maxEffort);
  if (canPreempt || !(step > 0)) return null;
  const efforts = [0, 0];
  efforts[F] = step;
  return efforts;
}
