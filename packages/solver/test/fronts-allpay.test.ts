// All-pay fronts: the highest effort wins, ties split (Baye, Kovenock & de Vries 1996, "The
// all-pay auction with complete information", Economic Theory 8; title and volume from memory).
// Checks: (1) best allocations against pure bids agree with an independent search written here
// (a dense grid over the money put on the all-pay front, the rest placed by the Tullock 1980
// closed-form best response on a ratio front); (2) without binding budgets no pure profile is
// an equilibrium (BKV 1996: the all-pay auction has none), so the solver reports `none-pure`
// with a note naming the front; (3) pure equilibria that budgets create, derived in the
// comments, are found.
import { describe, expect, test } from "vitest";
import {
  ALL_PAY_FRONTS_MAX,
  normalizeFronts,
  respondFronts,
  solveFronts,
  validateFrontsScenario,
} from "../src/fronts";
import type { FrontsContest, FrontsScenario } from "../src/fronts/types";
import { mulberry32 } from "../src/rng";

const parse = (s: unknown): FrontsContest => {
  const v = validateFrontsScenario(s);
  if (!v.ok) throw new Error(`${v.path}: ${v.message}`);
  return normalizeFronts(v.value);
};

const allPay = (name: string, prize: number) => ({ name, prize, csf: { kind: "allpay" } });
const ratio1 = (name: string, prize: number) => ({
  name,
  prize,
  csf: { kind: "ratio", decisiveness: 1 },
});

describe("validation", () => {
  test("an all-pay front is accepted; one too many all-pay fronts is refused naming the field", () => {
    const ok = validateFrontsScenario({
      title: "t",
      fronts: [allPay("Tender", 100), ratio1("Retail", 50)],
      rivals: [
        { name: "A", cost: 1, budget: 40 },
        { name: "B", cost: 1 },
      ],
    });
    expect(ok.ok).toBe(true);
    const many = validateFrontsScenario({
      title: "t",
      fronts: Array.from({ length: ALL_PAY_FRONTS_MAX + 1 }, (_, k) => allPay(`T${k}`, 10)),
      rivals: [
        { name: "A", cost: 1 },
        { name: "B", cost: 1 },
      ],
    });
    expect(many.ok).toBe(false);
    if (!many.ok) {
      expect(many.path).toBe(`fronts.${ALL_PAY_FRONTS_MAX}.csf.kind`);
      expect(many.message).toMatch(/at most 8 fronts may be "allpay"/);
    }
  });
});

/**
 * Independent best payoff of rival i in a two-front scenario (front 0 ratio r = 1, front 1
 * all-pay) against the others' efforts: a grid over the money s on the all-pay front; the rest
 * R = B - s goes to the ratio front by the Tullock best response w x + z = sqrt(V w z / c)
 * (first-order condition of V w x / (w x + z) - c x, concave), clipped to [0, R / c] — or all
 * of it when the budget is sunk (p rises in x). Written from the definitions, no solver code.
 */
function gridBest(fcx: FrontsContest, i: number, alloc: number[][], points = 200_000): number {
  const rv = fcx.rivals[i]!;
  const others = alloc.filter((_, j) => j !== i);
  const z = others.reduce((s, row, jj) => {
    const j = jj >= i ? jj + 1 : jj;
    return s + fcx.rivals[j]!.weight[0]! * row[0]!;
  }, 0);
  const top = Math.max(...others.map((row) => row[1]!));
  const ties = others.filter((row) => row[1] === top).length;
  const [c0, c1] = rv.cost as [number, number];
  const [V0, V1] = rv.value as [number, number];
  const w = rv.weight[0]!;
  const cap = Number.isFinite(rv.budget) ? rv.budget : V0 + V1;
  const ratioPart = (R: number) => {
    let x = rv.sunkBudget ? R / c0 : Math.max(0, (Math.sqrt((V0 * w * z) / c0) - z) / w);
    x = Math.min(x, R / c0);
    const p = w * x + z === 0 ? 0.5 : (w * x) / (w * x + z);
    return V0 * p - (rv.sunkBudget ? 0 : c0 * x);
  };
  let best = -Infinity;
  for (let g = 0; g <= points; g++) {
    const s = (cap * g) / points;
    const x = s / c1;
    const p = x > top ? 1 : x === top ? 1 / (ties + 1) : 0;
    const u = V1 * p - (rv.sunkBudget ? 0 : s) + ratioPart(cap - s);
    if (u > best) best = u;
  }
  return best;
}

