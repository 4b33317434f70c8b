// Leader-follower contests (Dixit 1987, American Economic Review 77; volume from memory):
// the closed form checked against the numerical method and against a brute-force search in
// which the follower replies by Nelder-Mead (fmin).
import { describe, expect, test } from "vitest";
import {
  followerEfforts,
  hillmanRileyEquilibrium,
  leaderFollowerNumeric,
  leaderFollowerTwoRival,
  normalize,
  payoffs,
  solve,
} from "../src/index";
import type { Contest, RivalSpec } from "../src/types";
import { refBestResponse, refEquilibrium, refPayoff } from "./reference";

const game = (rivals: RivalSpec[], leader: string, r = 1) =>
  normalize({ title: "test", prize: 100, csf: { kind: "ratio", decisiveness: r }, rivals, leader });

/** Leader's best commitment on a grid, the follower replying by Nelder-Mead. */
function bruteForceLeader(c: Contest, points = 400): number {
  const L = c.leader!;
  const top = c.rivals[L]!.value / c.rivals[L]!.cost;
  let best = 0;
  let bestU = -Infinity;
  for (let k = 1; k <= points; k++) {
    const eL = (top * k) / points;
    const prof = [0, 0];
    prof[L] = eL;
    prof[1 - L] = refBestResponse(c, 1 - L, prof).effort;
    const u = refPayoff(c, L, eL, prof);
    if (u > bestU) {
      bestU = u;
      best = eL;
    }
  }
  return best;
}

describe("two rivals, r = 1", () => {
  test("leaderFollowerTwoRival(v=100, m1=1, m2=1.5) gives e1 = v m2/(4 m1^2) = 37.5 and e2 = 12.5", () => {
    const c = game(
      [
        { name: "lead", cost: 1 },
        { name: "follow", cost: 1.5 },
      ],
      "lead",
    );
    const e = leaderFollowerTwoRival(c)!;
    expect(e[0]).toBeCloseTo(37.5, 12);
    expect(e[1]).toBeCloseTo(Math.sqrt((100 * 37.5) / 1.5) - 37.5, 12);
    expect(Math.abs(leaderFollowerNumeric(c)![0]! - 37.5)).toBeLessThan(1e-5);
    expect(Math.abs(bruteForceLeader(c) - 37.5)).toBeLessThan(100 / 400);
  });

  test("leaderFollowerTwoRival(m2 >= 2 m1) pre-empts: the leader spends v/m2 and the follower nothing", () => {
    const c = game(
      [
        { name: "lead", cost: 1 },
        { name: "follow", cost: 3 },
      ],
      "lead",
    );
    const e = leaderFollowerTwoRival(c)!;
    expect(e[0]).toBeCloseTo(100 / 3, 12);
    expect(e[1]).toBe(0);
    expect(refBestResponse(c, 1, e).effort).toBeLessThan(1e-6);
    expect(Math.abs(leaderFollowerNumeric(c)![0]! - 100 / 3)).toBeLessThan(1e-5);
  });

  test("leaderFollowerTwoRival with values and weights (derived y_L = min(y*, c)) matches numeric and brute force", () => {
    const c = game(
      [
        { name: "follow", cost: 1.2, value: 80 },
        { name: "lead", cost: 1, value: 120, weight: 1.5 },
      ],
      "lead",
    );
    const e = leaderFollowerTwoRival(c)!;
    const num = leaderFollowerNumeric(c)!;
    expect(Math.abs(e[1]! - num[1]!) / e[1]!).toBeLessThan(1e-6);
    expect(Math.abs(bruteForceLeader(c) - e[1]!)).toBeLessThan(120 / 400);
  });

  test("a favourite who commits spends more than in the simultaneous game (Dixit 1987)", () => {
    const rivals = [
      { name: "fav", cost: 1 },
      { name: "under", cost: 1.5 },
    ];
    const lf = solve(game(rivals, "fav")).equilibrium;
    const sim = hillmanRileyEquilibrium(
      normalize({ title: "t", prize: 100, csf: { kind: "ratio", decisiveness: 1 }, rivals }),
    )!;
    expect(lf.method).toBe("leader-follower");
    expect(lf.efforts![0]).toBeGreaterThan(sim[0]!);
    expect(lf.nashGap).toBeLessThan(1e-9);
  });
});

describe("more followers (numerical)", () => {
  test("solve(leader + two followers, r = 0.8): followers best-respond and the leader beats the simultaneous payoff", () => {
    const rivals = [
      { name: "lead", cost: 1 },
      { name: "f1", cost: 1.5 },
      { name: "f2", cost: 2, value: 120 },
    ];
    const c = game(rivals, "lead", 0.8);
    const eq = solve(c).equilibrium;
    expect(eq.nashGap).toBeLessThan(1e-6);
    // followers' subgame checked by an independent Nelder-Mead iteration with the leader frozen
    const ref = refEquilibrium(
      c,
      eq.efforts!.map((x, i) => (i === 0 ? x : 1)),
      100,
      0,
    );
    expect(Math.abs(ref[1]! - eq.efforts![1]!)).toBeLessThan(1e-4);
    expect(Math.abs(ref[2]! - eq.efforts![2]!)).toBeLessThan(1e-4);
    const simultaneous = solve(
      normalize({ title: "t", prize: 100, csf: { kind: "ratio", decisiveness: 0.8 }, rivals }),
    ).equilibrium;
    expect(eq.payoffs![0]!).toBeGreaterThan(simultaneous.payoffs![0]!);
    // no other commitment on a coarse grid does better
    for (let k = 0; k <= 50; k++) {
      const prof = followerEfforts(c, (100 * k) / 50);
      if (prof) expect(payoffs(c, prof)[0]!).toBeLessThanOrEqual(eq.payoffs![0]! + 1e-9);
    }
  });
});

