import { describe, expect, it } from "vitest";
import { roleViewSchema } from "@contend/protocol";
import { initialState, viewFor } from "../src/index";
import { facilitator, guest, Room, scenarioWith } from "./harness";

const secret = 17; // an effort no other number in these views happens to equal

function openWithSecret() {
  const room = new Room(
    scenarioWith({ computer: { "Corner Ovens": { kind: "fixed", effort: 9 } } }),
  );
  room.ok({ type: "claimSeat", seatIndex: 0, displayName: "Ana" }, guest);
  room.ok({ type: "openRound" }, facilitator);
  room.ok(
    { type: "sealMove", clientMoveId: "ana-1", effort: secret },
    { role: "seat", seatIndex: 0 },
  );
  return room;
}

describe("viewFor", () => {
  it("R23: no view but the owner's shows a sealed effort before resolution", () => {
    const room = openWithSecret();
    for (const viewer of [
      { role: "facilitator" as const },
      { role: "spectator" as const },
      { role: "guest" as const },
      { role: "seat" as const, seatIndex: 1 },
      { role: "seat" as const, seatIndex: 2 },
    ]) {
      const text = JSON.stringify(viewFor(room.state, viewer));
      expect(text, viewer.role).not.toContain("ana-1");
      expect(text, viewer.role).not.toMatch(new RegExp(`[:\\[,]${secret}[,\\]}]`));
      const you = viewFor(room.state, viewer).you;
      // a seat's own view holds only its own move (seat 1 is the computer, which sealed 9)
      if (you) expect(you.sealedEffort).toBe(you.seatIndex === 1 ? 9 : null);
    }
    const own = viewFor(room.state, { role: "seat", seatIndex: 0 });
    expect(own.you).toEqual({
      seatIndex: 0,
      sealedEffort: secret,
      sealedSpend: secret, // cost 1
      clientMoveId: "ana-1",
    });
  });

  it("R23: everyone sees which seats have sealed, never the amounts", () => {
    const room = openWithSecret();
    const v = viewFor(room.state, { role: "spectator" });
    expect(v.seats.map((s) => s.sealed)).toEqual([true, true, false]);
    expect(v.status).toBe("open");
    expect(v.round).toBe(1);
    expect(v.roundSeats).toEqual([0, 1, 2]);
    expect(v.rounds).toEqual([]);
  });

  it("R23: policies show to the facilitator only", () => {
    const room = openWithSecret();
    expect(viewFor(room.state, { role: "facilitator" }).seats[1]!.policy).toEqual({
      kind: "fixed",
      effort: 9,
    });
    for (const role of ["spectator", "guest"] as const) {
      expect(viewFor(room.state, { role }).seats[1]).not.toHaveProperty("policy");
      expect(viewFor(room.state, { role }).seats[1]!.kind).toBe("computer");
    }
  });

  it("viewFor(facilitator with a join code) shows it; no other role gets it", () => {
    const room = openWithSecret();
    const joinCode = "KIOSK7";
    expect(viewFor(room.state, { role: "facilitator", joinCode }).joinCode).toBe(joinCode);
    for (const viewer of [
      { role: "spectator" as const, joinCode },
      { role: "guest" as const, joinCode },
      { role: "seat" as const, seatIndex: 0, joinCode },
    ]) {
      expect(viewFor(room.state, viewer), viewer.role).not.toHaveProperty("joinCode");
    }
    expect(viewFor(room.state, { role: "facilitator" })).not.toHaveProperty("joinCode");
  });

  it("R23: after resolution every role sees every effort of the round", () => {
    const room = openWithSecret();
    room.ok({ type: "closeRound" }, facilitator);
    for (const role of ["spectator", "facilitator", "guest"] as const) {
      const v = viewFor(room.state, { role });
      expect(v.rounds[0]!.efforts).toEqual([secret, 9, 0]);
      expect(v.seats.every((s) => !s.sealed)).toBe(true);
    }
    expect(viewFor(room.state, { role: "seat", seatIndex: 0 }).you).toEqual({
      seatIndex: 0,
      sealedEffort: null,
      sealedSpend: null,
      clientMoveId: null,
    });
  });

  it("viewFor(every state of a session) matches the protocol's RoleView schema", () => {
    const room = openWithSecret();
    room.ok({ type: "pause" }, facilitator);
    const paused = viewFor(room.state, { role: "facilitator" });
    expect(paused.paused).toBe(true);
    expect(roleViewSchema.safeParse(paused).success).toBe(true);
    room.ok({ type: "resume" }, facilitator);
    room.ok({ type: "closeRound" }, facilitator);
    room.ok({ type: "endSession" }, facilitator);
    const ended = viewFor(room.state, { role: "seat", seatIndex: 0 });
    expect(ended).toMatchObject({
      status: "ended",
      endedReason: "facilitator",
      round: 1,
      roundsTotal: 5,
    });
    const r = roleViewSchema.safeParse(ended);
    expect(r.success, r.success ? "" : JSON.stringify(r.error.issues[0])).toBe(true);
  });

  it("viewFor(lobby) shows claims and display names", () => {
    const room = new Room(scenarioWith());
    room.ok({ type: "claimSeat", seatIndex: 2, displayName: "Cy" }, guest);
    const v = viewFor(room.state, { role: "guest" });
    expect(v.seats.map((s) => [s.claimed, s.displayName])).toEqual([
      [false, null],
      [false, null],
      [true, "Cy"],
    ]);
    expect(v).toMatchObject({ status: "lobby", round: 0, deadline: null, totals: [0, 0, 0] });
  });

  it("viewFor(empty state) throws: there is no session to show", () => {
    expect(() => viewFor(initialState(), { role: "spectator" })).toThrow(/no events/);
  });
});
