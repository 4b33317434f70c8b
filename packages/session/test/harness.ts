/**
 * A tiny in-memory stand-in for the server: decides, stamps (seq, at) and applies, and keeps
 * the log so tests can replay it. Demo data are invented (bakeries bidding for a kiosk lease).
 */
import { expect } from "vitest";
import { isFrontsSession, parseSessionScenario, sessionEventSchema } from "@contend/protocol";
import type {
  AnySessionScenario,
  EventBody,
  SessionEvent,
  SessionScenario,
} from "@contend/protocol";
import { apply, createSession, decide, fold } from "../src/index";
import type { Actor, Decision, EngineCommand, SessionState } from "../src/index";

export const kiosk = {
  title: "Station kiosk lease",
  prize: 100,
  csf: { kind: "ratio", decisiveness: 1 },
  currency: "$",
  rivals: [
    { name: "North Bakery", cost: 1 },
    { name: "Corner Ovens", cost: 2 },
    { name: "Rye & Crumb", cost: 1, budget: 30 },
  ],
};

export const facilitator: Actor = { role: "facilitator" };
export const system: Actor = { role: "system" };
export const seat = (seatIndex: number): Actor => ({ role: "seat", seatIndex });
export const guest: Actor = { role: "guest" };
export const spectator: Actor = { role: "spectator" };

export function scenarioWith(
  session: Record<string, unknown> = {},
  patch: Record<string, unknown> = {},
) {
  const r = parseSessionScenario({ ...structuredClone(kiosk), ...patch, session });
  if (!r.ok) throw new Error(`fixture invalid: ${r.message}`);
  if (isFrontsSession(r.value)) throw new Error("fixture is a fronts session");
  return r.value as SessionScenario;
}

export class Room {
  state: SessionState;
  log: SessionEvent[] = [];
  now = 1_000_000;

  constructor(scenario: AnySessionScenario, seed = 7) {
    this.state = fold([]);
    this.commit([createSession({ sessionId: "sess-1", scenario, seed })]);
  }

  private commit(bodies: readonly EventBody[]) {
    for (const body of bodies) {
      const event = { ...body, seq: this.log.length + 1, at: this.now } as SessionEvent;
      expectSchemaKeepsAsIs(event);
      this.log.push(event);
      this.state = apply(this.state, event);
    }
  }

  /** decide + commit; returns the decision */
  send(command: EngineCommand, actor: Actor): Decision {
    const d = decide(this.state, command, { now: this.now, actor });
    if (d.ok) this.commit(d.events);
    return d;
  }

  /** like send, but the command must succeed */
  ok(command: EngineCommand, actor: Actor): Decision & { ok: true } {
    const d = this.send(command, actor);
    if (!d.ok) throw new Error(`expected ${command.type} to succeed: ${d.code} ${d.message}`);
    return d;
  }

  seal(seatIndex: number, effort: number, clientMoveId = `m-${seatIndex}-${effort}`) {
    return this.send({ type: "sealMove", clientMoveId, effort }, seat(seatIndex));
  }

  lastEvent(): SessionEvent {
    return this.log[this.log.length - 1]!;
  }
}

/** The rejection must carry this code and mention the rule (or field) in its message. */
export function expectRejected(d: Decision, code: string, mention: RegExp | string) {
  expect(d.ok).toBe(false);
  if (d.ok) return;
  expect(d.code).toBe(code);
  expect(d.message).toMatch(mention);
}

/**
 * The protocol's event schema gives this event back unchanged after a JSON round trip (no
 * field dropped, defaulted or transformed), so the server may fold its own appended events
 * without parsing them again (apps/server/src/live/batch.ts) and still fold exactly what a
 * read of the log gives back. Every event a Room commits is checked.
 */
export function expectSchemaKeepsAsIs(event: SessionEvent) {
  const stored = JSON.parse(JSON.stringify(event)) as unknown;
  const r = sessionEventSchema.safeParse(stored);
  expect(
    r.success,
    `${event.seq} ${event.type}: ${r.success ? "" : JSON.stringify(r.error.issues[0])}`,
  ).toBe(true);
  if (r.success) expect(r.data, `${event.seq} ${event.type}`).toStrictEqual(stored);
}

/** Every event the engine produced is a valid protocol event. */
export function expectLogValid(log: readonly SessionEvent[]) {
  for (const e of log) {
    const r = sessionEventSchema.safeParse(e);
    expect(
      r.success,
      `${e.seq} ${e.type}: ${r.success ? "" : JSON.stringify(r.error.issues[0])}`,
    ).toBe(true);
  }
}
