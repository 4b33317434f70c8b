/**
 * One batch of a session's commands, decided and committed: each command is decided on the
 * state the ones before it left, all their events go to the database in one append (the seq
 * check is the authority), and each caller gets the result it would have got alone. The hub
 * (hub.ts) decides which commands form a batch and when it runs.
 */
import { jsonText } from "@contend/db";
import type { AppendEffects, Database, KeyInput, NewEvent } from "@contend/db";
import type { ErrorCode, EventBody, SessionEvent } from "@contend/protocol";
import { allSealed, apply, decide } from "@contend/session";
import type { Actor, DecideData, EngineCommand, SessionState } from "@contend/session";
import type { Clock, TimerHandle } from "../clock";
import type { Logger } from "../logger";

export interface LiveSession {
  readonly id: string;
  state: SessionState;
  /** seq of every sealed move of the open round, by "seat:clientMoveId" (for repeated acks) */
  moveSeqs: Map<string, number>;
  timer: TimerHandle | null;
}

export type ExecuteResult =
  | { ok: true; seq: number; data: DecideData; events: SessionEvent[] }
  | { ok: false; code: ErrorCode; message: string; path?: string };

export interface ExecuteOptions {
  /** keys stored in the same transaction as the events (e.g. the key of a claimed seat) */
  addKeys?: KeyInput[];
}

export interface Request {
  command: EngineCommand;
  actor: Actor;
  options: ExecuteOptions;
}

/**
 * Appends tried per batch before a conflict is reported (each after reading what the other
 * writer committed). One process alone never conflicts; two or more sealing into one session
 * at once do, and a seal refused for that would leave its round waiting.
 */
const MAX_ATTEMPTS = 8;

/** Most commands one append carries. */
const MAX_BATCH = 64;

function batchable(r: Request): boolean {
  return !r.options.addKeys?.length && r.command.type !== "claimSeat";
}

/** The first waiting command and, if it is plain, the plain ones right behind it. */
export function takeBatch<T extends Request>(waiting: T[]): T[] {
  let n = 1;
  if (batchable(waiting[0]!)) {
    while (n < waiting.length && n < MAX_BATCH && batchable(waiting[n]!)) n++;
  }
  return waiting.splice(0, n);
}

export const SYSTEM: Actor = { role: "system" };
const ALL_SEALED: EngineCommand = { type: "closeRound", reason: "all-sealed" };

/** Folds events into the live session and remembers the seq of each sealed move. */
export function applyAll(live: LiveSession, events: readonly SessionEvent[]) {
  for (const event of events) live.state = apply(live.state, event);
  trackMoves(live, events);
}

function trackMoves(live: LiveSession, events: readonly SessionEvent[]) {
  for (const event of events) {
    if (event.type === "round-opened") live.moveSeqs.clear();
    if (event.type === "move-sealed") {
      live.moveSeqs.set(`${event.seatIndex}:${event.clientMoveId}`, event.seq);
    }
  }
}

/**
 * An appended event as a read of its row returns it, and the row that stores it: the payload
 * goes through its JSON text once (the text the column keeps, exactly the digits
 * JSON.stringify writes; undefined fields vanish; NaN or Infinity throws as the write would)
 * and `at` becomes whole ms. A read also checks each row with the protocol's event schema
 * (`eventFromRow`); that check is left out here because the schema gives back every event the
 * engine writes unchanged, which the session tests assert for every event they produce
 * (packages/session/test/harness.ts), so the state folded here is the one a restart folds.
 */
function stored(event: SessionEvent): { event: SessionEvent; row: NewEvent } {
  const { seq, at, ...body } = event;
  const payloadJson = jsonText(body);
  const payload = JSON.parse(payloadJson) as EventBody;
  return {
    event: { ...payload, seq, at: new Date(at).getTime() },
    row: { type: event.type, at, payload: body, payloadJson },
  };
}

export interface BatchDeps {
  db: Database;
  clock: Clock;
  logger: Logger;
  /**
   * another writer moved the log on: fold what it wrote (through the session's queue); true
   * when there was something to fold
   */
  catchUp(live: LiveSession): Promise<boolean>;
  /** other processes may write this session's log (PostgreSQL), so this one may be behind */
  shared: boolean;
}

