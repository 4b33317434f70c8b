// A seat's move is money (docs/protocol.md R12): spend = cost x effort, effort = spend / cost is
// the model's quantity, budgets cap money. Old logs (efforts only) still replay.
import { describe, expect, it } from "vitest";
import type { SessionEvent } from "@contend/protocol";
import { checkSpend, fold, viewFor } from "../src/index";
import { Room, expectLogValid, expectRejected, facilitator, scenarioWith, seat } from "./harness";

const spendOf = (room: Room, seatIndex: number, spend: number, id = `s-${seatIndex}-${spend}`) =>
  room.send({ type: "sealMove", clientMoveId: id, spend }, seat(seatIndex));

// cost 1.2 and a budget of 200 (money): the example of the workshop run
const money = scenarioWith(
  {},
  {
    rivals: [
      { name: "North Bakery", cost: 1.2, budget: 200 },
      { name: "Corner Ovens", cost: 2 },
      { name: "Rye & Crumb", cost: 1, budget: 30 },
    ],
  },
);

describe("R12: the move is money", () => {
  it("sealMove(spend 180) at cost 1.2 seals effort 150 and the spend itself", () => {
    const room = new Room(money);
    room.ok({ type: "openRound" }, facilitator);
    const d = spendOf(room, 0, 180);
    expect(d.ok).toBe(true);
    const e = room.lastEvent();
    expect(e.type === "move-sealed" && e.spend).toBe(180);
    expect(e.type === "move-sealed" && e.effort).toBeCloseTo(150, 12);
    expect(viewFor(room.state, { role: "seat", seatIndex: 0 }).you?.sealedSpend).toBe(180);
    spendOf(room, 1, 40);
    spendOf(room, 2, 20);
    room.ok({ type: "closeRound" }, facilitator);
    const r = viewFor(room.state, { role: "spectator" }).rounds[0]!;
    expect(r.spends).toEqual([180, 40, 20]);
    expect(r.efforts[0]).toBeCloseTo(150, 12);
    expect(r.efforts[1]).toBe(20);
    // payoff u = v p - spend; best replies in money are cost x best-reply effort
    expect(r.expectedPayoffs[0]).toBeCloseTo(100 * r.shares[0]! - 180, 9);
    expect(r.bestResponseSpends[1]).toBeCloseTo(2 * r.bestResponses[1]!, 12);
    const eq = r.equilibrium.efforts!;
    expect(r.equilibriumSpends).toEqual([1.2 * eq[0]!, 2 * eq[1]!, 1 * eq[2]!]);
    expectLogValid(room.log);
  });

  it("a budget of 200 caps money: spend 200 is allowed (effort 166.7), 201 is not", () => {
    const room = new Room(money);
    room.ok({ type: "openRound" }, facilitator);
    // read as an effort cap, 200 would have allowed a spend of 240
    expectRejected(spendOf(room, 0, 201), "bad-request", /spend: R12: is more than the budget 200/);
    expectRejected(spendOf(room, 0, 240), "bad-request", /budget 200/);
    expect(spendOf(room, 0, 200).ok).toBe(true);
  });

  it("the older effort form costs cost x effort and keeps its effort grid", () => {
    const room = new Room(money);
    room.ok({ type: "openRound" }, facilitator);
    // effort 170 at cost 1.2 costs 204 > 200
    const over = room.seal(0, 170);
    expectRejected(over, "bad-request", /effort: R12: is more than the budget 200 \(got 204\)/);
    expect(room.seal(0, 150).ok).toBe(true);
    const e = room.lastEvent();
    expect(e.type === "move-sealed" && e.spend).toBeCloseTo(180, 12);
    // on the old grid the effort is the multiple: effort 7 at cost 2 (a spend of 14) on step 7
    const grid = new Room(scenarioWith({ effortStep: 7 }));
    grid.ok({ type: "openRound" }, facilitator);
    expect(grid.seal(1, 7).ok).toBe(true);
    expect(grid.lastEvent()).toMatchObject({ effort: 7, spend: 14 });
  });

  it("spends sit on the money grid (spendStep), and the legacy effortStep is read as it", () => {
    const stepped = scenarioWith({ spendStep: 5 });
    const room = new Room(stepped);
    room.ok({ type: "openRound" }, facilitator);
    expectRejected(spendOf(room, 1, 12), "bad-request", /multiple of 5 \(nearest: 10\)/);
    expect(spendOf(room, 1, 15).ok).toBe(true); // cost 2: effort 7.5, off any effort grid
    const legacy = new Room(scenarioWith({ effortStep: 5 }));
    legacy.ok({ type: "openRound" }, facilitator);
    expectRejected(spendOf(legacy, 1, 12), "bad-request", /multiple of 5/);
  });

  it("R20 repeat plays the previous round's spend, cut to a budget lowered since", () => {
    const room = new Room(scenarioWith({ missingMove: "repeat" }, { rivals: money.rivals }));
    room.ok({ type: "openRound" }, facilitator);
    spendOf(room, 0, 180);
    room.ok({ type: "closeRound" }, facilitator);
    room.ok(
      { type: "applyShock", changes: [{ target: "rival", index: 0, field: "cost", value: 3 }] },
      facilitator,
    );
    room.ok({ type: "openRound" }, facilitator);
    room.ok({ type: "closeRound" }, facilitator);
    const r2 = room.state.status === "review" ? room.state.rounds[1]! : null;
    // the same money again; at the new cost 3 it buys effort 60
    expect(r2?.spends[0]).toBe(180);
    expect(r2?.efforts[0]).toBeCloseTo(60, 12);
    expect(r2?.defaulted[0]).toBe(true);
  });
});

