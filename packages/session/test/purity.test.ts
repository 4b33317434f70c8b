import { describe, expect, it } from "vitest";
import { apply, decide } from "../src/index";
import type { EngineCommand, SessionState } from "../src/index";
import { facilitator, Room, scenarioWith, seat } from "./harness";

function deepFreeze<T>(x: T): T {
  if (typeof x === "object" && x !== null && !Object.isFrozen(x)) {
    Object.freeze(x);
    for (const v of Object.values(x)) deepFreeze(v);
  }
  return x;
}

describe("decide and apply are pure", () => {
  it("decide(frozen state, any command) never mutates the state", () => {
    const room = new Room(scenarioWith({ computer: { "Corner Ovens": { kind: "overspender" } } }));
    room.ok({ type: "openRound" }, facilitator);
    room.seal(0, 10);
    const frozen: SessionState = deepFreeze(structuredClone(room.state));
    const before = JSON.stringify(frozen);
    const commands: [EngineCommand, Parameters<typeof decide>[2]["actor"]][] = [
      [{ type: "sealMove", clientMoveId: "n", effort: 12 }, seat(0)],
      [{ type: "sealMove", clientMoveId: "n", effort: 3 }, seat(2)],
      [{ type: "closeRound" }, facilitator],
      [{ type: "pause" }, facilitator],
      [{ type: "endSession" }, facilitator],
    ];
    for (const [command, actor] of commands) {
      const d = decide(frozen, command, { now: room.now, actor });
      expect(d.ok).toBe(true);
      if (d.ok) {
        let s = frozen;
        d.events.forEach((e, i) => {
          s = apply(s, { ...e, seq: frozen.seq + i + 1, at: room.now } as never);
        });
      }
    }
    expect(JSON.stringify(frozen)).toBe(before);
  });

  it("decide(sealMove with an effort above 1e12) is refused even without the parser", () => {
    const room = new Room(scenarioWith());
    room.ok({ type: "openRound" }, facilitator);
    const d = room.send({ type: "sealMove", clientMoveId: "big", effort: 2e12 }, seat(0));
    expect(d).toMatchObject({ ok: false, code: "bad-request", path: "effort" });
  });

  it("R19: the same session seed gives the same noisy computer move; another seed another move", () => {
    // North Bakery is active in equilibrium (Corner Ovens spends 0 there, and so would any multiple)
    const spec = { "North Bakery": { kind: "overspender" as const, noise: 0.5 } };
    const move = (seed: number) => {
      const room = new Room(scenarioWith({ effortStep: 0.01, computer: spec }), seed);
      const d = room.ok({ type: "openRound" }, facilitator);
      const m = d.events.find((e) => e.type === "move-sealed");
      return m && m.type === "move-sealed" ? m.effort : NaN;
    };
    expect(move(1)).toBe(move(1));
    const efforts = new Set([1, 2, 3, 4, 5].map(move));
    expect(efforts.size).toBeGreaterThan(1);
  });
});
