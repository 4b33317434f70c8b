import { describe, expect, it } from "vitest";
import { roundWithMoney } from "@contend/session";
import { normalize, sweep1d } from "@contend/solver";
import type { RoundResult } from "@contend/protocol";
import {
  effortKey,
  payoffKey,
  perSeatOverRounds,
  roundMarks,
  roundSeatRows,
  seatHistoryRows,
  sweepRows,
  turningPoints,
  wholeNumberTicks,
} from "../src/lib/chartData";
import { bestResponseCurves } from "../src/lib/brCurves";

describe("sweepRows", () => {
  it("sweepRows(sweep) gives one row per point with one key per rival series", () => {
    const sweep = {
      param: "rivals.1.cost",
      names: ["A", "B"],
      values: [1, 2],
      efforts: [
        [10, 20],
        [null, 5],
      ],
      spends: [
        [10, 20],
        [null, 5],
      ],
      payoffs: [
        [1, 2],
        [3, null],
      ],
      totalEffort: [10, 25],
      totalSpend: [10, 25],
      dissipation: [0.1, null],
      kinds: ["pure", "pure"] as const,
    };
    const rows = sweepRows({ ...sweep, kinds: [...sweep.kinds] });
    expect(rows).toEqual([
      {
        x: 1,
        kind: "pure",
        effort0: 10,
        payoff0: 1,
        effort1: null,
        payoff1: 3,
        total: 10,
        dissipation: 0.1,
      },
      {
        x: 2,
        kind: "pure",
        effort0: 20,
        payoff0: 2,
        effort1: 5,
        payoff1: null,
        total: 25,
        dissipation: null,
      },
    ]);
  });

  it("sweepRows(sweep of rival 2's cost) shows rival 1's effort rising then falling at cost 5 (Hillman & Riley 1989, two rivals, r = 1)", () => {
    // e1 = v m2 / (m1 + m2)^2 with v = 100, m1 = 5: d e1/d m2 = v (m1 - m2)/(m1 + m2)^3 changes sign at m2 = m1.
    const scenario = {
      title: "t",
      prize: 100,
      csf: { kind: "ratio" as const, decisiveness: 1 },
      rivals: [
        { name: "A", cost: 5 },
        { name: "B", cost: 2 },
      ],
    };
    const s = sweep1d(scenario, { param: "rivals.1.cost", from: 1, to: 10, steps: 91 });
    expect(s.ok).toBe(true);
    if (!s.ok) return;
    const rows = sweepRows(s.value);
    const e0 = rows.map((r) => r[effortKey(0)] as number);
    const turns = turningPoints(e0);
    expect(turns).toHaveLength(1);
    expect(rows[turns[0] as number]?.x).toBeCloseTo(5, 9);
    const at5 = rows.find((r) => Math.abs((r.x as number) - 5) < 1e-9);
    expect(at5?.[effortKey(0)]).toBeCloseTo((100 * 5) / 100, 6); // v m2/(m1+m2)^2 = 500/100
    expect(typeof rows[0]?.[payoffKey(1)]).toBe("number");
  });
});

describe("turningPoints", () => {
  it("turningPoints(values) finds slope sign changes and skips nulls and flat steps", () => {
    expect(turningPoints([1, 2, 3, 2, 1])).toEqual([2]);
    expect(turningPoints([1, 2, 2, 1])).toEqual([1]);
    expect(turningPoints([3, 2, null, 1, 2])).toEqual([3]);
    expect(turningPoints([1, 2, 3])).toEqual([]);
  });
});

// Built with the engine's own money derivation (spend = cost x effort); C's cost is 1.5.
const round: RoundResult = roundWithMoney(
  {
    round: 2,
    reason: "all-sealed",
    efforts: [10, 0, 30],
    defaulted: [false, false, true],
    shares: [0.25, 0, 0.75],
    winner: null,
    drawSeed: null,
    payoffs: [15, 0, 45],
    expectedPayoffs: [15, 0, 45],
    totals: [20, 0, 50],
    bestResponses: [12, 0, 20],
    regrets: [1, 0, 4],
    equilibrium: {
      kind: "pure",
      efforts: [11, 22],
      shares: [0.33, 0.67],
      payoffs: [5, 6],
      totalEffort: 33,
      dissipation: 0.33,
      active: [true, true],
      nashGap: 0,
      method: "closed-form",
    },
    nashGap: 4,
    dissipation: 0.4,
  },
  {
    title: "t",
    prize: 100,
    csf: { kind: "ratio", decisiveness: 1 },
    rivals: [
      { name: "A", cost: 1 },
      { name: "C", cost: 1.5 },
    ],
  },
  [0, 2],
);

