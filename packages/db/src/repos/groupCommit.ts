import type { PreparedStatement, SqlRunner } from "../sqlRunner";
import type { AppendResult, NewEvent } from "../types";
import { jsonText } from "./rows";

/** One append waiting for the next group commit: events, a status change and seat claims. */
export interface GroupMember {
  sessionId: string;
  expectedLastSeq: number;
  status: string | undefined;
  /** rows ready to bind: JSON already checked and serialised by the caller's own call */
  rows: { type: string; at: string; payload: string }[];
  /** seats to mark claimed with the events; one that is taken (or missing) fails the member */
  claims: { seatIndex: number; displayName: string }[];
}

export function groupMember(
  sessionId: string,
  expectedLastSeq: number,
  events: NewEvent[],
  status: string | undefined,
  claims: GroupMember["claims"] = [],
): GroupMember {
  return {
    sessionId,
    expectedLastSeq,
    status,
    claims,
    rows: events.map((e) => ({
      type: e.type,
      at: new Date(e.at).toISOString(),
      payload: e.payloadJson ?? jsonText(e.payload),
    })),
  };
}

// Bounds the size of one transaction.
const MAX_MEMBERS = 256;
const MAX_ROWS = 4_000;
const MAX_IN_FLIGHT = 2;

/**
 * Commits the appends of many sessions in one transaction (group commit): every append
 * queued while the previous transaction was in flight, or in the same turn of the event
 * loop, shares the next one: a single statement (see commitGroup) applies all version checks,
 * so each member learns its own outcome and a stale member costs the others nothing, and
 * writes the events of the members that passed. A session appears at
 * most once per transaction (later appends to it wait for the next), so outcomes keep the
 * order of the calls. If the statement fails as a whole (a seq clash with another
 * process, a deadlock between two processes' groups, a lost connection), each member is
 * retried on its own through `single`, which reports or throws for that caller alone.
 * Each commit starts from a fresh turn of the event loop, so timers and socket pings get their
 * turn between them, and up to MAX_IN_FLIGHT run at once: the next group goes to the database
 * while this thread is still handling the results of the previous one (acks, view pushes),
 * instead of the two taking turns. Groups in flight never share a session.
 */
