// A live session over several fronts with one budget per rival (docs/protocol.md R45-R50),
// played on the invented roaster demo (three coffee-roaster chains, four districts). Results
// are checked against an independent computation (./frontsReference: the ratio-form share
// written out, Tullock 1980, and a Nelder-Mead search over the budget set, fmin).
import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { isFrontsSession, parseSessionScenario } from "@contend/protocol";
import type { FrontsSessionScenario } from "@contend/protocol";
import { checkAllocation, summarizeSession, viewFor } from "../src/index";
import { expectLogValid, expectRejected, facilitator, guest, Room, seat } from "./harness";
import { refBestPayoff, refPayoff, refShare } from "./frontsReference";
import type { RefFront, RefRival } from "./frontsReference";

const roaster = JSON.parse(
  readFileSync(new URL("../../solver/scenarios/roaster-districts.json", import.meta.url), "utf8"),
) as {
  fronts: { prize: number; csf: { decisiveness: number } }[];
  rivals: {
    cost: number | number[];
    value?: number[];
    weight?: number[];
    budget: number;
    sunkBudget?: boolean;
  }[];
};

function frontsScenario(session: Record<string, unknown> = {}): FrontsSessionScenario {
  const r = parseSessionScenario({ ...structuredClone(roaster), session });
  if (!r.ok) throw new Error(`fixture invalid: ${r.message}`);
  if (!isFrontsSession(r.value)) throw new Error("expected a fronts session");
  return r.value;
}

// the demo file read directly, defaults written out (value: the prize; weight: 1)
const K = roaster.fronts.length;
const refFronts: RefFront[] = roaster.fronts.map((f) => ({
  prize: f.prize,
  r: f.csf.decisiveness,
}));
const each = (x: number | number[] | undefined, d: (k: number) => number) =>
  Array.from({ length: K }, (_, k) => (x === undefined ? d(k) : typeof x === "number" ? x : x[k]!));
const refRivals: RefRival[] = roaster.rivals.map((r) => ({
  cost: each(r.cost, () => 1),
  value: each(r.value, (k) => roaster.fronts[k]!.prize),
  weight: each(r.weight, () => 1),
  budget: r.budget,
  sunk: r.sunkBudget === true,
}));

const allocation = (i: number, row: number[], id = `a-${i}-${row.join("-")}`) => ({
  type: "sealMove" as const,
  clientMoveId: id,
  frontSpends: row,
});

describe("session with fronts: creation (R45, R49)", () => {
  it("R45: the roaster demo makes a session whose summary contest holds totals and budgets", () => {
    const room = new Room(frontsScenario());
    const s = room.state;
    if (s.status === "empty") throw new Error("no state");
    expect(s.fronts?.fronts.map((f) => f.name)).toEqual([
      "Old Town",
      "Harbourside",
      "University Quarter",
      "Riverside Park",
    ]);
    expect(s.scenario.prize).toBe(180000 + 120000 + 90000 + 60000);
    expect(s.scenario.rivals.map((r) => [r.cost, r.budget])).toEqual([
      [1, 90000],
      [1, 60000],
      [1, 20000],
    ]);
    expectLogValid(room.log);
  });

  it("R45: winner draws and private numbers are refused with fronts, naming the field", () => {
    const winner = parseSessionScenario({
      ...structuredClone(roaster),
      session: { outcome: "winner" },
    });
    expect(winner).toMatchObject({ ok: false, path: "session.outcome" });
    const hidden = parseSessionScenario({
      ...structuredClone(roaster),
      session: { hidden: { rivals: {} } },
    });
    expect(hidden.ok).toBe(false);
  });

  it("R49: only equilibrium and best-reply computer seats play fronts", () => {
    const r = parseSessionScenario({
      ...structuredClone(roaster),
      session: { computer: { "Bluebird Beanery": { kind: "fixed", spend: 10 } } },
    });
    expect(r).toMatchObject({ ok: false, path: "session.computer.Bluebird Beanery.kind" });
    const room = new Room(frontsScenario());
    expectRejected(
      room.send(
        { type: "setSeatPolicy", seatIndex: 1, policy: { kind: "overspender" } },
        facilitator,
      ),
      "bad-request",
      /R49/,
    );
    room.ok({ type: "setSeatPolicy", seatIndex: 1, policy: { kind: "best-reply" } }, facilitator);
  });
});

function openRoom(session: Record<string, unknown> = {}) {
  const room = new Room(frontsScenario(session));
  room.ok({ type: "claimSeat", seatIndex: 0, displayName: "Ana" }, guest);
  room.ok({ type: "claimSeat", seatIndex: 2, displayName: "Ben" }, guest);
  room.ok({ type: "openRound" }, facilitator);
  return room;
}

