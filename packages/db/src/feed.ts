/**
 * What several server processes on one PostgreSQL need from it besides the tables: a feed of
 * committed events (LISTEN on the channel the Session trigger NOTIFYs, see the migration
 * notify_committed_events), messages between the processes (e.g. "this seat's old links no
 * longer work"), and one owner per session for the duties that run on a timer (a round's
 * clock), as a session-level advisory lock. All three ride on one dedicated connection: when
 * the process dies, PostgreSQL closes it and releases its locks at once, so another process
 * takes its sessions over on its next attempt. The embedded database serves one process and
 * has no feed.
 */
import { createHash } from "node:crypto";
import pg from "pg";

export const EVENTS_CHANNEL = "contend_events";
export const SIGNALS_CHANNEL = "contend_signals";

export interface FeedHandlers {
  /** events of sessionId up to lastSeq are committed (by this process or another) */
  committed(sessionId: string, lastSeq: number): void;
  /** another process published a message (see publish) */
  signal(message: unknown): void;
  /**
   * The connection was lost and is back: notifications of the gap are missed (read every
   * session again), and every lease held before is gone.
   */
  reconnected(): void;
  /** the connection was lost: every lease is gone until taken again */
  leasesLost(): void;
}

export interface ChangeFeed {
  /** sets who hears the feed (one listener: the process's session hub) */
  listen(handlers: FeedHandlers): void;
  /** sends a message to every process listening (this one included) */
  publish(message: unknown): Promise<void>;
  /**
   * Takes every lease of these sessions that no process holds; returns the ids taken. Ask
   * only for leases this process lacks: a lock taken twice needs two releases.
   */
  tryLeases(sessionIds: string[]): Promise<string[]>;
  /** gives the lease up (a session ended or forgotten); no-op if not held */
  releaseLease(sessionId: string): Promise<void>;
  close(): Promise<void>;
}

/** A session id as the 64-bit key of its advisory lock (sha-256 prefix: no practical clash). */
export function leaseKey(sessionId: string): string {
  return createHash("sha256")
    .update(`contend-lease:${sessionId}`)
    .digest()
    .readBigInt64BE(0)
    .toString();
}

/** How long to wait before connecting again after the connection dropped. */
const RECONNECT_MS = 1_000;

export async function openFeed(url: string): Promise<ChangeFeed> {
  let handlers: FeedHandlers | null = null;
  let client: pg.Client | null = null;
  let closed = false;
  let reconnectTimer: ReturnType<typeof setTimeout> | null = null;

  async function connect(): Promise<pg.Client> {
    // Named, so an operator (or a test) can see in pg_stat_activity which process holds a lease.
    const c = new pg.Client({
      connectionString: url,
      keepAlive: true,
      application_name: `contend-feed-${process.pid}`,
    });
    c.on("notification", (n) => {
      if (!handlers || n.payload === undefined) return;
      if (n.channel === EVENTS_CHANNEL) {
        const colon = n.payload.lastIndexOf(":");
        const lastSeq = Number(n.payload.slice(colon + 1));
        if (colon > 0 && Number.isInteger(lastSeq))
          handlers.committed(n.payload.slice(0, colon), lastSeq);
      } else if (n.channel === SIGNALS_CHANNEL) {
        try {
          handlers.signal(JSON.parse(n.payload) as unknown);
        } catch {
          // not ours: ignore
        }
      }
    });
    c.on("error", () => dropped(c));
    c.on("end", () => dropped(c));
    await c.connect();
    await c.query(`LISTEN ${EVENTS_CHANNEL}; LISTEN ${SIGNALS_CHANNEL}`);
    return c;
  }

  function dropped(c: pg.Client) {
    if (client !== c) return;
    client = null;
    c.removeAllListeners("notification");
    void c.end().catch(() => undefined);
    if (closed) return;
    handlers?.leasesLost();
    scheduleReconnect();
  }

  function scheduleReconnect() {
    if (closed || reconnectTimer) return;
    reconnectTimer = setTimeout(() => {
      reconnectTimer = null;
      connect().then(
        (c) => {
          if (closed) return void c.end().catch(() => undefined);
          client = c;
          handlers?.reconnected();
        },
        () => scheduleReconnect(),
      );
    }, RECONNECT_MS);
    reconnectTimer.unref();
  }

  client = await connect();

  return {
    listen(h) {
      handlers = h;
    },
    async publish(message) {
      const c = client;
      if (!c) throw new Error("the change feed is reconnecting");
      await c.query("SELECT pg_notify($1, $2)", [SIGNALS_CHANNEL, JSON.stringify(message)]);
    },
    async tryLeases(sessionIds) {
      const c = client;
      if (!c || sessionIds.length === 0) return [];
      const keys = sessionIds.map(leaseKey);
      try {
        // One statement for all: each free lock is taken, a held one (by another process, or
        // already by this one) is left as it is (the caller asks only for leases it lacks).
        const r = await c.query<{ i: number }>(
          `SELECT i FROM unnest($1::bigint[]) WITH ORDINALITY AS k(key, i)
           WHERE pg_try_advisory_lock(key)`,
          [keys],
        );
        return r.rows.map((row) => sessionIds[Number(row.i) - 1]!);
      } catch {
        return [];
      }
    },
    async releaseLease(sessionId) {
      const c = client;
      if (!c) return;
      // A session-level advisory lock is counted: take and release stay paired by the caller.
      await c
        .query("SELECT pg_advisory_unlock($1::bigint)", [leaseKey(sessionId)])
        .catch(() => undefined);
    },
    async close() {
      closed = true;
      if (reconnectTimer) clearTimeout(reconnectTimer);
      const c = client;
      client = null;
      if (c) await c.end().catch(() => undefined);
    },
  };
}