describe("best allocation with an all-pay front against pure bids", () => {
  test("respondFronts matches a dense grid over the all-pay money (random two-front cases)", () => {
    const rand = mulberry32(21);
    for (let t = 0; t < 40; t++) {
      const sunk = t % 3 === 0;
      const s = {
        title: "grid",
        fronts: [ratio1("Retail", 20 + 180 * rand()), allPay("Tender", 20 + 180 * rand())],
        rivals: [
          {
            name: "A",
            cost: [0.5 + 1.5 * rand(), 0.5 + 1.5 * rand()],
            weight: 0.5 + rand(),
            budget: 10 + 90 * rand(),
            sunkBudget: sunk,
          },
          { name: "B", cost: 1, budget: t % 2 === 0 ? 10 + 90 * rand() : null },
        ],
      };
      const fcx = parse(s);
      // B's pure efforts; A's own row is anything within its budget
      const alloc = [
        [rand() * 5, rand() * 5],
        [rand() * 60, t % 5 === 0 ? 0 : rand() * 60],
      ];
      const res = respondFronts(fcx, alloc);
      const ref = gridBest(fcx, 0, alloc);
      const best = res.payoffs[0]! + res.regrets[0]!;
      // the grid misses the winning supremum by at most one grid step of money
      const slack = 1e-3 * (fcx.fronts[0]!.prize + fcx.fronts[1]!.prize);
      expect(best).toBeGreaterThanOrEqual(ref - slack);
      expect(best).toBeLessThanOrEqual(ref + slack);
      const row = res.bestAllocations[0]!;
      const spent = row[0]! * fcx.rivals[0]!.cost[0]! + row[1]! * fcx.rivals[0]!.cost[1]!;
      expect(spent).toBeLessThanOrEqual(fcx.rivals[0]!.budget);
    }
  });
});

describe("no pure equilibrium without binding budgets (Baye, Kovenock & de Vries 1996)", () => {
  test("every random pure profile of a two-rival all-pay front has a positive regret", () => {
    const fcx = parse({
      title: "t",
      fronts: [allPay("Tender", 100)],
      rivals: [
        { name: "A", cost: 1 },
        { name: "B", cost: 1.5 },
      ],
    });
    const rand = mulberry32(7);
    for (let t = 0; t < 200; t++) {
      const a = t % 4 === 0 ? 0 : 60 * rand();
      const b = t % 7 === 0 ? a : 60 * rand();
      expect(respondFronts(fcx, [[a], [b]]).nashGap).toBeGreaterThan(0);
    }
  });

  test("solveFronts says none-pure and names the all-pay front and the reason", () => {
    const eq = solveFronts(
      parse({
        title: "t",
        fronts: [ratio1("Retail", 80), allPay("City tender", 120)],
        rivals: [
          { name: "A", cost: 1 },
          { name: "B", cost: 1 },
          { name: "C", cost: [1, 2] },
        ],
      }),
    ).equilibrium;
    expect(eq.kind).toBe("none-pure");
    expect(eq.allocations).toBeNull();
    expect(eq.note).toMatch(/front "City tender" is an all-pay auction/);
    expect(eq.note).toMatch(/Baye, Kovenock & de Vries 1996/);
    // no budgets: the fronts are independent and the note points to the single-contest solve
    expect(eq.note).toMatch(/independent contests/);
  });
});

describe("pure equilibria that budgets create (derived here)", () => {
  test("sunk budgets 30 < 70 on one all-pay front: the larger budget wins outright", () => {
    // With sunk budgets the payoff is V p only. If B bids more than A's whole budget (30), A
    // cannot win or tie whatever it does (payoff 0 either way) and B wins the prize, the most
    // it can get: an equilibrium. If B bid 30 or less, A could tie or outbid, so B bids > 30.
    const s: FrontsScenario = {
      title: "t",
      fronts: [{ name: "Tender", prize: 600, csf: { kind: "allpay" } }],
      rivals: [
        { name: "A", cost: 1, budget: 30, sunkBudget: true },
        { name: "B", cost: 1, budget: 70, sunkBudget: true },
      ],
    };
    const eq = solveFronts(parse(s)).equilibrium;
    expect(eq.kind).toBe("pure");
    expect(eq.allocations![1]![0]!).toBeGreaterThan(30);
    expect(eq.payoffs).toEqual([0, 600]);
    expect(eq.nashGap).toBe(0);
  });

  test("equal capped budgets below half the prize: both bid the whole budget and tie", () => {
    // Budgets 10, prize 100, unit costs, money not sunk. At (10, 10) each gets 100/2 - 10 = 40;
    // bidding less loses the prize (payoff at most 0 < 40) and bidding more is not allowed, so
    // (10, 10) is an equilibrium. Any other profile is not: below the cap the top bidder or a
    // rival can gain by a step, as without budgets.
    const eq = solveFronts(
      parse({
        title: "t",
        fronts: [allPay("Tender", 100)],
        rivals: [
          { name: "A", cost: 1, budget: 10 },
          { name: "B", cost: 1, budget: 10 },
        ],
      }),
    ).equilibrium;
    expect(eq.kind).toBe("pure");
    expect(eq.allocations).toEqual([[10], [10]]);
    expect(eq.payoffs).toEqual([40, 40]);
    expect(eq.nashGap).toBe(0);
  });
});
