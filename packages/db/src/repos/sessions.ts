import type { Db, KeyInput, NewEvent, SeatInput, SessionRecord, SessionSummary } from "../types";
import { keyRows } from "./keys";
import { insertEvents } from "./events";
import { isUniqueViolation, jsonb, seatRecord, summarySelect } from "./rows";

export interface CreateSessionInput {
  id: string;
  joinCode: string;
  title: string;
  /** default "lobby" */
  status?: string;
  scenario: unknown;
  seats: SeatInput[];
  keys: KeyInput[];
  /** stored as seq 1 (session-created) */
  firstEvent: NewEvent;
}

export type CreateSessionResult =
  | { ok: true; session: SessionRecord }
  /** id or joinCode already taken: draw new ones and try again */
  | { ok: false; code: "conflict"; field: "id" | "joinCode" };

const withSeats = { seats: { orderBy: { index: "asc" } } } as const;

type SessionRow = SessionSummary & {
  scenario: unknown;
  seats: Parameters<typeof seatRecord>[0][];
};

function sessionRecord(row: SessionRow): SessionRecord {
  return { ...row, tags: row.tags ?? [], seats: row.seats.map(seatRecord) };
}

export function sessionsRepository(db: Db) {
  const repo = {
    /** Session row, its seats, its hashed keys and event seq 1, in one transaction. */
    async create(input: CreateSessionInput): Promise<CreateSessionResult> {
      const { id, joinCode } = input;
      try {
        await db.$transaction([
          db.$executeRaw`INSERT INTO "Session"
            ("id", "joinCode", "title", "status", "scenario", "lastSeq", "updatedAt")
            VALUES (${id}, ${joinCode}, ${input.title}, ${input.status ?? "lobby"},
                    ${jsonb(input.scenario)}, 1, CURRENT_TIMESTAMP)`,
          db.seat.createMany({
            data: input.seats.map((seat) => ({
              sessionId: id,
              index: seat.index,
              name: seat.name,
              kind: seat.kind,
              displayName: seat.displayName ?? null,
            })),
          }),
          db.accessKey.createMany({ data: keyRows(id, input.keys) }),
          db.$executeRaw(insertEvents(id, 1, [input.firstEvent])),
        ]);
        const session = await repo.get(id);
        if (!session) throw new Error(`session ${id} vanished right after it was created`);
        return { ok: true, session };
      } catch (error) {
        if (isUniqueViolation(error)) {
          // Ask which one clashed rather than parse the driver's error, which differs by adapter.
          if (await db.session.findUnique({ where: { id }, select: { id: true } })) {
            return { ok: false, code: "conflict", field: "id" };
          }
          if (await db.session.findUnique({ where: { joinCode }, select: { id: true } })) {
            return { ok: false, code: "conflict", field: "joinCode" };
          }
        }
        throw error;
      }
    },

    async get(id: string): Promise<SessionRecord | null> {
      const row = await db.session.findUnique({ where: { id }, include: withSeats });
      return row && sessionRecord(row);
    },

    async byJoinCode(joinCode: string): Promise<SessionRecord | null> {
      const row = await db.session.findUnique({ where: { joinCode }, include: withSeats });
      return row && sessionRecord(row);
    },

    /** All sessions, newest first, without their scenarios. */
    async list(): Promise<SessionSummary[]> {
      return db.session.findMany({ select: summarySelect, orderBy: { createdAt: "desc" } });
    },

    /**
     * Deletes a session for good: its seats, keys and events go with it (the foreign keys
     * cascade), in one statement. Returns false when there was no such session.
     */
    async delete(id: string): Promise<boolean> {
      const { count } = await db.session.deleteMany({ where: { id } });
      return count === 1;
    },

    /** Deletes every session with no activity since `before` (the retention period); their ids. */
    async deleteIdleSince(before: Date): Promise<string[]> {
      const rows = await db.session.findMany({
        where: { updatedAt: { lt: before } },
        select: { id: true },
      });
      if (rows.length === 0) return [];
      const ids = rows.map((r) => r.id);
      await db.session.deleteMany({ where: { id: { in: ids }, updatedAt: { lt: before } } });
      return ids;
    },
  };
  return repo;
}
