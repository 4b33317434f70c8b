/**
 * Resolution numbers are checked two ways: against the solver run on the efforts played (the
 * solver itself is tested against published formulas), and directly against closed forms for
 * the two-rival ratio contest with r = 1 (Tullock 1980; Hillman & Riley 1989, Economics &
 * Politics 1, volume from memory).
 */
import { describe, expect, it } from "vitest";
import { createPolicy, drawWinner, mulberry32, normalize, respond, solve } from "@contend/solver";
import type { RoundResolved } from "@contend/protocol";
import { computerSeed, drawSeedFor } from "../src/index";
import { facilitator, Room, scenarioWith } from "./harness";

const duo = {
  rivals: [
    { name: "North Bakery", cost: 1 },
    { name: "Corner Ovens", cost: 2 },
  ],
};

function resolvedOf(room: Room): RoundResolved {
  const e = room.log.findLast((x) => x.type === "round-resolved");
  if (!e || e.type !== "round-resolved") throw new Error("no resolved round");
  const { seq: _s, at: _a, ...body } = e;
  return body;
}

function playRound(room: Room, efforts: (number | null)[]) {
  room.ok({ type: "openRound" }, facilitator);
  efforts.forEach((e, i) => {
    if (e !== null) room.seal(i, e);
  });
  room.ok({ type: "closeRound" }, facilitator);
  return resolvedOf(room);
}

describe("closeRound: resolution in shares mode", () => {
  const room = new Room(scenarioWith({}, duo));
  const r = playRound(room, [20, 10]);

  it("shares and payoffs match p_i = e_i / sum e and u_i = v p_i - m_i e_i (Tullock 1980)", () => {
    expect(r.shares[0]).toBeCloseTo(2 / 3, 12);
    expect(r.shares[1]).toBeCloseTo(1 / 3, 12);
    expect(r.payoffs[0]).toBeCloseTo(100 * (2 / 3) - 20, 10);
    expect(r.payoffs[1]).toBeCloseTo(100 * (1 / 3) - 2 * 10, 10);
    expect(r.expectedPayoffs).toEqual(r.payoffs);
    expect(r.totals).toEqual(r.payoffs);
    expect(r.winner).toBeNull();
    expect(r.drawSeed).toBeNull();
  });

  it("best responses match w e_i = sqrt(v Z / m_i) - Z for r = 1", () => {
    expect(r.bestResponses[0]).toBeCloseTo(Math.sqrt((100 * 10) / 1) - 10, 4);
    expect(r.bestResponses[1]).toBeCloseTo(Math.sqrt((100 * 20) / 2) - 20, 4);
    const br0 = r.bestResponses[0]!;
    const u0 = (100 * br0) / (br0 + 10) - br0;
    expect(r.regrets[0]).toBeCloseTo(u0 - r.payoffs[0]!, 6);
    expect(r.nashGap).toBeCloseTo(Math.max(...r.regrets), 12);
  });

  it("the equilibrium matches e_1 = v m_2 / (m_1 + m_2)^2 (Hillman & Riley 1989)", () => {
    expect(r.equilibrium.kind).toBe("pure");
    expect(r.equilibrium.efforts![0]).toBeCloseTo((100 * 2) / 9, 6);
    expect(r.equilibrium.efforts![1]).toBeCloseTo((100 * 1) / 9, 6);
  });

  it("dissipation of play is sum m_i e_i / prize", () => {
    expect(r.dissipation).toBeCloseTo((1 * 20 + 2 * 10) / 100, 12);
  });

  it("every stored number equals the solver's respond/solve for the efforts played", () => {
    const opened = room.log.find((e) => e.type === "round-opened");
    if (!opened || opened.type !== "round-opened") throw new Error("no round opened");
    const contest = normalize(opened.scenario);
    const resp = respond(contest, [20, 10]);
    expect(r.bestResponses).toEqual(resp.bestResponses);
    expect(r.regrets).toEqual(resp.regrets);
    // respond evaluates payoffs its own way; agreement to rounding error
    r.expectedPayoffs.forEach((u, i) => expect(u).toBeCloseTo(resp.payoffs[i]!, 10));
    expect(r.nashGap).toBe(resp.nashGap);
    expect(r.equilibrium).toEqual(solve(contest).equilibrium);
  });
});

describe("closeRound: three rivals with a budget", () => {
  it("stored results equal the solver's on a 3-rival contest with a capped rival", () => {
    const room = new Room(scenarioWith());
    const r = playRound(room, [25, 5, 30]);
    const contest = normalize(scenarioWith());
    const resp = respond(contest, [25, 5, 30]);
    expect(r.bestResponses).toEqual(resp.bestResponses);
    expect(r.regrets).toEqual(resp.regrets);
    expect(r.equilibrium).toEqual(solve(contest).equilibrium);
    // Rye & Crumb's best response respects its budget of 30
    expect(r.bestResponses[2]).toBeLessThanOrEqual(30 + 1e-9);
  });
});

