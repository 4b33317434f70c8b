// Where a played spend falls in the round's mixed equilibrium (src/placement.ts), checked
// against the distribution itself: the symmetric all-pay auction's published CDF and, for a
// finite mix, the points summed directly and the computer seats' own draws from them.
import { describe, expect, it } from "vitest";
import { drawPoint, mulberry32 } from "@contend/solver";
import { placementText, spendPlacement, summarizeSession, viewFor } from "../src/index";
import { Room, facilitator, scenarioWith, seat } from "./harness";

const spend = (room: Room, s: number, amount: number) =>
  room.ok({ type: "sealMove", clientMoveId: `m-${s}-${amount}`, spend: amount }, seat(s));

function playedRoom(patch: Record<string, unknown>, spends: number[]) {
  const room = new Room(scenarioWith({}, patch));
  room.ok({ type: "openRound" }, facilitator);
  spends.forEach((x, s) => spend(room, s, x));
  room.ok({ type: "closeRound" }, facilitator);
  return room;
}

const playedRound = (patch: Record<string, unknown>, spends: number[]) =>
  viewFor(playedRoom(patch, spends).state, { role: "spectator" }).rounds[0]!;

describe("a played spend placed in the mixed equilibrium", () => {
  it("three identical all-pay rivals: P(less) = (spend / prize)^(1/2) (Baye, Kovenock & de Vries 1996)", () => {
    // symmetric all-pay auction, n rivals, value V, cost 1: F(x) = (x / V)^(1/(n-1)) on [0, V]
    const round = playedRound(
      {
        csf: { kind: "allpay" },
        rivals: [1, 2, 3].map((k) => ({ name: `Stall ${k}`, cost: 1 })),
      },
      [25, 64, 0],
    );
    expect(round.equilibrium.kind).toBe("mixed");
    const p0 = spendPlacement(round, 0)!;
    expect(p0.probabilityLess).toBeCloseTo(Math.sqrt(25 / 100), 9);
    expect(p0.probabilityMore).toBeCloseTo(1 - Math.sqrt(25 / 100), 9);
    expect(p0.expectedSpend).toBeCloseTo(100 / 3, 6); // mean of F: V / n
    expect([p0.lowSpend, p0.highSpend]).toEqual([0, 100]);
    expect(spendPlacement(round, 1)!.probabilityLess).toBeCloseTo(0.8, 9);
    const p2 = spendPlacement(round, 2)!;
    expect(p2.probabilityLess).toBe(0);
    expect(p2.probabilitySame).toBeCloseTo(0, 9); // no atom at zero with identical rivals
  });

  it("two identical rivals at r = 3 (finite mix): the points' sums and the seats' draws agree", () => {
    const round = playedRound(
      {
        csf: { kind: "ratio", decisiveness: 3 },
        rivals: [
          { name: "A", cost: 2 },
          { name: "B", cost: 2 },
        ],
      },
      [30, 0],
    );
    expect(round.equilibrium.kind).toBe("mixed");
    const points = round.equilibrium.strategies![0]!.points!;
    const effort = 30 / 2;
    const less = points.filter((p) => p.effort < effort).reduce((s, p) => s + p.probability, 0);
    const p = spendPlacement(round, 0)!;
    expect(p.probabilityLess).toBeCloseTo(less, 12);
    expect(p.probabilityLess + p.probabilitySame + p.probabilityMore).toBeCloseTo(1, 12);
    expect(p.expectedSpend).toBeCloseTo(round.equilibriumSpends[0]!, 9);
    expect(p.highSpend).toBeCloseTo(2 * points.at(-1)!.effort, 12);
    // the computer seats' inverse-CDF draws: the share of draws below lands within 0.015
    const rng = mulberry32(7);
    let below = 0;
    for (let k = 0; k < 20_000; k++) if (drawPoint(points, rng()) < effort) below += 1;
    expect(Math.abs(below / 20_000 - p.probabilityLess)).toBeLessThan(0.015);
    // spending nothing: the chance of the same is the mix's weight at zero
    const zero = points.filter((q) => q.effort === 0).reduce((s, q) => s + q.probability, 0);
    expect(spendPlacement(round, 1)!.probabilitySame).toBeCloseTo(zero, 12);
  });

  it("the session summary's overspend in a mixed round divides by the expected equilibrium spends", () => {
    const room = playedRoom(
      {
        csf: { kind: "ratio", decisiveness: 3 },
        rivals: [
          { name: "A", cost: 2 },
          { name: "B", cost: 2 },
        ],
      },
      [30, 10],
    );
    const round = viewFor(room.state, { role: "spectator" }).rounds[0]!;
    const expected = round.equilibrium.strategies!.map(
      (st) => 2 * st.points!.reduce((s, p) => s + p.effort * p.probability, 0),
    );
    const summary = summarizeSession(room.log)!;
    expect(summary.rounds[0]!.equilibriumTotalSpend).toBeCloseTo(expected[0]! + expected[1]!, 9);
    expect(summary.rounds[0]!.overspend).toBeCloseTo(40 / (expected[0]! + expected[1]!), 9);
    expect(summary.seats[0]!.overspend).toBeCloseTo(30 / expected[0]!, 9);
  });

  it("pure rounds have no placement; the sentence names money and chances", () => {
    const round = playedRound({}, [10, 10, 10]);
    expect(round.equilibrium.kind).toBe("pure");
    expect(spendPlacement(round, 0)).toBeNull();
    const text = placementText(
      {
        spend: 40,
        expectedSpend: 31,
        lowSpend: 0,
        highSpend: 80,
        probabilityLess: 0.62,
        probabilitySame: 0,
        probabilityMore: 0.38,
      },
      (v) => `$${v}`,
      (v) => `${Math.round(v * 100)}%`,
    );
    expect(text).toBe(
      "At equilibrium this rival draws a spend from $0 to $80 (expected $31): less than $40 with chance 62%, more with chance 38%.",
    );
  });
});
