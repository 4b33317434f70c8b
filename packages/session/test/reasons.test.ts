import { describe, expect, it } from "vitest";
import { viewFor } from "../src/index";
import { facilitator, Room, scenarioWith, seat } from "./harness";

describe("R26: a seat's reason travels with its move", () => {
  it("is in its owner's view only while open, and revealed per seat with the round", () => {
    const room = new Room(scenarioWith({ rounds: 2, missingMove: "zero", computer: {} }));
    room.ok({ type: "openRound" }, facilitator);
    room.ok(
      { type: "sealMove", clientMoveId: "a", spend: 10, reason: "match the leader" },
      seat(0),
    );
    room.ok({ type: "sealMove", clientMoveId: "b", spend: 8 }, seat(1));
    expect(viewFor(room.state, { role: "seat", seatIndex: 0 }).you?.sealedReason).toBe(
      "match the leader",
    );
    for (const viewer of [
      { role: "seat", seatIndex: 1 },
      { role: "facilitator" },
      { role: "spectator" },
    ] as const) {
      expect(JSON.stringify(viewFor(room.state, viewer))).not.toContain("match the leader");
    }
    room.ok({ type: "closeRound" }, facilitator);
    const resolved = room.lastEvent();
    expect(resolved.type === "round-resolved" && resolved.moveReasons).toEqual([
      "match the leader",
      null,
      null,
    ]);
    expect(viewFor(room.state, { role: "spectator" }).rounds[0]!.moveReasons).toEqual([
      "match the leader",
      null,
      null,
    ]);
  });

  it("a replacing move without a reason drops the old one; rounds without reasons keep the old shape", () => {
    const room = new Room(scenarioWith({ rounds: 2, missingMove: "zero", computer: {} }));
    room.ok({ type: "openRound" }, facilitator);
    room.ok({ type: "sealMove", clientMoveId: "a", spend: 10, reason: "first thought" }, seat(0));
    room.ok({ type: "sealMove", clientMoveId: "a2", spend: 12 }, seat(0));
    expect(viewFor(room.state, { role: "seat", seatIndex: 0 }).you?.sealedReason).toBeUndefined();
    room.ok({ type: "closeRound" }, facilitator);
    expect(room.lastEvent()).not.toHaveProperty("moveReasons");
  });
});
