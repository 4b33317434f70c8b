import { LIMITS } from "@contend/protocol";
import { describe, expect, it } from "vitest";
import { decide, initialState } from "../src/index";
import type { EngineCommand } from "../src/index";
import {
  expectRejected,
  facilitator,
  guest,
  Room,
  scenarioWith,
  seat,
  spectator,
  system,
} from "./harness";

const facilitatorCommands: EngineCommand[] = [
  { type: "openRound" },
  { type: "closeRound" },
  { type: "applyShock", changes: [{ target: "prize", value: 120 }] },
  { type: "pause" },
  { type: "resume" },
  { type: "endSession" },
  { type: "setSeatPolicy", seatIndex: 0, policy: { kind: "equilibrium" } },
  { type: "issueLinks", seatIndex: 0 },
  { type: "issueLinks", seatIndex: null },
];

describe("decide: roles", () => {
  it("decide(any command, no session yet) is not-found", () => {
    const d = decide(initialState(), { type: "openRound" }, { now: 0, actor: facilitator });
    expectRejected(d, "not-found", /no such session/);
  });

  it("R1: only the facilitator runs the session (seats, guests, spectators, system are forbidden)", () => {
    const room = new Room(scenarioWith());
    for (const command of facilitatorCommands) {
      for (const actor of [seat(0), guest, spectator, system]) {
        const d = room.send(command, actor);
        expectRejected(d, "forbidden", /R1|R2/);
      }
    }
    expect(room.log).toHaveLength(1);
  });

  it("R1: only the server closes a round for the clock or all-sealed", () => {
    const room = new Room(scenarioWith());
    room.ok({ type: "openRound" }, facilitator);
    for (const actor of [facilitator, seat(0), guest]) {
      const d = room.send({ type: "closeRound", reason: "clock" }, actor);
      expectRejected(d, "forbidden", /R1/);
    }
    const d = room.ok({ type: "closeRound", reason: "clock" }, system);
    expect(d.events[0]).toMatchObject({ type: "round-resolved", reason: "clock" });
  });

  it("R2: spectators cannot send any command", () => {
    const room = new Room(scenarioWith());
    room.ok({ type: "openRound" }, facilitator);
    const d = room.send({ type: "sealMove", clientMoveId: "a", effort: 5 }, spectator);
    expectRejected(d, "forbidden", /R2/);
    const c = room.send({ type: "claimSeat", seatIndex: 0, displayName: "Eve" }, spectator);
    expectRejected(c, "forbidden", /R2/);
  });

  it("R3: a guest may claim a seat but not seal a move", () => {
    const room = new Room(scenarioWith());
    room.ok({ type: "openRound" }, facilitator);
    const d = room.send({ type: "sealMove", clientMoveId: "a", effort: 5 }, guest);
    expectRejected(d, "forbidden", /R7/);
    const c = room.ok({ type: "claimSeat", seatIndex: 1, displayName: "Ana" }, guest);
    expect(c.events).toEqual([{ type: "seat-claimed", seatIndex: 1, displayName: "Ana" }]);
    expect(c.data).toEqual({ kind: "claimSeat", seatIndex: 1 });
  });

  it("R3: a seat may claim only its own seat", () => {
    const room = new Room(scenarioWith());
    expectRejected(
      room.send({ type: "claimSeat", seatIndex: 1, displayName: "Bo" }, seat(0)),
      "forbidden",
      /R3/,
    );
    const own = room.ok({ type: "claimSeat", seatIndex: 0, displayName: "Bo" }, seat(0));
    expect(own.events).toHaveLength(1);
  });

  it("R6: a claimed seat cannot be claimed again by join code; its own key re-claims with no event", () => {
    const room = new Room(scenarioWith());
    room.ok({ type: "claimSeat", seatIndex: 0, displayName: "Ana" }, guest);
    expectRejected(
      room.send({ type: "claimSeat", seatIndex: 0, displayName: "Eve" }, guest),
      "conflict",
      /R6.*already taken/,
    );
    const again = room.ok({ type: "claimSeat", seatIndex: 0, displayName: "Ana" }, seat(0));
    expect(again.events).toEqual([]);
    expect(again.data).toEqual({ kind: "claimSeat", seatIndex: 0 });
  });

  it("R6: computer seats and missing seats cannot be claimed", () => {
    const room = new Room(scenarioWith({ computer: { "Corner Ovens": { kind: "equilibrium" } } }));
    expectRejected(
      room.send({ type: "claimSeat", seatIndex: 1, displayName: "Ana" }, guest),
      "conflict",
      /computer/,
    );
    expectRejected(
      room.send({ type: "claimSeat", seatIndex: 9, displayName: "Ana" }, guest),
      "not-found",
      /seatIndex/,
    );
  });

  it("R6: a retired seat cannot be claimed", () => {
    const room = new Room(scenarioWith());
    room.ok({ type: "applyShock", changes: [{ target: "retire-rival", index: 2 }] }, facilitator);
    expectRejected(
      room.send({ type: "claimSeat", seatIndex: 2, displayName: "Ana" }, guest),
      "conflict",
      /retired/,
    );
  });

  it("R7: a seat cannot seal for another seat (the move is always the sender's own)", () => {
    const room = new Room(scenarioWith());
    room.ok({ type: "openRound" }, facilitator);
    const d = room.ok({ type: "sealMove", clientMoveId: "a", effort: 5 }, seat(1));
    expect(d.events[0]).toMatchObject({ seatIndex: 1 });
    // A seat actor without a seat index is a wiring bug on the server side: refused.
    const noSeat = room.send({ type: "sealMove", clientMoveId: "b", effort: 5 }, { role: "seat" });
    expectRejected(noSeat, "forbidden", /R7/);
  });

  it("R25: issueLinks(seat or big screen) is accepted with no event, in every live status", () => {
    const room = new Room(scenarioWith({ computer: { "Corner Ovens": { kind: "equilibrium" } } }));
    const spectatorLink = room.ok({ type: "issueLinks" }, facilitator);
    expect(spectatorLink.events).toEqual([]);
    expect(spectatorLink.data).toEqual({ kind: "issueLinks", seatIndex: null });
    for (const seatIndex of [0, 1]) {
      // seat 1 is computer-played: a link for a person to take it over later
      const d = room.ok({ type: "issueLinks", seatIndex }, facilitator);
      expect(d.events).toEqual([]);
      expect(d.data).toEqual({ kind: "issueLinks", seatIndex });
    }
    room.ok({ type: "openRound" }, facilitator);
    room.ok({ type: "pause" }, facilitator);
    // seat 0 has not sealed yet: its link may be reissued while the round is open and paused
    expect(room.ok({ type: "issueLinks", seatIndex: 0 }, facilitator).events).toEqual([]);
    expect(room.log.map((e) => e.type)).not.toContain("seat-claimed");
  });

  it("R25: no new link for a seat with a sealed move in the open round (computer seats seal at open)", () => {
    const room = new Room(scenarioWith({ computer: { "Corner Ovens": { kind: "equilibrium" } } }));
    room.ok({ type: "openRound" }, facilitator);
    room.ok({ type: "sealMove", clientMoveId: "a", effort: 5 }, seat(0));
    for (const seatIndex of [0, 1]) {
      expectRejected(
        room.send({ type: "issueLinks", seatIndex }, facilitator),
        "wrong-state",
        /R25.*sealed/,
      );
    }
    room.ok({ type: "closeRound" }, facilitator);
    expect(room.ok({ type: "issueLinks", seatIndex: 0 }, facilitator).events).toEqual([]);
  });

  it("R13: a seat seals at most LIMITS.movesPerSeatPerRound moves in a round; the last stands", () => {
    const room = new Room(scenarioWith());
    room.ok({ type: "openRound" }, facilitator);
    for (let i = 0; i < LIMITS.movesPerSeatPerRound; i++) {
      room.ok({ type: "sealMove", clientMoveId: `m${i}`, effort: i % 2 ? 5 : 6 }, seat(0));
    }
    expectRejected(
      room.send({ type: "sealMove", clientMoveId: "one-too-many", effort: 7 }, seat(0)),
      "rate-limited",
      /R13/,
    );
  });

  it("R25: issueLinks for a missing or retired seat is refused", () => {
    const room = new Room(scenarioWith());
    expectRejected(
      room.send({ type: "issueLinks", seatIndex: 9 }, facilitator),
      "not-found",
      /seatIndex/,
    );
    room.ok({ type: "applyShock", changes: [{ target: "retire-rival", index: 2 }] }, facilitator);
    expectRejected(
      room.send({ type: "issueLinks", seatIndex: 2 }, facilitator),
      "wrong-state",
      /R25.*retired/,
    );
  });

  it("R4: nothing changes after the session ended", () => {
    const room = new Room(scenarioWith());
    room.ok({ type: "endSession" }, facilitator);
    for (const command of facilitatorCommands) {
      expectRejected(room.send(command, facilitator), "wrong-state", /R4/);
    }
    expectRejected(
      room.send({ type: "claimSeat", seatIndex: 0, displayName: "A" }, guest),
      "wrong-state",
      /R4/,
    );
  });
});
