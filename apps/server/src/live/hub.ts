/**
 * The live sessions of this process: each session's folded state, its round clock and the
 * one queue its commands pass through. The pipeline for every batch of commands (those of
 * one session that arrived while its previous batch was committing) is
 *   decide each in turn (pure engine) -> one append to the database (the seq check is the
 *   authority) -> apply -> arm the clock -> notify (views are pushed by the caller's listener).
 * Nothing is acknowledged before the database has committed it (batch.ts).
 *
 * Several processes on one PostgreSQL: every commit is announced on the database's feed;
 * a process holding the session reads the new events by seq, folds them (through the
 * session's queue, so never in the middle of its own commit) and notifies its listeners like
 * after its own commits. The round clock runs in one process per session, the lease holder
 * (duties.ts); a command reaching any other process is still decided and committed there.
 *
 * About 300 lines on purpose: the batch pipeline and the timed duties are split out already;
 * what stays is one class whose methods share the session map and its queues.
 */
import type { Database } from "@contend/db";
import type { ErrorCode, SessionEvent } from "@contend/protocol";
import { allSealed, deadline, initialState } from "@contend/session";
import type { Actor, EngineCommand } from "@contend/session";
import type { Clock } from "../clock";
import type { Logger } from "../logger";
import { createSerialQueue } from "../serialQueue";
import { applyAll, commitBatch, SYSTEM, takeBatch } from "./batch";
import type { ExecuteOptions, ExecuteResult, LiveSession, Request } from "./batch";
import { createDuties } from "./duties";

export type { ExecuteOptions, ExecuteResult, LiveSession } from "./batch";

interface Pending extends Request {
  resolve: (result: ExecuteResult) => void;
  reject: (error: unknown) => void;
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
  /**
   * Tells every other process sharing the database (and this one) something that is not an
   * event, e.g. that a seat's old links stopped working; no-op on the embedded database.
   */
  publish(message: unknown): Promise<void>;
  onSignal(listener: (message: unknown) => void): void;
  /** whether this process runs the session's clock (always, on the embedded database) */
  owns(sessionId: string): boolean;
  /** stop all timers and wait for queued commands to finish */
  close(): Promise<void>;
}

export function createSessionHub(deps: { db: Database; clock: Clock; logger: Logger }): SessionHub {
  const { db, clock, logger } = deps;
  const sessions = new Map<string, LiveSession>();
  const loading = new Map<string, Promise<LiveSession | null>>();
  const queue = createSerialQueue();
  const listeners: CommitListener[] = [];
  const signalListeners: ((message: unknown) => void)[] = [];
  let closed = false;

  const duties = createDuties({
    feed: db.feed,
    clock,
    logger,
    current: (id) => sessions.get(id),
    live: () => sessions.values(),
    // Newly owned: catch up (the last owner may have committed since our last read), then
    // arm the clock; a deadline already past closes the round at once.
    acquired: (live) =>
      queue.run(live.id, async () => {
        if (sessions.get(live.id) !== live) return;
        await catchUp(live);
        armClock(live);
        if (allSealed(live.state)) void closeBy(live, "all-sealed");
      }),
    lost: (live) => disarm(live),
  });

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
        if (live.state.status !== "ended") duties.claim(live);
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

  /** Another process (sharing PostgreSQL) moved the log on: fold what it wrote, then tell. */
  async function catchUp(live: LiveSession): Promise<boolean> {
    const rows = await db.events.list(live.id, live.state.seq);
    if (rows.length === 0) return false;
    applyAll(live, rows);
    notify(live, rows);
    return true;
  }

  /** Heard on the feed: events up to lastSeq are committed. */
  function committed(sessionId: string, lastSeq: number) {
    const live = sessions.get(sessionId);
    if (!live || live.state.seq >= lastSeq || closed) return;
    void queue
      .run(sessionId, async () => {
        if (sessions.get(sessionId) !== live || live.state.seq >= lastSeq) return;
        await catchUp(live);
        armClock(live);
        settle(live);
      })
      .catch((error: unknown) => logger.error("catch-up failed", { sessionId, error }));
  }

  function disarm(live: LiveSession) {
    if (live.timer) clock.clearTimer(live.timer);
    live.timer = null;
  }

  function armClock(live: LiveSession) {
    disarm(live);
    if (closed || !duties.owns(live.id)) return;
    const at = deadline(live.state);
    if (at === null) return;
    live.timer = clock.setTimer(() => {
      live.timer = null;
      void closeBy(live, "clock");
    }, at - clock.now());
  }

  async function closeBy(live: LiveSession, reason: "clock" | "all-sealed") {
    const round = live.state.status === "open" ? live.state.open.round : 0;
    const r = await execute(live.id, { type: "closeRound", reason }, SYSTEM);
    // wrong-state: the round was closed (or paused) in the meantime, which is fine.
    if (!r.ok && r.code !== "wrong-state") {
      logger.warn(`${reason} close failed`, { sessionId: live.id, round, code: r.code });
    }
  }

  /** An ended session never changes again: drop it (a later hello reloads it from the log). */
  function settle(live: LiveSession) {
    if (live.state.status !== "ended") return;
    sessions.delete(live.id);
    duties.release(live.id);
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
    // Retryable: the client reconnects (to another process behind the proxy) and sends again.
    if (closed) return refuse("unavailable", "the server is shutting down; try again");
    const live = await get(sessionId);
    if (!live) return refuse("not-found", "no such session");
    const shared = db.feed !== null;
    const results = await commitBatch({ db, clock, logger, catchUp, shared }, live, batch);
    armClock(live);
    const events = results.flatMap((r) => (r.ok ? r.events : []));
    if (events.length > 0) notify(live, events);
    settle(live);
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

  db.feed?.listen({
    committed,
    signal(message) {
      for (const listener of signalListeners) {
        try {
          listener(message);
        } catch (error) {
          logger.error("signal listener failed", { error });
        }
      }
    },
    reconnected() {
      for (const live of sessions.values()) committed(live.id, Number.MAX_SAFE_INTEGER);
      duties.reconnected();
    },
    leasesLost: () => duties.lostAll(),
  });

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
        // sealed just before a crash, closes now, before any client can act on it (by the
        // session's owner: see duties.ts; another process leaves it to that one).
        if (!duties.owns(s.id)) continue;
        const due = deadline(live.state);
        if (due !== null && due <= clock.now()) await closeBy(live, "clock");
        else if (allSealed(live.state)) await closeBy(live, "all-sealed");
      }
      return restored;
    },
    onCommit(listener) {
      listeners.push(listener);
    },
    forget(sessionId) {
      const live = sessions.get(sessionId);
      if (live) disarm(live);
      sessions.delete(sessionId);
      duties.release(sessionId);
    },
    async publish(message) {
      await db.feed?.publish(message).catch((error: unknown) => {
        logger.warn("could not tell the other processes", { error });
      });
    },
    onSignal(listener) {
      signalListeners.push(listener);
    },
    owns: (sessionId) => duties.owns(sessionId),
    async close() {
      closed = true;
      duties.stop();
      for (const live of sessions.values()) disarm(live);
      await queue.idle();
    },
  };
}
