import { describe, expect, it } from "vitest";
import { apply, fold, initialState, viewFor } from "../src/index";
import type { SessionEvent } from "@contend/protocol";
import {
  expectLogValid,
  expectSchemaKeepsAsIs,
  facilitator,
  guest,
  Room,
  scenarioWith,
  seat,
  system,
} from "./harness";

/** Three rounds, one computer seat, a shock between rounds 1 and 2, winner mode with a clock. */
function workshop(seed: number) {
  const room = new Room(
    scenarioWith({
      outcome: "winner",
      rounds: 3,
      clockSeconds: 120,
      missingMove: "repeat",
      computer: { "Corner Ovens": { kind: "fictitious-play" } },
    }),
    seed,
  );
  room.ok({ type: "claimSeat", seatIndex: 0, displayName: "Ana" }, guest);
  room.ok({ type: "claimSeat", seatIndex: 2, displayName: "Cy" }, guest);

  room.ok({ type: "openRound" }, facilitator);
  room.seal(0, 30);
  room.seal(2, 20);
  room.now += 40_000;
  room.ok({ type: "closeRound", reason: "all-sealed" }, system);

  room.ok(
    {
      type: "applyShock",
      changes: [
        { target: "rival", index: 0, field: "cost", value: 1.5 },
        {
          target: "add-rival",
          rival: { name: "Dough Bros", cost: 1 },
          policy: { kind: "equilibrium" },
        },
      ],
    },
    facilitator,
  );

  room.now += 10_000;
  room.ok({ type: "openRound" }, facilitator);
  room.seal(0, 18);
  room.now += 120_000;
  room.ok({ type: "closeRound", reason: "clock" }, system); // Cy missed: repeats 20

  room.now += 5_000;
  room.ok({ type: "openRound", durationSeconds: null }, facilitator);
  room.seal(0, 15);
  room.seal(2, 14, "cy-a");
  room.seal(2, 16, "cy-b");
  room.ok({ type: "closeRound" }, facilitator);
  return room;
}

describe("a three-round session with a shock and computer seats", () => {
  const room = workshop(2024);
  const rounds = room.state.status === "ended" ? room.state.rounds : [];

  it("ends by itself after round 3 with three resolved rounds", () => {
    expect(room.state).toMatchObject({ status: "ended", endedReason: "rounds-complete" });
    expect(rounds.map((r) => r.reason)).toEqual(["all-sealed", "clock", "facilitator"]);
  });

  it("plays the added rival from round 2 and repeats a missed move", () => {
    expect(rounds[0]!.seatIndices).toEqual([0, 1, 2]);
    expect(rounds[1]!.seatIndices).toEqual([0, 1, 2, 3]);
    expect(rounds[1]!.efforts[2]).toBe(20);
    expect(rounds[1]!.defaulted).toEqual([false, false, true, false]);
    expect(rounds[2]!.efforts[2]).toBe(16);
    expect(rounds[1]!.scenario.rivals[0]!.cost).toBe(1.5);
  });

  it("keeps totals equal to the sum of realised payoffs, winners drawn each round", () => {
    const last = rounds[2]!;
    last.totals.forEach((t, i) => {
      const sum = rounds.reduce((s, r) => s + (r.payoffs[i] ?? 0), 0);
      expect(t).toBeCloseTo(sum, 9);
    });
    for (const r of rounds) {
      expect(r.winner).not.toBeNull();
      expect(r.seatIndices).toContain(r.winner);
      expect(r.drawSeed).not.toBeNull();
    }
  });

  it("writes only events the protocol accepts, numbered from 1", () => {
    expectLogValid(room.log);
    expect(room.log.map((e) => e.seq)).toEqual(room.log.map((_, i) => i + 1));
  });

  it("the check that the schema keeps each event as is fails on a field the schema would drop", () => {
    const resolved = room.log.find((e) => e.type === "round-resolved")!;
    expect(() => expectSchemaKeepsAsIs(resolved)).not.toThrow();
    expect(() => expectSchemaKeepsAsIs({ ...resolved, unknownField: 1 } as SessionEvent)).toThrow();
  });

  it("R24: fold(log) rebuilds the same state, also after a JSON round trip", () => {
    expect(fold(room.log)).toEqual(room.state);
    const stored = JSON.parse(JSON.stringify(room.log)) as SessionEvent[];
    expect(fold(stored)).toEqual(room.state);
  });

  it("R24: the same seed and commands give the same log (computer moves and winners)", () => {
    const again = workshop(2024);
    expect(again.log).toEqual(room.log);
    const other = workshop(2025);
    const draws = (r: Room) =>
      r.log.flatMap((e) => (e.type === "round-resolved" ? [e.drawSeed] : []));
    expect(draws(other)).not.toEqual(draws(room));
  });

  it("R24: folding a prefix stops the replay at that event", () => {
    const upTo = room.log.findIndex((e) => e.type === "shock-applied");
    const mid = fold(room.log.slice(0, upTo + 1));
    expect(mid.status).toBe("review");
    const v = viewFor(mid, { role: "spectator" });
    expect(v.rounds).toHaveLength(1);
    expect(v.seats).toHaveLength(4);
    expect(v.shocks).toHaveLength(1);
  });
});

describe("apply", () => {
  it("apply(an event that cannot follow the state) throws: the log is corrupt", () => {
    const room = new Room(scenarioWith());
    const bogus = {
      seq: 2,
      at: 0,
      type: "move-sealed",
      round: 1,
      seatIndex: 0,
      effort: 1,
      clientMoveId: "x",
      by: "seat",
    } as const;
    expect(() => apply(room.state, bogus)).toThrow(/cannot follow/);
    expect(() =>
      apply(initialState(), { seq: 1, at: 0, type: "paused", remainingMs: null }),
    ).toThrow(/cannot follow/);
    expect(() => apply(room.state, room.log[0]!)).toThrow(/cannot follow/);
  });

  it("apply(event) records seq and at of the last event", () => {
    const room = new Room(scenarioWith());
    room.now = 5_555;
    room.ok({ type: "claimSeat", seatIndex: 1, displayName: "Bo" }, seat(1));
    expect(room.state).toMatchObject({ seq: 2, at: 5_555 });
  });
});

describe("stored events are JSON-safe for every contest form", () => {
  const forms = [
    { kind: "ratio", decisiveness: 0.5 },
    { kind: "ratio", decisiveness: 3 },
    { kind: "logit", scale: 0.1 },
    { kind: "allpay" },
  ];
  for (const csf of forms) {
    it(`a round under ${JSON.stringify(csf)} survives a JSON round trip and the schema`, () => {
      const room = new Room(
        scenarioWith({ computer: { "Corner Ovens": { kind: "equilibrium" } } }, { csf }),
      );
      room.ok({ type: "openRound" }, facilitator);
      room.seal(0, 12);
      room.ok({ type: "closeRound" }, facilitator);
      const stored = JSON.parse(JSON.stringify(room.log)) as SessionEvent[];
      expectLogValid(stored);
      expect(fold(stored)).toEqual(room.state);
      // Three rivals at r = 3 have no pure equilibrium: the round's mixed solve (fictitious
      // play) takes about half a second of CPU, several seconds on a loaded two-core machine.
    }, 60_000);
  }
});