/** F: what the single-append fallback may also return. */
export function createGroupCommit<F = never>(runner: SqlRunner) {
  type Waiter = {
    member: GroupMember;
    single: () => Promise<AppendResult | F>;
    resolve: (r: AppendResult | F) => void;
    reject: (e: unknown) => void;
  };
  let queue: Waiter[] = [];
  let scheduled = false;
  let inFlight = 0;
  /** sessions whose append is in a group in flight */
  const busy = new Set<string>();

  function schedule() {
    if (scheduled || inFlight >= MAX_IN_FLIGHT || queue.length === 0) return;
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
      if (busy.has(w.member.sessionId)) rest.push(w);
      else if (fits || group.length === 0) {
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
    const group = take();
    if (group.length === 0) return;
    inFlight++;
    for (const w of group) busy.add(w.member.sessionId);
    schedule();
    try {
      let results: AppendResult[] | null = null;
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
      inFlight--;
      for (const w of group) busy.delete(w.member.sessionId);
      schedule();
    }
  }

  return {
    /** `single` appends this member alone, if the group it was in failed as a whole */
    append(
      member: GroupMember,
      single: () => Promise<AppendResult | F>,
    ): Promise<AppendResult | F> {
      return new Promise((resolve, reject) => {
        queue.push({ member, single, resolve, reject });
        schedule();
      });
    },
  };
}

/**
 * The whole group in one statement (one round trip, its own transaction): data-modifying CTEs
 * run exactly once and atomically. A member that claims a taken (or missing) seat does not
 * move its session; the claims and the INSERT take only the members whose session moved, and
 * the final SELECT says which members won and which seat stopped a loser. Claims ride here
 * rather than in an interactive transaction, which would hold PGlite's one lock for several
 * round trips while every seat of a workshop joins. Members, rows and claims travel as arrays,
 * so the text never changes and the statement is prepared once per connection.
 */
const GROUP_COMMIT: PreparedStatement = {
  name: "contend_group_commit",
  types: [
    "timestamptz",
    "int[]",
    "text[]",
    "int[]",
    "int[]",
    "text[]",
    "text[]",
    "int[]",
    "text[]",
    "timestamptz[]",
    "jsonb[]",
    "int[]",
    "int[]",
    "text[]",
  ],
  sql: `WITH v AS (
       SELECT * FROM unnest($2::int[], $3::text[], $4::int[], $5::int[], $6::text[])
         AS v(i, id, expected, next, status)
     ),
     c AS (
       SELECT * FROM unnest($12::int[], $13::int[], $14::text[]) AS c(i, "index", name)
     ),
     taken AS (
       SELECT c.i, min(c."index") AS "index" FROM c JOIN v ON v.i = c.i
         LEFT JOIN "Seat" AS st ON st."sessionId" = v.id AND st."index" = c."index"
       WHERE st."sessionId" IS NULL OR st."claimedAt" IS NOT NULL
       GROUP BY c.i
     ),
     moved AS (
       UPDATE "Session" AS s SET "lastSeq" = v.next, "status" = COALESCE(v.status, s."status"),
         "updatedAt" = $1::timestamptz
       FROM v WHERE s."id" = v.id AND s."lastSeq" = v.expected
         AND NOT EXISTS (SELECT 1 FROM taken WHERE taken.i = v.i)
       RETURNING s."id"
     ),
     claimed AS (
       UPDATE "Seat" AS st SET "displayName" = c.name, "claimedAt" = $1::timestamptz
       FROM c JOIN v ON v.i = c.i JOIN moved ON moved."id" = v.id
       WHERE st."sessionId" = v.id AND st."index" = c."index"
     ),
     r AS (
       SELECT * FROM unnest($7::text[], $8::int[], $9::text[], $10::timestamptz[], $11::jsonb[])
         AS r("sessionId", "seq", "type", "at", "payload")
     ),
     ins AS (
       INSERT INTO "Event" ("sessionId", "seq", "type", "at", "payload")
       SELECT r.* FROM r JOIN moved ON moved."id" = r."sessionId"
     )
     SELECT v.i, moved."id" IS NOT NULL AS won, taken."index" AS taken
     FROM v LEFT JOIN moved ON moved."id" = v.id LEFT JOIN taken ON taken.i = v.i
     ORDER BY v.i`,
};

async function commitGroup(runner: SqlRunner, members: GroupMember[]): Promise<AppendResult[]> {
  const rows = members.flatMap((m) =>
    m.rows.map((row, k) => ({ sessionId: m.sessionId, seq: m.expectedLastSeq + 1 + k, ...row })),
  );
  const claims = members.flatMap((m, i) => m.claims.map((c) => ({ i, ...c })));
  const result = await runner.prepared<{ i: number; won: boolean; taken: number | null }>(
    GROUP_COMMIT,
    [
      new Date().toISOString(),
      members.map((_, i) => i),
      members.map((m) => m.sessionId),
      members.map((m) => m.expectedLastSeq),
      members.map((m) => m.expectedLastSeq + m.rows.length),
      members.map((m) => m.status ?? null),
      rows.map((r) => r.sessionId),
      rows.map((r) => r.seq),
      rows.map((r) => r.type),
      rows.map((r) => r.at),
      rows.map((r) => r.payload),
      claims.map((c) => c.i),
      claims.map((c) => c.seatIndex),
      claims.map((c) => c.displayName),
    ],
  );
  const outcomes = members.map((_, i) => {
    const row = result[i];
    if (!row || Number(row.i) !== i) throw new Error("group commit: a member's outcome is missing");
    const taken = row.taken === null || row.taken === undefined ? null : Number(row.taken);
    return { won: row.won, taken };
  });
  // A stale member learns the lastSeq that beat it from a fresh read: the statement's own
  // snapshot predates a writer in another process that it waited for.
  const losers = members.filter((_, i) => !outcomes[i]!.won).map((m) => m.sessionId);
  const current = new Map<string, number>();
  if (losers.length > 0) {
    const rows = await runner.query<{ id: string; lastSeq: number }>(
      `SELECT "id", "lastSeq" FROM "Session" WHERE "id" = ANY($1::text[])`,
      [losers],
    );
    for (const r of rows) current.set(r.id, Number(r.lastSeq));
  }
  return members.map((m, i): AppendResult => {
    const { won, taken } = outcomes[i]!;
    if (won) return { ok: true, seqs: m.rows.map((_, k) => m.expectedLastSeq + 1 + k) };
    const lastSeq = current.get(m.sessionId);
    if (lastSeq === undefined) return { ok: false, code: "not-found" };
    // As in a transaction of its own: a moved session is a conflict before a taken seat is.
    if (taken !== null && lastSeq === m.expectedLastSeq)
      return { ok: false, code: "seat-claimed", seatIndex: taken };
    return { ok: false, code: "conflict", lastSeq };
  });
}
