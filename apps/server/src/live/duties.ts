/**
 * Who runs a session's timed duties. A round's clock (and the close when it runs out) must
 * fire once, however many processes hold the session; everything else a round needs (the
 * computer's moves when it opens, the close when the last seat seals, a shock) is decided
 * inside the commit of the command that causes it, so the seq check already makes it happen
 * once. On PostgreSQL each session has one owner at a time: the process holding its lease
 * (an advisory lock on the feed's connection, packages/db feed.ts). Every process asks for
 * the leases it lacks when it loads a session and then every LEASE_RETRY_MS, so when an owner
 * dies (its connection closes and PostgreSQL frees its locks) another process takes over
 * within that period. The embedded database serves one process, which owns everything.
 */
import type { ChangeFeed } from "@contend/db";
import type { Clock, TimerHandle } from "../clock";
import type { Logger } from "../logger";
import type { LiveSession } from "./batch";

/** How often a process asks for the leases it lacks: the bound on a takeover's delay. */
export const LEASE_RETRY_MS = 2_000;

export interface DutiesDeps {
  feed: ChangeFeed | null;
  clock: Clock;
  logger: Logger;
  /** the live session of this id, if this process still holds it */
  current(sessionId: string): LiveSession | undefined;
  /** every live session of this process */
  live(): Iterable<LiveSession>;
  /** this process now owns the session: catch up and arm its clock */
  acquired(live: LiveSession): Promise<void>;
  /** the lease is gone (connection lost): stop the session's clock */
  lost(live: LiveSession): void;
}

export interface Duties {
  owns(sessionId: string): boolean;
  /** a session was loaded: ask for its lease now rather than at the next round of retries */
  claim(live: LiveSession): void;
  /** the session ended or was forgotten: give its lease up */
  release(sessionId: string): void;
  /** the feed's connection dropped: every lease is gone */
  lostAll(): void;
  /** the feed's connection is back: ask again at once */
  reconnected(): void;
  stop(): void;
}

export function createDuties(deps: DutiesDeps): Duties {
  const { feed, clock, logger } = deps;
  if (!feed) {
    const noop = () => undefined;
    return {
      owns: () => true,
      claim: noop,
      release: noop,
      lostAll: noop,
      reconnected: noop,
      stop: noop,
    };
  }
  const leases = feed;
  const owned = new Set<string>();
  /** sessions whose lease request is in flight */
  const asking = new Set<string>();
  let stopped = false;
  let retry: TimerHandle | null = null;

  async function ask(ids: string[]) {
    const wanted = ids.filter((id) => !owned.has(id) && !asking.has(id));
    if (wanted.length === 0 || stopped) return;
    for (const id of wanted) asking.add(id);
    let taken: string[] = [];
    try {
      taken = await leases.tryLeases(wanted);
    } finally {
      for (const id of wanted) asking.delete(id);
    }
    for (const id of taken) {
      const live = deps.current(id);
      if (stopped || !live || live.state.status === "ended") {
        void leases.releaseLease(id);
        continue;
      }
      owned.add(id);
      deps.acquired(live).catch((error: unknown) => {
        logger.error("taking over a session failed", { sessionId: id, error });
      });
    }
  }

  function schedule() {
    if (stopped) return;
    retry = clock.setTimer(
      () => {
        retry = null;
        const ids = [...deps.live()]
          .filter((l) => l.state.status !== "ended" && !owned.has(l.id))
          .map((l) => l.id);
        void ask(ids).finally(schedule);
      },
      LEASE_RETRY_MS,
      { unref: true },
    );
  }
  schedule();

  return {
    owns: (id) => owned.has(id),
    claim(live) {
      void ask([live.id]);
    },
    release(id) {
      if (!owned.delete(id)) return;
      void leases.releaseLease(id);
    },
    lostAll() {
      const ids = [...owned];
      owned.clear();
      for (const id of ids) {
        const live = deps.current(id);
        if (live) deps.lost(live);
      }
      if (ids.length > 0)
        logger.warn("database feed lost; session clocks paused here", { sessions: ids.length });
    },
    reconnected() {
      void ask([...deps.live()].filter((l) => l.state.status !== "ended").map((l) => l.id));
    },
    stop() {
      stopped = true;
      if (retry) clock.clearTimer(retry);
      retry = null;
    },
  };
}
