import { describe, expect, it } from "vitest";
import { viewFor } from "../src/index";
import { expectRejected, facilitator, Room, scenarioWith, seat } from "./harness";

describe("R27: the facilitator's note on a played round", () => {
  it("is stored on the round for every role, replaced or removed, and taken after the end", () => {
    const room = new Room(scenarioWith({ rounds: 1, missingMove: "zero", computer: {} }));
    expectRejected(
      room.send({ type: "noteRound", round: 1, text: "too early" }, facilitator),
      "not-found",
      /R27/,
    );
    room.ok({ type: "openRound" }, facilitator);
    room.ok({ type: "closeRound" }, facilitator);
    expect(room.state.status).toBe("ended");
    room.ok(
      { type: "noteRound", round: 1, text: "Corner Ovens read the budget cap wrong" },
      facilitator,
    );
    expect(viewFor(room.state, { role: "spectator" }).rounds[0]!.note).toBe(
      "Corner Ovens read the budget cap wrong",
    );
    room.ok({ type: "noteRound", round: 1, text: "" }, facilitator);
    expect(room.state.status !== "empty" && room.state.rounds[0]).not.toHaveProperty("note");
    expectRejected(
      room.send({ type: "noteRound", round: 1, text: "mine" }, seat(0)),
      "forbidden",
      /noteRound|facilitator/,
    );
  });
});
