/**
 * summarizeSession on logs made by the engine: a mixed equilibrium's expected spend is the
 * yardstick, and a round without an equilibrium gives null ratios. Expected values come from
 * the published two-player all-pay auction with complete information (Hillman & Riley 1989;
 * Baye, Kovenock & de Vries 1996), worked out by hand here.
 */
import { describe, expect, it } from "vitest";
import { summarizeSession } from "../src/index";
import { facilitator, Room, scenarioWith } from "./harness";

describe("summarizeSession", () => {
  it("measures overspend against the expected spend of a mixed equilibrium", () => {
    // All-pay, prize 100, costs 1 and 2: values in effort 100 and 50. The strong rival bids
    // uniformly on [0, 50] (expected 25); the weak one bids 0 with probability 1/2, else
    // uniformly on [0, 50] (expected 50^2 / (2 x 100) = 12.5 effort = 25 money).
    const room = new Room(
      scenarioWith(
        { outcome: "shares", effortStep: 0.5, rounds: 1, missingMove: "zero", computer: {} },
        {
          csf: { kind: "allpay" },
          rivals: [
            { name: "North Bakery", cost: 1 },
            { name: "Corner Ovens", cost: 2 },
          ],
        },
      ),
    );
    room.ok({ type: "openRound" }, facilitator);
    expect(room.seal(0, 40).ok).toBe(true);
    expect(room.seal(1, 10).ok).toBe(true);
    room.ok({ type: "closeRound" }, facilitator);
    const s = summarizeSession(room.log)!;
    expect(s.rounds).toHaveLength(1);
    const r = s.rounds[0]!;
    expect(r.totalSpend).toBeCloseTo(40 + 2 * 10, 9);
    expect(r.equilibriumTotalSpend).toBeCloseTo(50, 1);
    expect(r.overspend).toBeCloseTo(60 / 50, 2);
    expect(r.dissipation).toBeCloseTo(60 / 100, 9);
    expect(s.seats[0]!.meanEquilibriumSpend).toBeCloseTo(25, 1);
    expect(s.seats[1]!.meanEquilibriumSpend).toBeCloseTo(25, 1);
    expect(s.seats[1]!.overspend).toBeCloseTo(20 / 25, 2);
    expect(s.session).toMatchObject({ currency: "$", tags: [], endedAt: expect.any(String) });
  });

  it("gives null, not a number, where a round has no equilibrium", () => {
    const room = new Room(scenarioWith({ rounds: 1, missingMove: "zero", computer: {} }));
    room.ok({ type: "openRound" }, facilitator);
    for (const seat of [0, 1, 2]) expect(room.seal(seat, 10).ok).toBe(true);
    room.ok({ type: "closeRound" }, facilitator);
    const log = room.log.map((e) =>
      e.type === "round-resolved"
        ? {
            ...e,
            equilibrium: { ...e.equilibrium, kind: "none-pure" as const, efforts: null },
          }
        : e,
    );
    const s = summarizeSession(log)!;
    expect(s.rounds[0]!.equilibriumTotalSpend).toBeNull();
    expect(s.rounds[0]!.overspend).toBeNull();
    expect(s.rounds[0]!.totalSpend).toBeCloseTo(10 * 1 + 10 * 2 + 10 * 1, 9);
    expect(s.seats.map((x) => [x.overspend, x.meanEquilibriumSpend])).toEqual([
      [null, null],
      [null, null],
      [null, null],
    ]);
    expect(summarizeSession([])).toBeNull();
  });
});
