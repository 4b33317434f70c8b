/**
 * Saved scenarios with numbered versions. A saved scenario opens with its own library key
 * (only the sha256 is stored, as for session keys) or the operator key, which the server
 * checks; bodies arrive already validated by @contend/protocol and are stored exactly
 * (written as jsonb text, so every double comes back bit for bit).
 */
import { hashKey } from "../credentials";
import type { Db } from "../types";
import { isUniqueViolation, jsonb } from "./rows";

export interface SavedVersionRecord {
  version: number;
  note: string;
  createdAt: Date;
}

export interface SavedScenarioRecord {
  id: string;
  name: string;
  createdAt: Date;
  /** newest first */
  versions: SavedVersionRecord[];
}

export interface SavedVersionBody extends SavedVersionRecord {
  body: unknown;
}

export type CreateSavedResult =
  { ok: true; version: 1 } | { ok: false; code: "conflict"; field: "id" | "key" };

export type AddVersionResult = { ok: true; version: number } | { ok: false; code: "not-found" };

const withVersions = {
  versions: {
    select: { version: true, note: true, createdAt: true },
    orderBy: { version: "desc" },
  },
} as const;

const listed = { id: true, name: true, createdAt: true, ...withVersions } as const;

/** Two saves of the same scenario at once may pick the same number: the loser tries again. */
const VERSION_ATTEMPTS = 5;

export function savedScenariosRepository(db: Db) {
  async function insertVersion(id: string, note: string, body: unknown): Promise<number | null> {
    const rows = await db.$queryRaw<{ version: number }[]>`
      INSERT INTO "SavedScenarioVersion" ("scenarioId", "version", "note", "body")
      SELECT s."id", COALESCE((SELECT MAX(v."version") FROM "SavedScenarioVersion" v
                               WHERE v."scenarioId" = s."id"), 0) + 1, ${note}, ${jsonb(body)}
      FROM "SavedScenario" s WHERE s."id" = ${id}
      RETURNING "version"`;
    const row = rows[0];
    return row ? Number(row.version) : null;
  }

  return {
    /** A new saved scenario with its version 1; the key's hash opens it from now on. */
    async create(input: {
      id: string;
      name: string;
      key: string;
      note: string;
      body: unknown;
    }): Promise<CreateSavedResult> {
      const keyHash = hashKey(input.key);
      try {
        await db.$transaction([
          db.savedScenario.create({ data: { id: input.id, name: input.name, keyHash } }),
          db.$executeRaw`INSERT INTO "SavedScenarioVersion" ("scenarioId", "version", "note", "body")
            VALUES (${input.id}, 1, ${input.note}, ${jsonb(input.body)})`,
        ]);
        return { ok: true, version: 1 };
      } catch (error) {
        if (!isUniqueViolation(error)) throw error;
        const clash = await db.savedScenario.findUnique({
          where: { id: input.id },
          select: { id: true },
        });
        return { ok: false, code: "conflict", field: clash ? "id" : "key" };
      }
    },

    /** Saves the next version (numbered one past the newest). */
    async addVersion(id: string, note: string, body: unknown): Promise<AddVersionResult> {
      for (let attempt = 1; ; attempt++) {
        try {
          const version = await insertVersion(id, note, body);
          return version === null ? { ok: false, code: "not-found" } : { ok: true, version };
        } catch (error) {
          if (!isUniqueViolation(error) || attempt >= VERSION_ATTEMPTS) throw error;
        }
      }
    },

    /** True when `key` is this saved scenario's library key. */
    async keyOpens(id: string, key: string): Promise<boolean> {
      const row = await db.savedScenario.findUnique({
        where: { keyHash: hashKey(key) },
        select: { id: true },
      });
      return row?.id === id;
    },

    async get(id: string): Promise<SavedScenarioRecord | null> {
      return db.savedScenario.findUnique({
        where: { id },
        select: listed,
      });
    },

    /** The saved scenarios among `ids` (every one when ids is omitted), newest save first. */
    async list(ids?: readonly string[]): Promise<SavedScenarioRecord[]> {
      if (ids && ids.length === 0) return [];
      const rows = await db.savedScenario.findMany({
        where: ids ? { id: { in: [...ids] } } : {},
        select: listed,
      });
      const newest = (r: SavedScenarioRecord) => r.versions[0]?.createdAt.getTime() ?? 0;
      return rows.sort((a, b) => newest(b) - newest(a) || a.id.localeCompare(b.id));
    },

    /** Gives a saved scenario a new name (its versions stay); null when there is none. */
    async rename(id: string, name: string): Promise<SavedScenarioRecord | null> {
      const { count } = await db.savedScenario.updateMany({ where: { id }, data: { name } });
      if (count !== 1) return null;
      return db.savedScenario.findUnique({ where: { id }, select: listed });
    },

    async version(id: string, version: number): Promise<SavedVersionBody | null> {
      const row = await db.savedScenarioVersion.findUnique({
        where: { scenarioId_version: { scenarioId: id, version } },
        select: { version: true, note: true, createdAt: true, body: true },
      });
      return row;
    },

    /** Deletes a saved scenario and all its versions; false when there was none. */
    async delete(id: string): Promise<boolean> {
      const { count } = await db.savedScenario.deleteMany({ where: { id } });
      return count === 1;
    },
  };
}
