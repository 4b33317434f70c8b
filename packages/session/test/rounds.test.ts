import { describe, expect, it } from "vitest";
import { allSealed, deadline } from "../src/index";
import { expectRejected, facilitator, Room, scenarioWith, seat, system } from "./harness";

describe("decide: rounds and moves", () => {
  it("openRound(lobby) opens round 1 under the active contest with the session clock", () => {
    const room = new Room(scenarioWith({ clockSeconds: 60 }));
    const d = room.ok({ type: "openRound" }, facilitator);
    expect(d.events[0]).toMatchObject({
      type: "round-opened",
      round: 1,
      seatIndices: [0, 1, 2],
      deadline: room.now + 60_000,
    });
    expect(room.state.status).toBe("open");
    expect(deadline(room.state)).toBe(room.now + 60_000);
  });

  it("openRound({durationSeconds}) overrides the session clock; null means no clock", () => {
    const a = new Room(scenarioWith({ clockSeconds: 60 }));
    a.ok({ type: "openRound", durationSeconds: 30 }, facilitator);
    expect(deadline(a.state)).toBe(a.now + 30_000);
    const b = new Room(scenarioWith({ clockSeconds: 60 }));
    b.ok({ type: "openRound", durationSeconds: null }, facilitator);
    expect(deadline(b.state)).toBeNull();
  });

  it("R8: a round cannot be opened while one is open, nor after the last round", () => {
    const room = new Room(scenarioWith({ rounds: 1 }));
    room.ok({ type: "openRound" }, facilitator);
    expectRejected(room.send({ type: "openRound" }, facilitator), "wrong-state", /R8.*still open/);
    room.ok({ type: "closeRound" }, facilitator);
    // R18: resolving the last round ended the session
    expect(room.state.status).toBe("ended");
    expect(room.lastEvent()).toMatchObject({ type: "session-ended", reason: "rounds-complete" });
  });

  it("R8: openRound after all rounds but before ending is refused", () => {
    const room = new Room(scenarioWith({ rounds: 2 }));
    room.ok({ type: "openRound" }, facilitator);
    room.ok({ type: "closeRound" }, facilitator);
    expect(room.state.status).toBe("review");
    room.ok({ type: "openRound" }, facilitator);
    room.ok({ type: "closeRound" }, facilitator);
    expect(room.state.status).toBe("ended");
  });

  it("R9: closeRound without an open round is wrong-state", () => {
    const room = new Room(scenarioWith());
    expectRejected(room.send({ type: "closeRound" }, facilitator), "wrong-state", /R9/);
    expectRejected(
      room.send({ type: "closeRound", reason: "all-sealed" }, system),
      "wrong-state",
      /R9/,
    );
  });

  it("R10: no seal when no round is open", () => {
    const room = new Room(scenarioWith());
    expectRejected(room.seal(0, 5), "wrong-state", /R10/);
    room.ok({ type: "openRound" }, facilitator);
    room.ok({ type: "closeRound" }, facilitator);
    expectRejected(room.seal(0, 5), "wrong-state", /R10/);
  });

  it("R10: a seal that names another round is refused", () => {
    const room = new Room(scenarioWith());
    room.ok({ type: "openRound" }, facilitator);
    const d = room.send({ type: "sealMove", clientMoveId: "a", effort: 5, round: 2 }, seat(0));
    expectRejected(d, "wrong-state", /round 1 is open/);
    expect(
      room.send({ type: "sealMove", clientMoveId: "a", effort: 5, round: 1 }, seat(0)).ok,
    ).toBe(true);
  });

  it("R11: a computer seat or a seat not playing this round cannot seal", () => {
    const room = new Room(scenarioWith({ computer: { "Corner Ovens": { kind: "equilibrium" } } }));
    room.ok({ type: "applyShock", changes: [{ target: "retire-rival", index: 2 }] }, facilitator);
    room.ok({ type: "openRound" }, facilitator);
    expectRejected(room.seal(1, 5), "forbidden", /R11.*computer/);
    expectRejected(room.seal(2, 5), "forbidden", /R11.*does not play/);
    expectRejected(room.seal(7, 5), "forbidden", /R11/);
  });

  it("R12: effort must be a multiple of effortStep (within 1e-9)", () => {
    const room = new Room(scenarioWith({ effortStep: 0.1 }));
    room.ok({ type: "openRound" }, facilitator);
    const d = room.seal(0, 0.25);
    expectRejected(d, "bad-request", /effort: R12: must be a multiple of 0.1/);
    expect(!d.ok && d.path).toBe("effort");
    // 0.7 is not exactly 7 * 0.1 in binary; the tolerance accepts it
    expect(room.seal(0, 0.7).ok).toBe(true);
    expect(room.seal(0, 12.3).ok).toBe(true);
  });

  it("R12: effort must respect the rival's budget", () => {
    const room = new Room(scenarioWith());
    room.ok({ type: "openRound" }, facilitator);
    expectRejected(room.seal(2, 31), "bad-request", /R12: is more than the budget 30 \(got 31\)/);
    expect(room.seal(2, 30).ok).toBe(true);
  });

  it("R13: the same clientMoveId again returns the original ack and no event", () => {
    const room = new Room(scenarioWith());
    room.ok({ type: "openRound" }, facilitator);
    const first = room.ok({ type: "sealMove", clientMoveId: "abc", effort: 10 }, seat(0));
    const logLength = room.log.length;
    const again = room.ok({ type: "sealMove", clientMoveId: "abc", effort: 99 }, seat(0));
    expect(again.events).toEqual([]);
    expect(again.data).toEqual(first.data);
    expect(again.data).toEqual({
      kind: "sealMove",
      round: 1,
      seatIndex: 0,
      clientMoveId: "abc",
      effort: 10,
      spend: 10,
    });
    expect(room.log).toHaveLength(logLength);
  });

  it("R13: a new clientMoveId before close replaces the move; the replaced id is then a conflict", () => {
    const room = new Room(scenarioWith());
    room.ok({ type: "openRound" }, facilitator);
    room.ok({ type: "sealMove", clientMoveId: "a", effort: 10 }, seat(0));
    const b = room.ok({ type: "sealMove", clientMoveId: "b", effort: 20 }, seat(0));
    expect(b.events).toHaveLength(1);
    expectRejected(
      room.send({ type: "sealMove", clientMoveId: "a", effort: 10 }, seat(0)),
      "conflict",
      /replaced/,
    );
    room.ok({ type: "closeRound" }, facilitator);
    const r = room.state.status === "review" ? room.state.rounds[0]! : null;
    expect(r?.efforts[0]).toBe(20);
  });

  it("R13: clientMoveIds are per round: the same id in the next round is a new move", () => {
    const room = new Room(scenarioWith());
    room.ok({ type: "openRound" }, facilitator);
    room.ok({ type: "sealMove", clientMoveId: "same", effort: 10 }, seat(0));
    room.ok({ type: "closeRound" }, facilitator);
    room.ok({ type: "openRound" }, facilitator);
    const d = room.ok({ type: "sealMove", clientMoveId: "same", effort: 12 }, seat(0));
    expect(d.events).toHaveLength(1);
  });

  it("allSealed(state) is true only once every seat playing the round has sealed", () => {
    const room = new Room(scenarioWith());
    expect(allSealed(room.state)).toBe(false);
    room.ok({ type: "openRound" }, facilitator);
    room.seal(0, 10);
    room.seal(1, 5);
    expect(allSealed(room.state)).toBe(false);
    room.seal(2, 8);
    expect(allSealed(room.state)).toBe(true);
    room.ok({ type: "pause" }, facilitator);
    expect(allSealed(room.state)).toBe(false);
  });

  it("allSealed(state) ignores retired seats and counts computer moves made at open", () => {
    const room = new Room(
      scenarioWith({ computer: { "Corner Ovens": { kind: "fixed", effort: 4 } } }),
    );
    room.ok({ type: "applyShock", changes: [{ target: "retire-rival", index: 2 }] }, facilitator);
    room.ok({ type: "openRound" }, facilitator);
    expect(allSealed(room.state)).toBe(false);
    room.seal(0, 10);
    expect(allSealed(room.state)).toBe(true);
  });
});