describe("session with fronts: sealing (R46)", () => {
  it("R46: an allocation exactly at the budget is valid; one cent over is refused", () => {
    const room = openRoom({ computer: { "Bluebird Beanery": { kind: "equilibrium" } } });
    // Lantern Street Coffee (seat 2) has a budget of 20000
    expectRejected(
      room.send(allocation(2, [5000, 5000, 5000, 5000.01]), seat(2)),
      "bad-request",
      /frontSpends: R46: the total 20000.01 is more than the budget 20000/,
    );
    const ok = room.send(allocation(2, [5000, 5000, 5000, 5000]), seat(2));
    expect(ok.ok).toBe(true);
    if (ok.ok)
      expect(ok.data).toMatchObject({ spend: 20000, frontSpends: [5000, 5000, 5000, 5000] });
  });

  it("R46: one amount per front, each finite and >= 0; a single spend is refused with fronts", () => {
    const room = openRoom();
    expectRejected(
      room.send(allocation(0, [1, 2, 3]), seat(0)),
      "bad-request",
      /one amount per front \(4\), got 3/,
    );
    expectRejected(
      room.send({ type: "sealMove", clientMoveId: "s", spend: 100 }, seat(0)),
      "bad-request",
      /R46: this session has fronts/,
    );
    // the engine's one rule, as the web form calls it on raw input
    const terms = { cost: [1, 1, 1, 1], budget: 100 };
    expect(checkAllocation([1, Number.NaN, 0, 0], terms)).toMatchObject({
      ok: false,
      reason: "not-a-number",
      front: 1,
    });
    expect(checkAllocation([1, 0, -1, 0], terms)).toMatchObject({
      ok: false,
      reason: "negative",
      front: 2,
    });
    expect(checkAllocation([25, 25, 25, 25], terms)).toMatchObject({ ok: true, total: 100 });
    expect(checkAllocation([25, 25, 25, 25.001], terms)).toMatchObject({
      ok: false,
      reason: "over-budget",
    });
  });

  it("R47: a sealed allocation is in no view but its owner's until the round resolves", () => {
    const room = openRoom();
    const secret = [31337, 4242, 1717, 999];
    room.ok(allocation(0, secret, "ana-secret"), seat(0));
    const pattern = /31337|4242|1717|999/;
    for (const viewer of [
      { role: "facilitator" as const },
      { role: "spectator" as const },
      { role: "guest" as const },
      { role: "seat" as const, seatIndex: 1 },
      { role: "seat" as const, seatIndex: 2 },
    ]) {
      const text = JSON.stringify(viewFor(room.state, viewer));
      expect(text, viewer.role).not.toMatch(pattern);
      expect(text).not.toContain("ana-secret");
    }
    // positive control: the owner's view carries it, so the pattern would catch a leak
    const own = JSON.stringify(viewFor(room.state, { role: "seat", seatIndex: 0 }));
    expect(own).toMatch(pattern);
    expect(viewFor(room.state, { role: "seat", seatIndex: 0 }).you?.sealedFrontSpends).toEqual(
      secret,
    );
    // after the reveal every role reads it in the round's fronts record
    room.ok({ type: "closeRound" }, facilitator);
    expect(viewFor(room.state, { role: "spectator" }).rounds[0]?.fronts?.spends[0]).toEqual(secret);
  });
});

