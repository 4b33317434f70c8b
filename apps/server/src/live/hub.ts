/**
 * The live sessions of this process: each session's folded state, its round clock and the
 * one queue its commands pass through. The pipeline for every batch of commands (those of
 * one session that arrived while its previous batch was committing) is
 *   decide each in turn (pure engine) -> one append to the database (the seq check is the
 *   authority) -> apply -> arm the clock -> notify (views are pushed by the caller's listener).
 * Nothing is acknowledged before the database has committed it.
 */
import { eventFromRow } from "@contend/db";
import type { AppendEffects, Database, KeyInput, NewEvent } from "@contend/db";
import type { ErrorCode, EventBody, SessionEvent } from "@contend/protocol";
import { allSealed, apply, deadline, decide, initialState } from "@contend/session";
import type { Actor, DecideData, EngineCommand, SessionState } from "@contend/session";
import type { Clock, TimerHandle } from "../clock";
import type { Logger } from "../logger";
import { createSerialQueue } from "../serialQueue";

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

interface Request {
  command: EngineCommand;
  actor: Actor;
  options: ExecuteOptions;
}

interface Pending extends Request {
  resolve: (result: ExecuteResult) => void;
  reject: (error: unknown) => void;
}

/** Most commands one append carries. */
const MAX_BATCH = 64;

function batchable(r: Request): boolean {
  return !r.options.addKeys?.length && r.command.type !== "claimSeat";
}

/** The first waiting command and, if it is plain, the plain ones right behind it. */
function takeBatch(waiting: Pending[]): Pending[] {
  let n = 1;
  if (batchable(waiting[0]!)) {
    while (n < waiting.length && n < MAX_BATCH && batchable(waiting[n]!)) n++;
  }
  return waiting.splice(0, n);
}

export type CommitListener = (live: LiveSession, events: SessionEvent[]) => void;

export interface SessionHub {
  /** the live session, loaded from the database on first use; null when it does not exist */
  get(sessionId: string): Promise<LiveSession | null>;
  execute(
    sessionId: string,
    command: EngineCommand,
    actor: Actor,
    options?: ExecuteOptions,
  ): Promise<ExecuteResult>;
  /** load every session that has not ended and re-arm its clock (on start) */
  restoreAll(): Promise<number>;
  onCommit(listener: CommitListener): void;
  /** a session was deleted: drop it from memory and stop its clock */
  forget(sessionId: string): void;
  /** stop all timers and wait for queued commands to finish */
  close(): Promise<void>;
}

const SYSTEM: Actor = { role: "system" };
const ALL_SEALED: EngineCommand = { type: "closeRound", reason: "all-sealed" };

/**
 * An appended event as a read of its row returns it: the payload through JSON (the column
 * keeps exactly the digits JSON.stringify writes; undefined fields vanish), `at` as whole ms,
 * parsed by the protocol's schema as `events.list` parses it.
 */
function asStored(event: SessionEvent, seq: number): SessionEvent {
  const row = toNewEvent(event);
  return eventFromRow({
    seq,
    type: row.type,
    at: new Date(row.at).getTime(),
    payload: JSON.parse(JSON.stringify(row.payload)) as unknown,
  });
}

function toNewEvent(event: SessionEvent): NewEvent {
  const { seq: _seq, at, ...body } = event;
  return { type: event.type, at, payload: body };
}