describe("decide: pause, resume, end", () => {
  it("R16: pause keeps the remaining clock and resume restarts it from now", () => {
    const room = new Room(scenarioWith({ clockSeconds: 60 }));
    room.ok({ type: "openRound" }, facilitator);
    room.now += 25_000;
    const p = room.ok({ type: "pause" }, facilitator);
    expect(p.events).toEqual([{ type: "paused", remainingMs: 35_000 }]);
    expect(deadline(room.state)).toBeNull();
    room.now += 600_000;
    const r = room.ok({ type: "resume" }, facilitator);
    expect(r.events).toEqual([{ type: "resumed", deadline: room.now + 35_000 }]);
    expect(deadline(room.state)).toBe(room.now + 35_000);
  });

  it("R16: pause after the deadline passed keeps zero, never a negative time", () => {
    const room = new Room(scenarioWith({ clockSeconds: 10 }));
    room.ok({ type: "openRound" }, facilitator);
    room.now += 11_000;
    expect(room.ok({ type: "pause" }, facilitator).events).toEqual([
      { type: "paused", remainingMs: 0 },
    ]);
  });

  it("R16: pause twice or resume when running is wrong-state; pause without a clock stores null", () => {
    const room = new Room(scenarioWith());
    expectRejected(room.send({ type: "resume" }, facilitator), "wrong-state", /R16.*not paused/);
    expect(room.ok({ type: "pause" }, facilitator).events).toEqual([
      { type: "paused", remainingMs: null },
    ]);
    expectRejected(room.send({ type: "pause" }, facilitator), "wrong-state", /R16.*already/);
    expect(room.ok({ type: "resume" }, facilitator).events).toEqual([
      { type: "resumed", deadline: null },
    ]);
  });

  it("R5: while paused no round opens or closes, no move is sealed and no shock applies", () => {
    const room = new Room(scenarioWith());
    room.ok({ type: "pause" }, facilitator);
    expectRejected(room.send({ type: "openRound" }, facilitator), "wrong-state", /R5/);
    expectRejected(
      room.send({ type: "applyShock", changes: [{ target: "prize", value: 50 }] }, facilitator),
      "wrong-state",
      /R5/,
    );
    room.ok({ type: "resume" }, facilitator);
    room.ok({ type: "openRound" }, facilitator);
    room.ok({ type: "pause" }, facilitator);
    expectRejected(room.seal(0, 3), "wrong-state", /R5/);
    expectRejected(room.send({ type: "closeRound" }, facilitator), "wrong-state", /R5/);
    expectRejected(room.send({ type: "closeRound", reason: "clock" }, system), "wrong-state", /R5/);
  });

  it("R17: endSession during an open round resolves it with the moves sealed so far", () => {
    const room = new Room(scenarioWith());
    room.ok({ type: "openRound" }, facilitator);
    room.seal(0, 10);
    room.ok({ type: "pause" }, facilitator);
    const d = room.ok({ type: "endSession" }, facilitator);
    expect(d.events.map((e) => e.type)).toEqual(["round-resolved", "session-ended"]);
    expect(d.events[0]).toMatchObject({ efforts: [10, 0, 0], defaulted: [false, true, true] });
    expect(room.state).toMatchObject({
      status: "ended",
      endedReason: "facilitator",
      paused: false,
    });
  });

  it("R17: endSession in the lobby just ends", () => {
    const room = new Room(scenarioWith());
    expect(room.ok({ type: "endSession" }, facilitator).events).toEqual([
      { type: "session-ended", reason: "facilitator" },
    ]);
  });
});
