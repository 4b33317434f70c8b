/**
 * All-pay auction where one rival commits first (derived here; the sequential all-pay game is
 * treated in Konrad 2009, Strategy and Dynamics in Contests). Unit weights, values v, costs m,
 * V = v/m. Once the leader's bid e_L is seen, a follower gains from outbidding it only while
 * v_F - m_F e_L > 0, i.e. e_L < V_F. So a leader bid of Vmax = max over followers of V_F keeps
 * every follower out (outbidding costs at least the prize, tying loses money), and the leader
 * earns v_L - m_L Vmax. Any smaller positive bid is outbid and wasted. The leader therefore
 * pre-empts when V_L > Vmax (and its budget reaches Vmax); otherwise it bids nothing and the
 * followers contest the prize among themselves, which this module does not solve.
 */
import type { Contest } from "./types";

export type AllPayLeaderOutcome = { ok: true; efforts: number[] } | { ok: false; reason: string };

export function allPayLeaderPreemption(contest: Contest): AllPayLeaderOutcome {
  const L = contest.leader;
  if (L === null || contest.csf.kind !== "allpay") {
    return { ok: false, reason: "not an all-pay auction with a leader" };
  }
  if (contest.rivals.some((x) => x.weight !== 1)) {
    return { ok: false, reason: "weights other than 1 are not supported in the all-pay auction" };
  }
  const leader = contest.rivals[L]!;
  let vMax = 0;
  contest.rivals.forEach((x, i) => {
    if (i !== L) vMax = Math.max(vMax, x.value / x.cost);
  });
  if (contest.rivals.some((x, i) => i !== L && x.maxEffort < x.value / x.cost)) {
    return {
      ok: false,
      reason: "a follower's budget is below its value-to-cost ratio (not solved here)",
    };
  }
  if (!(leader.value / leader.cost > vMax) || leader.maxEffort < vMax) {
    return {
      ok: false,
      reason:
        "the leader cannot profitably pre-empt, so it bids nothing and the followers contest the prize among themselves (not solved here)",
    };
  }
  const efforts = contest.rivals.map(() => 0);
  efforts[L] = vMax;
  return { ok: true, efforts };
}