describe("R23: a sealed spend is private until the reveal", () => {
  it("viewFor(others) holds neither the spend nor the effort it buys; the owner's view holds both", () => {
    const room = new Room(scenarioWith({ spendStep: 0.01 }, { rivals: money.rivals }));
    room.ok({ type: "openRound" }, facilitator);
    // Corner Ovens (cost 2) seals 14.62 on a grid of 0.01: effort 7.31
    expect(spendOf(room, 1, 14.62).ok).toBe(true);
    const hidden = (text: string, n: number) =>
      new RegExp(`(?<![\\d.])${String(n).replace(".", "\\.")}(?![\\d])`).test(text);
    for (const viewer of [
      { role: "facilitator" as const },
      { role: "spectator" as const },
      { role: "guest" as const },
      { role: "seat" as const, seatIndex: 0 },
      { role: "seat" as const, seatIndex: 2 },
    ]) {
      const text = JSON.stringify(viewFor(room.state, viewer));
      expect(hidden(text, 14.62), `${viewer.role} sees the spend`).toBe(false);
      expect(hidden(text, 7.31), `${viewer.role} sees the effort`).toBe(false);
    }
    // positive control: the same search finds both in the owner's view
    const own = JSON.stringify(viewFor(room.state, { role: "seat", seatIndex: 1 }));
    expect(hidden(own, 14.62)).toBe(true);
    expect(hidden(own, 7.31)).toBe(true);
  });
});

describe("old event logs replay", () => {
  it("fold(a log written before spends) derives spends from efforts and costs", () => {
    const room = new Room(money);
    room.ok({ type: "openRound" }, facilitator);
    room.seal(1, 20);
    room.ok({ type: "closeRound" }, facilitator);
    // strip every money field, as a log written before them reads
    const old = room.log.map((e) => {
      const { spend: _s, ...noSpend } = e as SessionEvent & { spend?: number };
      const { spends: _ss, ...bare } = noSpend as typeof noSpend & { spends?: number[] };
      return bare as SessionEvent;
    });
    expect(JSON.stringify(old)).not.toMatch(/"spends?"/);
    expectLogValid(old);
    const state = fold(old);
    const r = viewFor(state, { role: "spectator" }).rounds[0]!;
    expect(r.spends).toEqual([0, 40, 0]);
    expect(r).toEqual(viewFor(room.state, { role: "spectator" }).rounds[0]!);
  });
});

// The two cases where the web's own copy of the rule and the engine used to disagree.
describe("checkSpend: one rule for the engine and the seat form", () => {
  it("5e-7 on a step of 1000 is off the grid (nearest 0)", () => {
    const c = checkSpend(5e-7, { cost: 1 }, 1000);
    expect(c).toMatchObject({ ok: false, reason: "off-step", nearest: 0 });
    const room = new Room(scenarioWith({ spendStep: 1000 }));
    room.ok({ type: "openRound" }, facilitator);
    expect(spendOf(room, 0, 5e-7).ok).toBe(false);
  });
  it("30.00000001 against a budget of 30 is within the 1e-9 relative tolerance", () => {
    expect(checkSpend(30.00000001, { cost: 1, budget: 30 }, 1e-8)).toMatchObject({ ok: true });
    expect(checkSpend(30.0001, { cost: 1, budget: 30 }, 1e-8)).toMatchObject({
      ok: false,
      reason: "over-budget",
    });
  });
});
