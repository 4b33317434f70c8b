import type { SqlRunner } from "../sqlRunner";
import type { SessionEvent } from "@contend/protocol";
import type { AppendResult, Db, KeyInput, NewEvent } from "../types";
import { createGroupCommit, groupMember } from "./groupCommit";
import { keyRows } from "./keys";
import { Prisma } from "../generated/prisma/client";
import { eventFromRow, isUniqueViolation, jsonb } from "./rows";

/** Writes that must commit together with the events they belong to, or not at all. */
export interface AppendEffects {
  /** New Session.status, e.g. "open" with round-opened. */
  status?: string;
  /** Seats to mark claimed (with seat-claimed); fails the whole append if one is already taken. */
  claimSeats?: { seatIndex: number; displayName: string }[];
  /**
   * Keys to store hashed (e.g. the key handed to whoever claimed a seat). A seat key added here
   * revokes that seat's earlier keys: a seat is held by one key at a time.
   */
  addKeys?: KeyInput[];
}

/** One INSERT for a run of events from firstSeq on (raw, for exact JSON numbers: see jsonText). */
export function insertEvents(sessionId: string, firstSeq: number, events: NewEvent[]): Prisma.Sql {
  const rows = events.map(
    (event, i) =>
      Prisma.sql`(${sessionId}, ${firstSeq + i}, ${event.type}, ${new Date(event.at)}, ${event.payloadJson !== undefined ? Prisma.sql`${event.payloadJson}::jsonb` : jsonb(event.payload)})`,
  );
  return Prisma.sql`INSERT INTO "Event" ("sessionId", "seq", "type", "at", "payload") VALUES ${Prisma.join(rows)}`;
}

class Abort extends Error {
  constructor(readonly result: AppendResult) {
    super("append aborted");
  }
}

// Interactive transactions on PGlite queue behind one lock; a busy embedded server may wait
// longer than Prisma's default 2 s to start one.
const TX_OPTIONS = { maxWait: 10_000, timeout: 10_000 };

export function eventsRepository(db: Db, runner: SqlRunner) {
  const group = createGroupCommit<AppendResult>(runner);

  async function lastSeqOf(sessionId: string): Promise<AppendResult> {
    const session = await db.session.findUnique({
      where: { id: sessionId },
      select: { lastSeq: true },
    });
    return session
      ? { ok: false, code: "conflict", lastSeq: session.lastSeq }
      : { ok: false, code: "not-found" };
  }

  /** One interactive transaction: for appends that store keys, and for a failed group's members. */
  async function appendAlone(
    sessionId: string,
    expectedLastSeq: number,
    events: NewEvent[],
    effects: AppendEffects = {},
  ): Promise<AppendResult> {
    const seqs = events.map((_, i) => expectedLastSeq + 1 + i);
    try {
      return await db
        .$transaction(async (tx) => {
          const moved = await tx.session.updateMany({
            where: { id: sessionId, lastSeq: expectedLastSeq },
            data: {
              lastSeq: expectedLastSeq + events.length,
              ...(effects.status !== undefined ? { status: effects.status } : {}),
            },
          });
          // Nothing written yet: commit the empty transaction and report outside it.
          if (moved.count === 0) return { ok: false, code: "conflict", lastSeq: -1 } as const;
          await tx.$executeRaw(insertEvents(sessionId, expectedLastSeq + 1, events));
          for (const claim of effects.claimSeats ?? []) {
            const claimed = await tx.seat.updateMany({
              where: { sessionId, index: claim.seatIndex, claimedAt: null },
              data: { displayName: claim.displayName, claimedAt: new Date() },
            });
            if (claimed.count === 0) {
              throw new Abort({ ok: false, code: "seat-claimed", seatIndex: claim.seatIndex });
            }
          }
          if (effects.addKeys?.length) {
            const seats = effects.addKeys.flatMap((k) =>
              k.role === "seat" && k.seatIndex !== null ? [k.seatIndex] : [],
            );
            if (seats.length > 0) {
              await tx.accessKey.deleteMany({
                where: { sessionId, role: "seat", seatIndex: { in: seats } },
              });
            }
            await tx.accessKey.createMany({ data: keyRows(sessionId, effects.addKeys) });
          }
          return { ok: true, seqs } as const;
        }, TX_OPTIONS)
        .then((result) => (result.ok ? result : lastSeqOf(sessionId)));
    } catch (error) {
      if (error instanceof Abort) return error.result;
      if (isUniqueViolation(error)) {
        // Another writer took these seqs; any other unique clash (a reused key) is a bug.
        const now = await lastSeqOf(sessionId);
        if (now.ok === false && now.code === "conflict" && now.lastSeq !== expectedLastSeq)
          return now;
      }
      throw error;
    }
  }

  return {
    /**
     * Appends events after expectedLastSeq, atomically. The version check is a conditional
     * UPDATE of Session.lastSeq inside the transaction, so it is serialised by the database:
     * when several processes share one PostgreSQL, the second writer waits on the row lock,
     * then finds lastSeq moved and gets {code:"conflict"}; the (sessionId, seq) primary key
     * backs this up. On conflict the caller reloads events after its seq, re-decides and retries.
     * Appends that store no keys (seat claims included) are group-committed with other
     * sessions' (see createGroupCommit); each caller gets the result it would have got alone.
     */
    async append(
      sessionId: string,
      expectedLastSeq: number,
      events: NewEvent[],
      effects: AppendEffects = {},
    ): Promise<AppendResult> {
      if (events.length === 0) throw new Error("events.append needs at least one event");
      if (effects.addKeys?.length) return appendAlone(sessionId, expectedLastSeq, events, effects);
      const member = groupMember(
        sessionId,
        expectedLastSeq,
        events,
        effects.status,
        effects.claimSeats ?? [],
      );
      return group.append(member, () => appendAlone(sessionId, expectedLastSeq, events, effects));
    },

    /** Events with seq > afterSeq, in order, parsed by the protocol's event schema. */
    async list(sessionId: string, afterSeq = 0): Promise<SessionEvent[]> {
      const rows = await db.event.findMany({
        where: { sessionId, seq: { gt: afterSeq } },
        orderBy: { seq: "asc" },
      });
      return rows.map((row) => eventFromRow({ ...row, at: row.at.getTime() }));
    },

    /** How many events of one type each session has (e.g. resolved rounds for a replay list). */
    async countOfType(type: string): Promise<Record<string, number>> {
      const groups = await db.event.groupBy({
        by: ["sessionId"],
        where: { type },
        _count: { _all: true },
      });
      return Object.fromEntries(groups.map((g) => [g.sessionId, g._count._all]));
    },
  };
}
