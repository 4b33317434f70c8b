import { randomUUID } from "node:crypto";
import { hashKey } from "../credentials";
import type { SqlRunner } from "../sqlRunner";
import type { Db, KeyInput, Role } from "../types";

export function keyRows(sessionId: string, keys: KeyInput[]) {
  return keys.map((key) => ({
    id: randomUUID(),
    sessionId,
    role: key.role,
    seatIndex: key.seatIndex,
    hash: hashKey(key.plaintext),
  }));
}

export function keysRepository(db: Db, runner: SqlRunner) {
  return {
    /** Stores the sha256 of a key for a role (and seat). The plaintext is never written. */
    async add(sessionId: string, role: Role, seatIndex: number | null, plaintext: string) {
      const [row] = keyRows(sessionId, [{ role, seatIndex, plaintext }]);
      await db.accessKey.create({ data: row! });
      return { id: row!.id };
    },

    /**
     * A new key for a seat that revokes every earlier key of that seat, in one transaction: a
     * seat is held by one key at a time, so a fresh link takes it from whoever held the old one.
     * Returns how many keys were revoked.
     */
    async replaceSeat(sessionId: string, seatIndex: number, plaintext: string) {
      const [row] = keyRows(sessionId, [{ role: "seat", seatIndex, plaintext }]);
      const [revoked] = await db.$transaction([
        db.accessKey.deleteMany({ where: { sessionId, role: "seat", seatIndex } }),
        db.accessKey.create({ data: row! }),
      ]);
      return { id: row!.id, revoked: revoked.count };
    },

    /**
     * What a key grants in a session, or null. The lookup is by hash through a unique index,
     * so there is no byte-by-byte comparison of secrets to time: an attacker would have to
     * find a sha256 preimage; a constant-time compare would add nothing here.
     */
    async resolve(
      sessionId: string,
      plaintext: string,
    ): Promise<{ role: Role; seatIndex: number | null } | null> {
      // Every hello asks this, so it goes straight to SQL: through Prisma, compiling the query
      // cost more of a join storm's CPU than running it.
      const [row] = await runner.query<{
        sessionId: string;
        role: string;
        seatIndex: number | null;
      }>(`SELECT "sessionId", "role", "seatIndex" FROM "AccessKey" WHERE "hash" = $1`, [
        hashKey(plaintext),
      ]);
      if (!row || row.sessionId !== sessionId) return null;
      return {
        role: row.role as Role,
        seatIndex: row.seatIndex === null ? null : Number(row.seatIndex),
      };
    },
  };
}
