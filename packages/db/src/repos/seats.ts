import type { Db, SeatRecord } from "../types";
import { seatRecord } from "./rows";

export type ClaimResult =
  | { ok: true; seat: SeatRecord }
  | { ok: false; code: "not-found" }
  | { ok: false; code: "seat-claimed" };

export function seatsRepository(db: Db) {
  return {
    async list(sessionId: string): Promise<SeatRecord[]> {
      const rows = await db.seat.findMany({ where: { sessionId }, orderBy: { index: "asc" } });
      return rows.map(seatRecord);
    },

    /**
     * Marks an unclaimed seat as claimed. The check and the write are one conditional UPDATE,
     * so of two concurrent claims exactly one succeeds, on PGlite and on PostgreSQL alike.
     * To claim together with a seat-claimed event, use events.append's claimSeats instead.
     */
    async claim(sessionId: string, index: number, displayName: string): Promise<ClaimResult> {
      const { count } = await db.seat.updateMany({
        where: { sessionId, index, claimedAt: null },
        data: { displayName, claimedAt: new Date() },
      });
      const row = await db.seat.findUnique({ where: { sessionId_index: { sessionId, index } } });
      if (!row) return { ok: false, code: "not-found" };
      if (count === 0) return { ok: false, code: "seat-claimed" };
      return { ok: true, seat: seatRecord(row) };
    },
  };
}
