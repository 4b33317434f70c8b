import type { SqlRunner } from "../sql-runner";
import type { NewEvent } from "../types";
import { jsonText } from "./rows";

/** One append waiting for the next group commit: only plain events and a status change. */
export interface GroupMember {
  sessionId: string;
  expectedLastSeq: number;
  status: string | undefined;
  /** rows ready to bind: JSON already checked and serialised by the caller's own call */
  rows: { type: string; at: string; payload: string }[];
}

export type GroupResult =
  | { ok: true; seqs: number[] }
  | { ok: false; code: "conflict"; lastSeq: number }
  | { ok: false; code: "not-found" };

export function groupMember(
  sessionId: string,
  expectedLastSeq: number,
  events: NewEvent[],
  status: string | undefined,
): GroupMember {
  return {
    sessionId,
    expectedLastSeq,
    status,
    rows: events.map((e) => ({
      type: e.type,
      at: new Date(e.at).toISOString(),
      payload: jsonText(e.payload),
    })),
  };
}

// Bounds one transaction's statements well under PostgreSQL's 65,535 bind parameters.
const MAX_MEMBERS = 256;
const MAX_ROWS = 4_000;

/**
 * Commits the appends of many sessions in one transaction (group commit): every append
 * queued while the previous transaction was in flight, or in the same turn of the event
 * loop, shares the next one. A single UPDATE ... RETURNING applies all version checks, so
 * each member learns its own outcome and a stale member costs the others nothing; one
 * multi-row INSERT then writes the events of the members that passed. A session appears at
 * most once per transaction (later appends to it wait for the next), so outcomes keep the
 * order of the calls. If the transaction fails as a whole (a seq clash with another
 * process, a deadlock between two processes' groups, a lost connection), each member is
 * retried on its own through `single`, which reports or throws for that caller alone.
 * Commits run one after another, each from a fresh turn of the event loop, so timers and
 * socket pings get their turn between them.
 */
/** F: what the single-append fallback may also return. */
export function createGroupCommit<F = never>(runner: SqlRunner) {
  type Waiter = {
    member: GroupMember;
    single: () => Promise<GroupResult | F>;
    resolve: (r: GroupResult | F) => void;
    reject: (e: unknown) => void;
  };
  let queue: Waiter[] = [];
  let scheduled = false;
  let running = false;

  function schedule() {
    if (scheduled || running || queue.length === 0) return;
    scheduled = true;
    setImmediate(() => {
      scheduled = false;
      void flush();
    });
  }

  function take(): Waiter[] {
    const group: Waiter[] = [];
    const rest: Waiter[] = [];
    const sessions = new Set<string>();
    let rows = 0;
    for (const w of queue) {
      const fits =
        group.length < MAX_MEMBERS &&
        rows + w.member.rows.length <= MAX_ROWS &&
        !sessions.has(w.member.sessionId);
      if (fits || group.length === 0) {
        group.push(w);
        sessions.add(w.member.sessionId);
        rows += w.member.rows.length;
      } else {
        rest.push(w);
      }
    }
    queue = rest;
    return group;
  }

  async function flush() {
    running = true;
    const group = take();
    try {
      let results: GroupResult[] | null = null;
      try {
        results = await commitGroup(
          runner,
          group.map((w) => w.member),
        );
      } catch {
        results = null;
      }
      if (results) {
        group.forEach((w, i) => w.resolve(results[i]!));
      } else {
        await Promise.all(
          group.map((w) => w.single().then(w.resolve, (error: unknown) => w.reject(error))),
        );
      }
    } finally {
      running = false;
      schedule();
    }
  }

  return {
    /** `single` appends this member alone, if the group it was in failed as a whole */
    append(member: GroupMember, single: () => Promise<GroupResult | F>): Promise<GroupResult | F> {
      return new Promise((resolve, reject) => {
        queue.push({ member, single, resolve, reject });
        schedule();
      });
    },
  };
}

async function commitGroup(runner: SqlRunner, members: GroupMember[]): Promise<GroupResult[]> {
  return runner.transaction(async (tx) => {
    const params: unknown[] = [new Date().toISOString()];
    const values = members.map((m) => {
      params.push(m.sessionId, m.expectedLastSeq, m.expectedLastSeq + m.rows.length, m.status);
      const n = params.length;
      return `($${n - 3}::text, $${n - 2}::int, $${n - 1}::int, $${n}::text)`;
    });
    const moved = await tx.query<{ id: string }>(
      `UPDATE "Session" AS s SET "lastSeq" = v.next, "status" = COALESCE(v.status, s."status"),
         "updatedAt" = $1::timestamptz
       FROM (VALUES ${values.join(", ")}) AS v(id, expected, next, status)
       WHERE s."id" = v.id AND s."lastSeq" = v.expected
       RETURNING s."id"`,
      params,
    );
    const won = new Set(moved.map((r) => r.id));
    const winners = members.filter((m) => won.has(m.sessionId));
    if (winners.length > 0) {
      const rowParams: unknown[] = [];
      const rowValues: string[] = [];
      for (const m of winners) {
        m.rows.forEach((row, i) => {
          rowParams.push(m.sessionId, m.expectedLastSeq + 1 + i, row.type, row.at, row.payload);
          const n = rowParams.length;
          rowValues.push(
            `($${n - 4}::text, $${n - 3}::int, $${n - 2}::text, $${n - 1}::timestamptz, $${n}::jsonb)`,
          );
        });
      }
      await tx.query(
        `INSERT INTO "Event" ("sessionId", "seq", "type", "at", "payload") VALUES ${rowValues.join(", ")}`,
        rowParams,
      );
    }
    const losers = members.filter((m) => !won.has(m.sessionId));
    const current = new Map<string, number>();
    if (losers.length > 0) {
      const ids = losers.map((m) => m.sessionId);
      const rows = await tx.query<{ id: string; lastSeq: number }>(
        `SELECT "id", "lastSeq" FROM "Session" WHERE "id" IN (${ids.map((_, i) => `$${i + 1}::text`).join(", ")})`,
        ids,
      );
      for (const r of rows) current.set(r.id, Number(r.lastSeq));
    }
    return members.map((m): GroupResult => {
      if (won.has(m.sessionId)) {
        return { ok: true, seqs: m.rows.map((_, i) => m.expectedLastSeq + 1 + i) };
      }
      const lastSeq = current.get(m.sessionId);
      return lastSeq === undefined
        ? { ok: false, code: "not-found" }
        : { ok: false, code: "conflict", lastSeq };
    });
  });
}
