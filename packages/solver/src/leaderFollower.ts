/**
 * Leader and followers (Dixit 1987, "Strategic behavior in contests", American Economic
 * Review 77; volume from memory): the leader commits to an effort, the followers observe it
 * and play their simultaneous equilibrium given it; the leader anticipates that.
 *
 * Two rivals, r = 1, derived here with values and weights (L leader, F follower, y = w e):
 * the follower's reply is y_F = max(0, sqrt(c y_L) - y_L) with c = w_F v_F / m_F. While the
 * follower is active, p_L = y_L / sqrt(c y_L) = sqrt(y_L / c), so
 *     u_L = v_L sqrt(y_L / c) - (m_L / w_L) y_L,   maximised at y* = v_L^2 w_L^2 / (4 m_L^2 c).
 * The follower stays active only for y_L < c; beyond that u_L = v_L - (m_L/w_L) y_L falls, so
 * the leader's optimum is y_L = min(y*, c): y_L = c is pre-emption (the follower's best reply
 * is exactly zero). With common v and unit weights: e_L = v m_F / (4 m_L^2), interior iff
 * m_F < 2 m_L, matching Dixit.
 *
 * All-pay auction with a leader: pre-emption (see allPayLeader.ts); two rivals without
 * pre-emption, and two rivals with a follower of r > 1 or logit: leaderTwoRival.ts.
 *
 * General case (numerical): followers' subgame by the share-function method with the
 * leader's w_L e_L^r_L as a fixed contribution (valid when every follower has r_i <= 1), and
 * the leader's effort by global 1-D maximisation (grid + Brent).
 */
import { allPayLeaderPreemption } from "./allPayLeader";
import { allPayLeaderNoPreemption, leaderTwoRivalNumeric } from "./leaderTwoRival";
import { respond } from "./bestResponse";
import { dissipation, payoffs, shares } from "./csf";
import { gridMaximize } from "./gridMaximize";
import { noPureEquilibrium } from "./pureEquilibrium";
import { shareFunctionEquilibrium } from "./shareFunction";
import type { Contest, Equilibrium } from "./types";

/** Dixit closed form, or null unless ratio form, n = 2, both r = 1, leader set, no budgets. */
export function leaderFollowerTwoRival(contest: Contest): number[] | null {
  const L = contest.leader;
  if (L === null || contest.csf.kind !== "ratio" || contest.rivals.length !== 2) return null;
  const F = 1 - L;
  const l = contest.rivals[L]!;
  const f = contest.rivals[F]!;
  if (l.r !== 1 || f.r !== 1 || l.maxEffort < Infinity || f.maxEffort < Infinity) return null;
  const c = (f.weight * f.value) / f.cost;
  const yStar = (l.value * l.value * l.weight * l.weight) / (4 * l.cost * l.cost * c);
  const yL = Math.min(yStar, c);
  const yF = Math.max(0, Math.sqrt(c * yL) - yL);
  const efforts = [0, 0];
  efforts[L] = yL / l.weight;
  efforts[F] = yF / f.weight;
  return efforts;
}

/**
 * Followers' simultaneous equilibrium given the leader's effort (null: no equilibrium, or the
 * share-function iteration did not converge).
 */
export function followerEfforts(contest: Contest, leaderEffort: number): number[] | null {
  const L = contest.leader;
  if (L === null) return null;
  const l = contest.rivals[L]!;
  const fixed = leaderEffort > 0 ? l.weight * Math.pow(leaderEffort, l.r) : 0;
  const members = contest.rivals.map((_, i) => i !== L);
  const sol = shareFunctionEquilibrium(contest, { members, fixed });
  if (!sol.ok) return null;
  sol.efforts[L] = leaderEffort;
  return sol.efforts;
}

/** Leader's effort by global search against the followers' subgame equilibrium. */
export function leaderFollowerNumeric(contest: Contest, gridPoints = 401): number[] | null {
  const L = contest.leader;
  if (L === null || contest.csf.kind !== "ratio") return null;
  if (contest.rivals.some((x, i) => i !== L && x.r > 1)) return null;
  const l = contest.rivals[L]!;
  const payoffOf = (e: number) => {
    const prof = followerEfforts(contest, e);
    // no follower equilibrium only when the leader spends nothing against a lone follower,
    // who then takes the whole prize in the limit: the leader gets 0
    if (!prof) return 0;
    return payoffs(contest, prof)[L]!;
  };
  const best = gridMaximize(payoffOf, Math.min(l.maxEffort, l.value / l.cost), gridPoints);
  return followerEfforts(contest, best.x);
}

/** Subgame-perfect leader-follower outcome as an Equilibrium record. */
export function leaderFollowerEquilibrium(contest: Contest, gridPoints?: number): Equilibrium {
  const L = contest.leader;
  if (L === null) return noPureEquilibrium(contest, "leader-follower", "No leader is set.");
  if (contest.csf.kind === "allpay") {
    const pre = allPayLeaderPreemption(contest);
    const none = pre.ok ? null : allPayLeaderNoPreemption(contest);
    if (none) {
      return leaderRecord(
        contest,
        none,
        gridPoints,
        "all-pay auction: it cannot profitably pre-empt, so it commits nothing and the follower wins with the smallest positive bid",
      );
    }
    if (!pre.ok) {
      return noPureEquilibrium(
        contest,
        "unsupported",
        `All-pay auction with a leader: ${pre.reason}.`,
      );
    }
    return leaderRecord(contest, pre.efforts, gridPoints, "pre-emption, all-pay auction");
  }
  const closed = leaderFollowerTwoRival(contest);
  const efforts =
    closed ??
    leaderFollowerNumeric(contest, Math.min(gridPoints ?? 401, 2001)) ??
    leaderTwoRivalNumeric(contest, Math.min(gridPoints ?? 2001, 4001));
  if (!efforts) {
    return noPureEquilibrium(
      contest,
      "unsupported",
      contest.csf.kind === "ratio"
        ? "Leader-follower games with three or more rivals are solved when every follower has decisiveness r <= 1; a follower here has r > 1."
        : "Leader-follower games in the logit form are solved for two rivals only.",
    );
  }
  return leaderRecord(
    contest,
    efforts,
    gridPoints,
    closed ? "closed form, Dixit 1987" : "numerical search",
  );
}

/** Equilibrium record of a leader-follower outcome; the gap covers the followers only. */
function leaderRecord(
  contest: Contest,
  efforts: number[],
  gridPoints: number | undefined,
  how: string,
): Equilibrium {
  const L = contest.leader!;
  const resp = respond(contest, efforts, gridPoints === undefined ? {} : { gridPoints });
  let gap = 0;
  resp.regrets.forEach((g, i) => {
    if (i !== L) gap = Math.max(gap, g);
  });
  const leaderRegret = resp.regrets[L]!;
  return {
    kind: "pure",
    efforts,
    shares: shares(contest, efforts),
    payoffs: payoffs(contest, efforts),
    totalEffort: efforts.reduce((s, e) => s + e, 0),
    dissipation: dissipation(contest, efforts),
    active: efforts.map((e) => e > 0),
    nashGap: gap,
    method: "leader-follower",
    note:
      `${contest.rivals[L]!.name} commits first (${how}). ` +
      `The Nash gap covers the followers only: the leader's effort is a commitment, so its ` +
      `regret against the followers' final efforts (${leaderRegret.toPrecision(3)}) is not a flaw.`,
  };
}