describe("session with fronts: resolution (R48) against an independent computation", () => {
  it("R48: shares, value won, payoffs, best allocations and regrets per front and in total", () => {
    const room = openRoom({ computer: { "Bluebird Beanery": { kind: "equilibrium" } } });
    const ana = [40000, 20000, 15000, 5000]; // 80000 of 90000
    const ben = [2000, 8000, 9000, 1000]; // 20000 of 20000
    room.ok(allocation(0, ana), seat(0));
    room.ok(allocation(2, ben), seat(2));
    room.ok({ type: "closeRound" }, facilitator);
    expectLogValid(room.log);
    const s = room.state;
    if (s.status !== "review") throw new Error(`status ${s.status}`);
    const r = s.rounds[0]!;
    const f = r.fronts!;
    const bluebird = f.spends[1]!;
    // the computer's equilibrium row is within its budget
    expect(bluebird.reduce((a, b) => a + b, 0)).toBeLessThanOrEqual(60000 * (1 + 1e-9));
    const spends = [ana, bluebird, ben];
    for (let i = 0; i < 3; i++) {
      for (let k = 0; k < K; k++) {
        const efforts = spends.map((row, j) => row[k]! / refRivals[j]!.cost[k]!);
        const p = refShare(
          refFronts[k]!,
          refRivals.map((rv) => rv.weight[k]!),
          efforts,
          i,
        );
        expect(f.shares[i]![k]).toBeCloseTo(p, 10);
        expect(f.won[i]![k]).toBeCloseTo(refRivals[i]!.value[k]! * p, 6);
      }
      const u = refPayoff(refFronts, refRivals, spends, i);
      expect(r.payoffs[i]).toBeCloseTo(u, 6);
      expect(r.spends[i]).toBeCloseTo(
        spends[i]!.reduce((a, b) => a + b, 0),
        9,
      );
      // the best allocation: within the budget, worth what it says, at least as good as an
      // independent Nelder-Mead search over the budget set, and the regret is the difference
      const best = f.bestSpends[i]!;
      expect(best.reduce((a, b) => a + b, 0)).toBeLessThanOrEqual(
        refRivals[i]!.budget * (1 + 1e-9),
      );
      const atBest = refPayoff(
        refFronts,
        refRivals,
        spends.map((row, j) => (j === i ? best : row)),
        i,
      );
      expect(f.bestPayoffs[i]).toBeCloseTo(atBest, 4);
      const ref = refBestPayoff(refFronts, refRivals, spends, i);
      expect(atBest).toBeGreaterThanOrEqual(ref - 1e-6 * 450000);
      expect(r.regrets[i]).toBeCloseTo(atBest - u, 4);
      expect(r.bestResponseSpends[i]).toBeCloseTo(
        best.reduce((a, b) => a + b, 0),
        6,
      );
    }
    // both people overspent somewhere, so the Nash gap is positive and names the largest regret
    expect(r.nashGap).toBeCloseTo(Math.max(...r.regrets), 9);
    expect(r.nashGap).toBeGreaterThan(1);
    for (let k = 0; k < K; k++)
      expect(f.frontTotals[k]).toBeCloseTo(ana[k]! + bluebird[k]! + ben[k]!, 6);
  });

  it("R48, R49: three equilibrium computers play the equilibrium, which no seat can beat by an independent search", () => {
    const computer = Object.fromEntries(
      ["Copper Kettle Roasters", "Bluebird Beanery", "Lantern Street Coffee"].map((n) => [
        n,
        { kind: "equilibrium" },
      ]),
    );
    const room = new Room(frontsScenario({ computer, rounds: 2 }));
    room.ok({ type: "openRound" }, facilitator);
    room.ok({ type: "closeRound" }, facilitator);
    const s = room.state;
    if (s.status !== "review") throw new Error(`status ${s.status}`);
    const f = s.rounds[0]!.fronts!;
    expect(f.equilibrium.kind).toBe("pure");
    expect(f.spends).toEqual(f.equilibrium.spends);
    for (let i = 0; i < 3; i++) {
      const gap =
        refBestPayoff(refFronts, refRivals, f.spends, i) -
        refPayoff(refFronts, refRivals, f.spends, i);
      expect(gap, `seat ${i}`).toBeLessThan(1e-4 * 450000);
    }
    // the totals equal the equilibrium's money per seat
    expect(s.rounds[0]!.equilibriumSpends).toEqual(
      f.spends.map((row) => row.reduce((a, b) => a + b, 0)),
    );
  });

  it("R49: a best-reply computer plays, in round 2, its best allocation against round 1", () => {
    const room = openRoom({ computer: { "Bluebird Beanery": { kind: "best-reply" } } });
    room.ok(allocation(0, [30000, 30000, 20000, 10000]), seat(0));
    room.ok(allocation(2, [5000, 5000, 5000, 5000]), seat(2));
    room.ok({ type: "closeRound" }, facilitator);
    const first = room.state.status === "review" ? room.state.rounds[0]!.fronts! : null;
    room.ok({ type: "openRound" }, facilitator);
    const s = room.state;
    if (s.status !== "open" || !first) throw new Error("round 2 not open");
    const mine = s.open.moves[1]!.frontSpends!;
    first.bestSpends[1]!.forEach((x, k) => expect(mine[k]).toBeCloseTo(x, 3));
  });

  it("R20 with fronts: repeat plays the previous allocation; the summary counts total money", () => {
    const room = openRoom({ missingMove: "repeat", rounds: 2 });
    room.ok(allocation(0, [10000, 10000, 10000, 10000]), seat(0));
    room.ok({ type: "closeRound" }, facilitator);
    room.ok({ type: "openRound" }, facilitator);
    room.ok({ type: "closeRound" }, facilitator);
    const s = room.state;
    if (s.status !== "ended") throw new Error(`status ${s.status}`);
    expect(s.rounds[1]!.fronts!.spends[0]).toEqual([10000, 10000, 10000, 10000]);
    expect(s.rounds[1]!.defaulted[0]).toBe(true);
    const summary = summarizeSession(room.log)!;
    expect(summary.seats[0]!.meanSpend).toBe(40000);
    expect(summary.rounds[0]!.totalSpend).toBe(40000);
  });

  it("R50: shocks are refused in a session with fronts", () => {
    const room = new Room(frontsScenario());
    expectRejected(
      room.send({ type: "applyShock", changes: [{ target: "prize", value: 5 }] }, facilitator),
      "wrong-state",
      /R50/,
    );
  });
});