export function createSessionHub(deps: { db: Database; clock: Clock; logger: Logger }): SessionHub {
  const { db, clock, logger } = deps;
  const sessions = new Map<string, LiveSession>();
  const loading = new Map<string, Promise<LiveSession | null>>();
  const queue = createSerialQueue();
  const listeners: CommitListener[] = [];
  let closed = false;

  function applyAll(live: LiveSession, events: readonly SessionEvent[]) {
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

  async function load(sessionId: string): Promise<LiveSession | null> {
    const rows = await db.events.list(sessionId);
    if (rows.length === 0) return null;
    const live: LiveSession = {
      id: sessionId,
      state: initialState(),
      moveSeqs: new Map(),
      timer: null,
    };
    applyAll(live, rows);
    return live;
  }

  async function get(sessionId: string): Promise<LiveSession | null> {
    const cached = sessions.get(sessionId);
    if (cached) return cached;
    const pending = loading.get(sessionId);
    if (pending) return pending;
    const promise = load(sessionId).then((live) => {
      // A concurrent load may have finished first; keep exactly one object per session.
      const existing = sessions.get(sessionId);
      if (existing) return existing;
      if (live) {
        sessions.set(sessionId, live);
        armClock(live);
      }
      return live;
    });
    loading.set(sessionId, promise);
    try {
      return await promise;
    } finally {
      loading.delete(sessionId);
    }
  }

  /** Another process (sharing PostgreSQL) moved the log on: catch up from our seq. */
  async function catchUp(live: LiveSession) {
    const rows = await db.events.list(live.id, live.state.seq);
    applyAll(live, rows);
  }

  function armClock(live: LiveSession) {
    if (live.timer) clock.clearTimer(live.timer);
    live.timer = null;
    if (closed) return;
    const at = deadline(live.state);
    if (at === null) return;
    const round = live.state.status === "open" ? live.state.open.round : 0;
    live.timer = clock.setTimer(() => {
      live.timer = null;
      void execute(live.id, { type: "closeRound", reason: "clock" }, SYSTEM).then((r) => {
        // wrong-state: the round was closed (or paused) in the meantime, which is fine.
        if (!r.ok && r.code !== "wrong-state") {
          logger.warn("clock close failed", { sessionId: live.id, round, code: r.code });
        }
      });
    }, at - clock.now());
  }

  /**
   * Decides the requests one after another, each on the state the ones before it left, and
   * commits all their events in one append (with an all-sealed close right behind the seal
   * that caused it). Each request gets the result it would have got alone; a conflict with
   * another writer reloads the log and decides the whole batch again, once.
   */
  async function commit(live: LiveSession, requests: Request[]): Promise<ExecuteResult[]> {
    for (let attempt = 0; ; attempt++) {
      const now = clock.now();
      const base = live.state.seq;
      const at = Math.max(now, live.state.status === "empty" ? 0 : live.state.at);
      // Each event in the form a read of its row gives back (see asStored), so the state
      // folded here is exactly what a restart or a replay folds from the same rows, and it
      // becomes the live state as it is once the append has committed.
      const stamped: SessionEvent[] = [];
      let trial = live.state;
      const add = (events: readonly EventBody[]) => {
        for (const e of events) {
          const seq = base + stamped.length + 1;
          const event = asStored({ ...e, seq, at } as SessionEvent, seq);
          stamped.push(event);
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
      if (stamped.length === 0) return settle([]);
      const effects = effectsOf(
        stamped,
        requests.flatMap((r) => r.options.addKeys ?? []),
      );
      if (trial.status !== live.state.status && trial.status !== "empty")
        effects.status = trial.status;
      const result = await db.events.append(live.id, base, stamped.map(toNewEvent), effects);
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
        await catchUp(live);
        return failed("conflict", `seat ${result.seatIndex} is already taken`);
      }
      // conflict: someone else appended first; reload and decide again, once.
      await catchUp(live);
      if (attempt >= 1) return failed("conflict", "the session changed meanwhile; try again");
    }
  }

  /** commands waiting for their session's turn, in arrival order */
  const inbox = new Map<string, Pending[]>();

  /**
   * Commands of one session are handled one batch at a time. Whatever arrived while the
   * previous batch was being committed goes together in the next (plain commands only: a
   * seat claim or a command that stores keys goes alone, so its failure is its own), so seals
   * that arrive together cost one append and one push, and none waits behind a chain of
   * single commits.
   */
  function execute(
    sessionId: string,
    command: EngineCommand,
    actor: Actor,
    options: ExecuteOptions = {},
  ): Promise<ExecuteResult> {
    return new Promise((resolve, reject) => {
      let waiting = inbox.get(sessionId);
      const idle = !waiting;
      if (!waiting) inbox.set(sessionId, (waiting = []));
      waiting.push({ command, actor, options, resolve, reject });
      if (idle) void queue.run(sessionId, () => drain(sessionId));
    });
  }

  async function drain(sessionId: string) {
    for (;;) {
      const waiting = inbox.get(sessionId);
      if (!waiting || waiting.length === 0) {
        inbox.delete(sessionId);
        return;
      }
      const batch = takeBatch(waiting);
      try {
        const results = await runBatch(sessionId, batch);
        batch.forEach((p, i) => p.resolve(results[i]!));
      } catch (error) {
        for (const p of batch) p.reject(error);
      }
    }
  }

  async function runBatch(sessionId: string, batch: Request[]): Promise<ExecuteResult[]> {
    const refuse = (code: ErrorCode, message: string): ExecuteResult[] =>
      batch.map(() => ({ ok: false, code, message }));
    if (closed) return refuse("internal", "the server is shutting down");
    const live = await get(sessionId);
    if (!live) return refuse("not-found", "no such session");
    const results = await commit(live, batch);
    armClock(live);
    const events = results.flatMap((r) => (r.ok ? r.events : []));
    if (events.length > 0) notify(live, events);
    // An ended session never changes again; a later hello reloads it from the log.
    if (live.state.status === "ended") sessions.delete(sessionId);
    return results;
  }

  function notify(live: LiveSession, events: SessionEvent[]) {
    for (const listener of listeners) {
      try {
        listener(live, events);
      } catch (error) {
        logger.error("commit listener failed", { sessionId: live.id, error });
      }
    }
  }

  return {
    get,
    execute,
    async restoreAll() {
      const summaries = await db.sessions.list();
      let restored = 0;
      for (const s of summaries) {
        if (s.status === "ended") continue;
        const live = await get(s.id);
        if (!live) continue;
        restored++;
        // A round whose clock ran out while the server was down, or whose seats had all
        // sealed just before a crash, closes now, before any client can act on it.
        const due = deadline(live.state);
        if (due !== null && due <= clock.now()) {
          await execute(s.id, { type: "closeRound", reason: "clock" }, SYSTEM);
        } else if (allSealed(live.state)) {
          await execute(s.id, { type: "closeRound", reason: "all-sealed" }, SYSTEM);
        }
      }
      return restored;
    },
    onCommit(listener) {
      listeners.push(listener);
    },
    forget(sessionId) {
      const live = sessions.get(sessionId);
      if (live?.timer) clock.clearTimer(live.timer);
      sessions.delete(sessionId);
    },
    async close() {
      closed = true;
      for (const live of sessions.values()) {
        if (live.timer) clock.clearTimer(live.timer);
        live.timer = null;
      }
      await queue.idle();
    },
  };
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
