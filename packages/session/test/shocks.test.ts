import { describe, expect, it } from "vitest";
import { expectRejected, facilitator, guest, Room, scenarioWith } from "./harness";
import type { LiveState } from "../src/index";

function live(room: Room): LiveState {
  if (room.state.status === "empty") throw new Error("no session");
  return room.state;
}

describe("decide: shocks", () => {
  it("applyShock(rival cost, prize, csf) changes the contest and records the shock", () => {
    const room = new Room(scenarioWith());
    const before = live(room).scenario;
    const d = room.ok(
      {
        type: "applyShock",
        changes: [
          { target: "rival", index: 1, field: "cost", value: 0.5 },
          { target: "rival", index: 2, field: "budget", value: null },
          { target: "prize", value: 150 },
          { target: "csf", csf: { kind: "ratio", decisiveness: 0.5 } },
        ],
      },
      facilitator,
    );
    expect(d.events[0]).toMatchObject({ type: "shock-applied" });
    const s = live(room);
    expect(s.scenario.rivals[1]!.cost).toBe(0.5);
    expect(s.scenario.rivals[2]!.budget).toBeNull();
    expect(s.scenario.prize).toBe(150);
    expect(s.scenario.csf).toEqual({ kind: "ratio", decisiveness: 0.5 });
    expect(s.shocks).toEqual([
      {
        afterRound: 0,
        changes: d.events[0]!.type === "shock-applied" ? d.events[0]!.changes : [],
        before,
        after: s.scenario,
      },
    ]);
    // from what to what: the record keeps the contest on both sides of the shock
    expect(s.shocks[0]!.before.rivals[1]!.cost).toBe(2);
    expect(s.shocks[0]!.before.prize).toBe(100);
    expect(s.shocks[0]!.after.prize).toBe(150);
    expect(s.status).toBe("lobby");
  });

  it("R14: shocks only between rounds", () => {
    const room = new Room(scenarioWith());
    room.ok({ type: "openRound" }, facilitator);
    const d = room.send(
      { type: "applyShock", changes: [{ target: "prize", value: 50 }] },
      facilitator,
    );
    expectRejected(d, "wrong-state", /R14/);
    room.ok({ type: "closeRound" }, facilitator);
    room.ok({ type: "applyShock", changes: [{ target: "prize", value: 50 }] }, facilitator);
    expect(live(room)).toMatchObject({ status: "review", shocks: [{ afterRound: 1 }] });
  });

  it("R14: the contest after the changes is re-validated by the solver's validator", () => {
    const room = new Room(scenarioWith());
    const d = room.send(
      { type: "applyShock", changes: [{ target: "rival", index: 0, field: "cost", value: 0 }] },
      facilitator,
    );
    expectRejected(d, "bad-request", /rivals\.0\.cost: must be > 0/);
    const n = room.send(
      { type: "applyShock", changes: [{ target: "rival", index: 0, field: "cost", value: null }] },
      facilitator,
    );
    expectRejected(n, "bad-request", /rivals\.0\.cost/);
    const dup = room.send(
      {
        type: "applyShock",
        changes: [{ target: "add-rival", rival: { name: "North Bakery", cost: 1 } }],
      },
      facilitator,
    );
    expectRejected(dup, "bad-request", /duplicates/);
    expect(room.log).toHaveLength(1);
  });

  it("R14: a change naming a missing rival is not-found; a retired rival cannot change", () => {
    const room = new Room(scenarioWith());
    const d = room.send(
      { type: "applyShock", changes: [{ target: "retire-rival", index: 5 }] },
      facilitator,
    );
    expectRejected(d, "not-found", /changes\.0\.index/);
    room.ok({ type: "applyShock", changes: [{ target: "retire-rival", index: 2 }] }, facilitator);
    expectRejected(
      room.send(
        { type: "applyShock", changes: [{ target: "rival", index: 2, field: "cost", value: 3 }] },
        facilitator,
      ),
      "wrong-state",
      /retired/,
    );
    expectRejected(
      room.send(
        { type: "applyShock", changes: [{ target: "retire-rival", index: 2 }] },
        facilitator,
      ),
      "wrong-state",
      /retired/,
    );
  });

  it("R14: at least two active rivals must remain", () => {
    const room = new Room(scenarioWith());
    const d = room.send(
      {
        type: "applyShock",
        changes: [
          { target: "retire-rival", index: 0 },
          { target: "retire-rival", index: 1 },
        ],
      },
      facilitator,
    );
    expectRejected(d, "bad-request", /at least 2 active rivals/);
  });

  it("R14: add-rival adds a new seat (human or computer); 64 seats at most", () => {
    const room = new Room(scenarioWith());
    room.ok(
      {
        type: "applyShock",
        changes: [
          { target: "add-rival", rival: { name: "Dough Bros", cost: 1.5 } },
          {
            target: "add-rival",
            rival: { name: "Flour Power", cost: 1 },
            policy: { kind: "equilibrium" },
          },
        ],
      },
      facilitator,
    );
    const s = live(room);
    expect(s.seats.map((x) => [x.index, x.name, x.policy?.kind ?? null])).toEqual([
      [0, "North Bakery", null],
      [1, "Corner Ovens", null],
      [2, "Rye & Crumb", null],
      [3, "Dough Bros", null],
      [4, "Flour Power", "equilibrium"],
    ]);
    expect(s.totals).toEqual([0, 0, 0, 0, 0]);
    expect(room.send({ type: "claimSeat", seatIndex: 3, displayName: "Dee" }, guest).ok).toBe(true);

    const many = Array.from({ length: 59 }, (_, i) => ({
      target: "add-rival" as const,
      rival: { name: `Stall ${i}`, cost: 1 },
    }));
    room.ok({ type: "applyShock", changes: many }, facilitator);
    expect(live(room).seats).toHaveLength(64);
    const over = room.send(
      {
        type: "applyShock",
        changes: [{ target: "add-rival", rival: { name: "One too many", cost: 1 } }],
      },
      facilitator,
    );
    expectRejected(over, "too-large", /at most 64 seats/);
  });

  it("R14: a retired rival is excluded from later rounds' contests but keeps its seat and totals", () => {
    const room = new Room(scenarioWith());
    room.ok({ type: "openRound" }, facilitator);
    room.seal(0, 10);
    room.seal(1, 5);
    room.seal(2, 8);
    room.ok({ type: "closeRound" }, facilitator);
    const before = live(room).totals[2];
    room.ok({ type: "applyShock", changes: [{ target: "retire-rival", index: 2 }] }, facilitator);
    const opened = room.ok({ type: "openRound" }, facilitator).events[0]!;
    expect(opened).toMatchObject({ seatIndices: [0, 1] });
    if (opened.type === "round-opened") {
      expect(opened.scenario.rivals.map((r) => r.name)).toEqual(["North Bakery", "Corner Ovens"]);
    }
    room.seal(0, 10);
    room.seal(1, 5);
    const resolved = room.ok({ type: "closeRound" }, facilitator).events[0]!;
    expect(resolved).toMatchObject({ efforts: [10, 5, 0] });
    if (resolved.type === "round-resolved") {
      // ratio form, r = 1: p_i = e_i / sum e (Tullock 1980)
      [10 / 15, 5 / 15, 0].forEach((p, i) => expect(resolved.shares[i]).toBeCloseTo(p, 12));
    }
    expect(live(room).totals[2]).toBe(before);
    expect(live(room).seats[2]).toMatchObject({ active: false, name: "Rye & Crumb" });
  });

  it("R15: setSeatPolicy switches a seat between human and computer, between rounds only", () => {
    const room = new Room(scenarioWith());
    room.ok(
      { type: "setSeatPolicy", seatIndex: 1, policy: { kind: "fixed", effort: 7 } },
      facilitator,
    );
    room.ok({ type: "openRound" }, facilitator);
    expect(room.log.at(-1)).toMatchObject({
      type: "move-sealed",
      seatIndex: 1,
      effort: 7,
      by: "computer",
    });
    expectRejected(
      room.send({ type: "setSeatPolicy", seatIndex: 1, policy: null }, facilitator),
      "wrong-state",
      /R15/,
    );
    room.ok({ type: "closeRound" }, facilitator);
    room.ok({ type: "setSeatPolicy", seatIndex: 1, policy: null }, facilitator);
    const opened = room.ok({ type: "openRound" }, facilitator);
    expect(opened.events).toHaveLength(1);
    expectRejected(
      room.send({ type: "setSeatPolicy", seatIndex: 9, policy: null }, facilitator),
      "not-found",
      /seatIndex/,
    );
  });

  it("R15: a retired seat gets no policy", () => {
    const room = new Room(scenarioWith());
    room.ok({ type: "applyShock", changes: [{ target: "retire-rival", index: 0 }] }, facilitator);
    expectRejected(
      room.send(
        { type: "setSeatPolicy", seatIndex: 0, policy: { kind: "equilibrium" } },
        facilitator,
      ),
      "wrong-state",
      /retired/,
    );
  });
});