describe("closeRound: winner mode", () => {
  it("R21: the winner is drawn with the recorded seed and payoffs are realised", () => {
    const room = new Room(scenarioWith({ outcome: "winner" }, duo), 12345);
    const r = playRound(room, [20, 10]);
    expect(r.drawSeed).toBe(drawSeedFor(12345, 1));
    const expectedWinner = drawWinner(r.shares, mulberry32(r.drawSeed!));
    expect(r.winner).toBe(expectedWinner);
    const won = [r.winner === 0 ? 1 : 0, r.winner === 1 ? 1 : 0];
    expect(r.payoffs[0]).toBeCloseTo(100 * won[0]! - 1 * 20, 12);
    expect(r.payoffs[1]).toBeCloseTo(100 * won[1]! - 2 * 10, 12);
    expect(r.expectedPayoffs[0]).toBeCloseTo(100 * (2 / 3) - 20, 10);
    expect(r.totals).toEqual(r.payoffs);
  });

  it("R21: over many sessions the winner frequency matches the shares (4 standard errors)", () => {
    const runs = 400;
    let firstWins = 0;
    for (let seed = 0; seed < runs; seed++) {
      const room = new Room(scenarioWith({ outcome: "winner", rounds: 1 }, duo), seed);
      if (playRound(room, [20, 10]).winner === 0) firstWins++;
    }
    const p = 2 / 3;
    const se = Math.sqrt((p * (1 - p)) / runs);
    expect(Math.abs(firstWins / runs - p)).toBeLessThan(4 * se);
  });
});

describe("closeRound: missing moves", () => {
  it("R20: missingMove zero plays 0 and marks the seat defaulted", () => {
    const room = new Room(scenarioWith());
    const r = playRound(room, [10, null, 5]);
    expect(r.efforts).toEqual([10, 0, 5]);
    expect(r.defaulted).toEqual([false, true, false]);
  });

  it("R20: missingMove repeat plays the seat's previous effort (0 in the first round)", () => {
    const room = new Room(scenarioWith({ missingMove: "repeat" }));
    const r1 = playRound(room, [10, null, 5]);
    expect(r1.efforts).toEqual([10, 0, 5]);
    const r2 = playRound(room, [12, 6, null]);
    expect(r2.efforts).toEqual([12, 6, 5]);
    expect(r2.defaulted).toEqual([false, false, true]);
  });

  it("R20: a repeated effort is cut to a budget lowered by a shock since", () => {
    const room = new Room(scenarioWith({ missingMove: "repeat" }));
    playRound(room, [10, 4, 28]);
    room.ok(
      { type: "applyShock", changes: [{ target: "rival", index: 2, field: "budget", value: 12 }] },
      facilitator,
    );
    const r = playRound(room, [10, 4, null]);
    expect(r.efforts[2]).toBe(12);
  });

  it("running totals add each round's payoffs per seat", () => {
    const room = new Room(scenarioWith());
    const a = playRound(room, [10, 5, 8]);
    const b = playRound(room, [12, 3, 9]);
    b.totals.forEach((t, i) => expect(t).toBeCloseTo(a.payoffs[i]! + b.payoffs[i]!, 10));
  });
});

describe("openRound: computer seats", () => {
  it("R19: computer seats seal at open with the solver policy seeded by (seed, round, seat)", () => {
    const spec = { kind: "overspender" as const, factor: 1.5, noise: 0.3 };
    const room = new Room(scenarioWith({ computer: { "Corner Ovens": spec } }), 99);
    const d = room.ok({ type: "openRound" }, facilitator);
    const move = d.events.find((e) => e.type === "move-sealed");
    expect(move).toMatchObject({ seatIndex: 1, by: "computer", clientMoveId: "computer-r1-s1" });
    const contest = normalize(scenarioWith());
    const direct = createPolicy(spec, computerSeed(99, 1, 1)).decide({
      contest,
      self: 1,
      history: [],
      step: 1,
    });
    expect(move && move.type === "move-sealed" && move.effort).toBe(direct);
  });

  it("R19: an equilibrium player seals the solver's equilibrium effort on the effort grid", () => {
    const room = new Room(
      scenarioWith({ computer: { "North Bakery": { kind: "equilibrium" } } }, duo),
    );
    const d = room.ok({ type: "openRound" }, facilitator);
    const move = d.events.find((e) => e.type === "move-sealed");
    // Hillman & Riley 1989: e_1 = v m_2 / (m_1 + m_2)^2 = 200/9 = 22.2..., on a step of 1 -> 22
    expect(move && move.type === "move-sealed" && move.effort).toBe(22);
  });

  it("R19: a fixed effort above the budget is cut to the budget", () => {
    const room = new Room(
      scenarioWith({ computer: { "Rye & Crumb": { kind: "fixed", effort: 80 } } }),
    );
    const d = room.ok({ type: "openRound" }, facilitator);
    expect(d.events.find((e) => e.type === "move-sealed")).toMatchObject({
      seatIndex: 2,
      effort: 30,
    });
  });

  it("R19: a best-reply player answers last round's efforts", () => {
    const room = new Room(
      scenarioWith({ computer: { "Corner Ovens": { kind: "best-reply" } } }, duo),
    );
    playRound(room, [20, null]);
    const d = room.ok({ type: "openRound" }, facilitator);
    const move = d.events.find((e) => e.type === "move-sealed");
    // r = 1: e_2 = sqrt(v Z / m_2) - Z with Z = 20: sqrt(1000) - 20 = 11.62 effort, a spend of
    // 2 x 11.62 = 23.25 -> 23 on the money grid of 1 (R12, R19), i.e. effort 11.5
    expect(move && move.type === "move-sealed" && move.spend).toBe(23);
    expect(move && move.type === "move-sealed" && move.effort).toBe(11.5);
  });
});