/**
 * Decides the requests one after another, each on the state the ones before it left, and
 * commits all their events in one append (with an all-sealed close right behind the seal
 * that caused it). Each request gets the result it would have got alone; a conflict with
 * another writer reloads the log and decides the whole batch again, up to MAX_ATTEMPTS in all
 * (test/seq-conflicts.test.ts). When other processes share the log and a command is refused,
 * the log is read once before the refusal stands: this process may not have heard yet of a
 * commit that makes the command valid (another process opened the round a moment ago), and
 * a refusal must never come from a state older than the log (test/behind.test.ts).
 */
export async function commitBatch(
  deps: BatchDeps,
  live: LiveSession,
  requests: Request[],
): Promise<ExecuteResult[]> {
  const { db, clock, logger } = deps;
  let reread = !deps.shared;
  for (let attempt = 0; ; attempt++) {
    const now = clock.now();
    const base = live.state.seq;
    const at = Math.max(now, live.state.status === "empty" ? 0 : live.state.at);
    // Each event in the form a read of its row gives back (see stored), so the state
    // folded here is exactly what a restart or a replay folds from the same rows, and it
    // becomes the live state as it is once the append has committed.
    const stamped: SessionEvent[] = [];
    const rows: NewEvent[] = [];
    let trial = live.state;
    const add = (events: readonly EventBody[]) => {
      for (const e of events) {
        const seq = base + stamped.length + 1;
        const { event, row } = stored({ ...e, seq, at });
        stamped.push(event);
        rows.push(row);
        trial = apply(trial, event);
      }
    };
    const outcomes = requests.map((req) => {
      const decision = decide(trial, req.command, { now, actor: req.actor });
      if (!decision.ok) return decision;
      const from = stamped.length;
      add(decision.events);
      // When the last active seat has sealed, the round closes in the same append: one
      // commit, one push, and no command can slip in between the last seal and the close.
      if (decision.events.length > 0 && allSealed(trial)) {
        const closing = decide(trial, ALL_SEALED, { now, actor: SYSTEM });
        if (closing.ok) add(closing.events);
        else logger.warn("all-sealed close failed", { sessionId: live.id, code: closing.code });
      }
      return { data: decision.data, from, to: stamped.length };
    });
    const settle = (events: SessionEvent[]): ExecuteResult[] =>
      outcomes.map((o) =>
        "ok" in o
          ? o
          : {
              ok: true,
              seq: base + o.to,
              data: o.data,
              events: events.slice(o.from, o.to),
            },
      );
    if (!reread && outcomes.some((o) => "ok" in o)) {
      reread = true;
      if (await deps.catchUp(live)) continue;
    }
    if (stamped.length === 0) return settle([]);
    const effects = effectsOf(
      stamped,
      requests.flatMap((r) => r.options.addKeys ?? []),
    );
    if (trial.status !== live.state.status && trial.status !== "empty")
      effects.status = trial.status;
    const result = await db.events.append(live.id, base, rows, effects);
    if (result.ok) {
      if (result.seqs.some((seq, i) => seq !== stamped[i]?.seq)) {
        throw new Error("the database stored these events under other seqs than asked");
      }
      live.state = trial;
      trackMoves(live, stamped);
      return settle(stamped);
    }
    const failed = (code: ErrorCode, message: string): ExecuteResult[] =>
      requests.map(() => ({ ok: false, code, message }));
    if (result.code === "not-found") return failed("not-found", "no such session");
    if (result.code === "seat-claimed") {
      await deps.catchUp(live);
      return failed("conflict", `seat ${result.seatIndex} is already taken`);
    }
    // conflict: someone else appended first; reload and decide again. Every conflict means
    // another writer committed, so the log moves on each time; several processes sealing into
    // one session can beat the same writer a few times in a row.
    await deps.catchUp(live);
    if (attempt >= MAX_ATTEMPTS - 1)
      return failed("conflict", "the session changed meanwhile; try again");
  }
}

/** Seat rows and keys that must change in the same transaction as the events. */
function effectsOf(events: readonly EventBody[], addKeys: KeyInput[]): AppendEffects {
  const effects: AppendEffects = {};
  const claims = events.flatMap((e) =>
    e.type === "seat-claimed" ? [{ seatIndex: e.seatIndex, displayName: e.displayName }] : [],
  );
  if (claims.length > 0) effects.claimSeats = claims;
  if (addKeys.length > 0) effects.addKeys = addKeys;
  return effects;
}