describe("all-pay auction with a leader (pre-emption, derived)", () => {
  const auction = (rivals: RivalSpec[], leader: string) =>
    normalize({ title: "test", prize: 100, csf: { kind: "allpay" }, rivals, leader });

  /** Leader's best bid on a grid when the follower replies with its best grid bid (ties: lower bid). */
  function gridSubgamePerfect(vL: number, mL: number, vF: number, mF: number, step: number) {
    const bids: number[] = [];
    for (let b = 0; b <= Math.max(vL / mL, vF / mF) + step; b += step) bids.push(b);
    const reply = (eL: number) => {
      let best = 0;
      let bestU = eL === 0 ? vF / 2 : 0;
      for (const b of bids) {
        const u = (b > eL ? vF : b === eL ? vF / 2 : 0) - mF * b;
        if (u > bestU + 1e-12) {
          bestU = u;
          best = b;
        }
      }
      return best;
    };
    let bestE = 0;
    let bestU = -Infinity;
    for (const eL of bids) {
      const b = reply(eL);
      const u = (eL > b ? vL : eL === b ? vL / 2 : 0) - mL * eL;
      if (u > bestU) {
        bestU = u;
        bestE = eL;
      }
    }
    return { bid: bestE, payoff: bestU };
  }

  test("solve(all-pay, strong leader) pre-empts at the follower's V = v/m and matches a grid search", () => {
    const c = auction(
      [
        { name: "lead", cost: 1 },
        { name: "follow", cost: 1.25, value: 75 },
      ],
      "lead",
    );
    const eq = solve(c).equilibrium;
    expect(eq.kind).toBe("pure");
    expect(eq.efforts).toEqual([60, 0]);
    expect(eq.payoffs![0]).toBeCloseTo(40, 12);
    expect(eq.nashGap).toBe(0);
    const grid = gridSubgamePerfect(100, 1, 75, 1.25, 0.05);
    expect(Math.abs(grid.bid - 60)).toBeLessThanOrEqual(0.1);
    expect(Math.abs(grid.payoff - 40)).toBeLessThanOrEqual(0.1);
  });

  test("solve(all-pay, weak leader) commits nothing and the follower wins with the smallest bid, as a grid search finds", () => {
    const c = auction(
      [
        { name: "lead", cost: 2 },
        { name: "follow", cost: 1 },
      ],
      "lead",
    );
    const eq = solve(c).equilibrium;
    expect(eq.kind).toBe("pure");
    expect(eq.efforts![0]).toBe(0);
    expect(eq.efforts![1]).toBeGreaterThan(0);
    expect(eq.efforts![1]).toBeLessThan(1e-3);
    expect(eq.payoffs![0]).toBe(0);
    expect(eq.payoffs![1]).toBeCloseTo(100, 3);
    // the follower's only regret: the cost of its smallest step above the supremum
    expect(eq.nashGap).toBeLessThan(1e-6);
    expect(eq.note).toMatch(/cannot profitably pre-empt/);
    // the grid's follower answers a zero commitment with its smallest bid and wins
    const grid = gridSubgamePerfect(100, 2, 100, 1, 0.05);
    expect(grid.bid).toBe(0);
    expect(grid.payoff).toBe(0);
  });
});

describe("two rivals, followers with r > 1 or logit (numerical search)", () => {
  test.each([
    ["ratio r = 2", { kind: "ratio", decisiveness: 2 } as const],
    ["ratio r = 1.5", { kind: "ratio", decisiveness: 1.5 } as const],
    ["logit k = 0.05", { kind: "logit", scale: 0.05 } as const],
  ])(
    "solve(%s, leader and follower) finds the leader's best commitment as a brute-force search with Nelder-Mead replies does",
    (_, csf) => {
      const c = normalize({
        title: "test",
        prize: 100,
        csf,
        rivals: [
          { name: "lead", cost: 1 },
          { name: "follow", cost: 1.5 },
        ],
        leader: "lead",
      });
      const eq = solve(c).equilibrium;
      expect(eq.kind).toBe("pure");
      expect(eq.method).toBe("leader-follower");
      expect(eq.nashGap).toBeLessThan(1e-6 * 100);
      const bf = bruteForceLeader(c);
      const prof = [bf, refBestResponse(c, 1, [bf, 0]).effort];
      const bfPayoff = refPayoff(c, 0, bf, prof);
      // the solver's commitment is at least as good as the grid's, up to the grid's step
      expect(eq.payoffs![0]!).toBeGreaterThan(bfPayoff - 0.05);
      expect(Math.abs(eq.payoffs![0]! - bfPayoff)).toBeLessThan(1);
    },
  );
});
