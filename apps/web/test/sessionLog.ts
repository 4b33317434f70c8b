/** A real log produced by the session engine (invented bakeries), for the viewer tests. */
import { parseSessionScenario } from "@contend/protocol";
import type { EventBody, SessionEvent } from "@contend/protocol";
import { apply, createSession, decide, fold } from "@contend/session";
import type { Actor, EngineCommand, SessionState } from "@contend/session";

export function playLog(): SessionEvent[] {
  const parsed = parseSessionScenario({
    title: "Kiosk lease drill",
    prize: 100,
    currency: "$",
    csf: { kind: "ratio", decisiveness: 1 },
    rivals: [
      { name: "North Bakery", cost: 5 },
      { name: "Corner Ovens", cost: 2 },
    ],
    session: { rounds: 2, computer: { "Corner Ovens": { kind: "equilibrium" } } },
  });
  if (!parsed.ok) throw new Error(parsed.message);
  const log: SessionEvent[] = [];
  let state: SessionState = fold([]);
  let now = 1_000;
  const commit = (bodies: readonly EventBody[]) => {
    for (const b of bodies) {
      const e = { ...b, seq: log.length + 1, at: now } as SessionEvent;
      log.push(e);
      state = apply(state, e);
    }
  };
  const send = (cmd: EngineCommand, actor: Actor) => {
    const d = decide(state, cmd, { now, actor });
    if (!d.ok) throw new Error(`${cmd.type}: ${d.message}`);
    commit(d.events);
  };
  commit([createSession({ sessionId: "s-1", scenario: parsed.value, seed: 11 })]);
  send({ type: "openRound", durationSeconds: null }, { role: "facilitator" });
  now += 1_000;
  // a spend of 15 at cost 5: effort 3
  send({ type: "sealMove", clientMoveId: "a", spend: 15 }, { role: "seat", seatIndex: 0 });
  send({ type: "closeRound" }, { role: "facilitator" });
  return log;
}

/**
 * A finished session of the same drill played over several rounds by the engine: seat 0 seals
 * `spends[k]` in round k (the computer plays the equilibrium), an optional prize shock before
 * a round and an optional facilitator's note on a round.
 */
export function playSession(opts: {
  id: string;
  title: string;
  spends: readonly number[];
  shock?: { beforeRound: number; prize: number };
  note?: { round: number; text: string };
}): SessionEvent[] {
  const parsed = parseSessionScenario({
    title: opts.title,
    prize: 100,
    currency: "$",
    csf: { kind: "ratio", decisiveness: 1 },
    rivals: [
      { name: "North Bakery", cost: 5 },
      { name: "Corner Ovens", cost: 2 },
    ],
    session: {
      rounds: opts.spends.length,
      computer: { "Corner Ovens": { kind: "equilibrium" } },
    },
  });
  if (!parsed.ok) throw new Error(parsed.message);
  const log: SessionEvent[] = [];
  let state: SessionState = fold([]);
  let now = 1_000;
  const send = (cmd: EngineCommand, actor: Actor) => {
    const d = decide(state, cmd, { now, actor });
    if (!d.ok) throw new Error(`${cmd.type}: ${d.message}`);
    for (const b of d.events) {
      const e = { ...b, seq: log.length + 1, at: now } as SessionEvent;
      log.push(e);
      state = apply(state, e);
    }
  };
  const fac: Actor = { role: "facilitator" };
  const first = createSession({ sessionId: opts.id, scenario: parsed.value, seed: 11 });
  log.push({ ...first, seq: 1, at: now } as SessionEvent);
  state = apply(state, log[0]!);
  opts.spends.forEach((spend, k) => {
    const round = k + 1;
    if (opts.shock?.beforeRound === round)
      send({ type: "applyShock", changes: [{ target: "prize", value: opts.shock.prize }] }, fac);
    send({ type: "openRound", durationSeconds: null }, fac);
    now += 1_000;
    send({ type: "sealMove", clientMoveId: `m${round}`, spend }, { role: "seat", seatIndex: 0 });
    send({ type: "closeRound" }, fac);
    if (opts.note?.round === round) send({ type: "noteRound", round, text: opts.note.text }, fac);
  });
  return log;
}