describe("session rows", () => {
  it("round.equilibriumSpends follows seatIndices, not seat numbers (cost x equilibrium effort)", () => {
    expect(round.equilibriumSpends).toEqual([11, null, 1.5 * 22]);
  });
  it("seatHistoryRows(rounds, seat) lists only rounds the seat played, in money", () => {
    // cost 1.5: effort 30 -> spend 45, equilibrium effort 22 -> 33, best reply 20 -> 30
    expect(seatHistoryRows([round], 2)).toEqual([
      { round: 2, spend: 45, equilibrium: 33, bestResponse: 30, regret: 4, payoff: 45, total: 50 },
    ]);
    expect(seatHistoryRows([round], 1)).toEqual([]);
  });
  it("roundSeatRows(round, names) gives one row per playing seat with its defaulted flag", () => {
    const rows = roundSeatRows(round, ["A", "B", "C"]);
    expect(rows.map((r) => r.name)).toEqual(["A", "C"]);
    expect(rows[1]).toMatchObject({ spend: 45, equilibrium: 33, share: 0.75, defaulted: "yes" });
  });
  it("perSeatOverRounds(rounds, seats, pick) leaves null for seats not in a round", () => {
    expect(perSeatOverRounds([round], [0, 1, 2], (r, s) => r.regrets[s] ?? null)).toEqual([
      { round: 2, s0: 1, s1: null, s2: 4 },
    ]);
  });
});

describe("bestResponseCurves", () => {
  it("bestResponseCurves(contest) matches the closed-form reply sqrt(v Z / m) - Z (ratio form, r = 1)", () => {
    const contest = normalize({
      title: "t",
      prize: 100,
      csf: { kind: "ratio", decisiveness: 1 },
      rivals: [
        { name: "A", cost: 5 },
        { name: "B", cost: 2 },
      ],
    });
    const [a, b] = bestResponseCurves(contest, 20, 11);
    const p = a[5]!; // rival 1 spends 10
    expect(p.e1).toBeCloseTo(10, 12);
    expect(p.e0).toBeCloseTo(Math.max(0, Math.sqrt((100 * 10) / 5) - 10), 5);
    const q = b[2]!; // rival 0 spends 4
    expect(q.e1).toBeCloseTo(Math.max(0, Math.sqrt((100 * 4) / 2) - 4), 5);
  });
});

describe("wholeNumberTicks", () => {
  const rounds = (n: number) => Array.from({ length: n }, (_, k) => ({ round: k + 1 }));
  it("gives each round once, with no repeated or in-between tick", () => {
    expect(wholeNumberTicks(rounds(3), "round")).toEqual([1, 2, 3]);
    expect(wholeNumberTicks(rounds(1), "round")).toEqual([1]);
    expect(wholeNumberTicks(rounds(10), "round")).toEqual([1, 2, 3, 4, 5, 6, 7, 8, 9, 10]);
  });
  it("thins a long axis to every 2nd, 5th or 10th whole number", () => {
    expect(wholeNumberTicks(rounds(11), "round")).toEqual([1, 3, 5, 7, 9, 11]);
    expect(wholeNumberTicks(rounds(40), "round")).toEqual([1, 6, 11, 16, 21, 26, 31, 36]);
    expect(wholeNumberTicks(rounds(3), "round", 2)).toEqual([1, 3]);
  });
  it("leaves an axis with a fractional value to the chart", () => {
    expect(wholeNumberTicks([{ x: 1 }, { x: 1.5 }], "x")).toBeNull();
    expect(wholeNumberTicks([], "x")).toBeNull();
  });
});

describe("roundMarks", () => {
  it("marks every changed round and every noted round once, in round order", () => {
    const marks = roundMarks(new Set([3, 2]), [
      { round: 1 },
      { round: 2, note: "price war starts" },
      { round: 4, note: "  " },
      { round: 5, note: "regulator steps in" },
    ]);
    expect(marks).toEqual([
      { x: 2, label: "changed, note" },
      { x: 3, label: "changed" },
      { x: 5, label: "note" },
    ]);
    expect(roundMarks([], [{ round: 1 }])).toEqual([]);
  });
});
