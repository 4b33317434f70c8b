/**
 * The library of sessions: search by title, tag and dates, and the facilitator's edits to a
 * session's entry (title, tags, archived). Filters and tags arrive already parsed by
 * @contend/protocol (library.ts), which owns the tag rule; this layer only stores them.
 * Edits leave `updatedAt` alone: it stays the last play activity (lists and retention use it).
 */
import { LIMITS } from "@contend/protocol";
import type { SessionFilter, SessionPatch } from "@contend/protocol";
import type { Prisma } from "../generated/prisma/client";
import type { Db, LibraryEntry } from "../types";
import { summarySelect } from "./rows";

const ENDED = "session-ended";
const RESOLVED = "round-resolved";

export type UpdateEntryResult =
  | { ok: true; entry: LibraryEntry }
  | { ok: false; code: "not-found" }
  /** the tags after the change would be more than LIMITS.tagsMax */
  | { ok: false; code: "too-many-tags"; count: number };

function range(from: Date | undefined, to: Date | undefined) {
  return from || to ? { ...(from ? { gte: from } : {}), ...(to ? { lte: to } : {}) } : undefined;
}

/**
 * Text for a LIKE pattern matched literally: Prisma's `contains` passes `%` and `_` through as
 * wildcards, so they (and the escape character) are escaped with PostgreSQL's default `\`.
 */
function likeLiteral(text: string): string {
  return text.replace(/[\\%_]/g, (c) => `\\${c}`);
}

/** Tags in order, each once: the old ones without the removed, then the added that are new. */
export function nextTags(
  old: readonly string[],
  add: readonly string[],
  remove: readonly string[],
) {
  const gone = new Set(remove);
  const out: string[] = [];
  for (const t of [...old, ...add]) if (!gone.has(t) && !out.includes(t)) out.push(t);
  return out;
}

export function libraryRepository(db: Db) {
  /** Adds when each session ended and how many rounds it resolved. */
  async function entries(
    rows: Prisma.SessionGetPayload<{ select: typeof summarySelect }>[],
  ): Promise<LibraryEntry[]> {
    if (rows.length === 0) return [];
    const ids = rows.map((r) => r.id);
    const [ended, resolved] = await Promise.all([
      db.event.findMany({
        where: { type: ENDED, sessionId: { in: ids } },
        select: { sessionId: true, at: true },
      }),
      db.event.groupBy({
        by: ["sessionId"],
        where: { type: RESOLVED, sessionId: { in: ids } },
        _count: { _all: true },
      }),
    ]);
    const endedAt = new Map(ended.map((e) => [e.sessionId, e.at]));
    const rounds = new Map(resolved.map((r) => [r.sessionId, r._count._all]));
    return rows.map((r) => ({
      ...r,
      tags: r.tags ?? [],
      endedAt: endedAt.get(r.id) ?? null,
      rounds: rounds.get(r.id) ?? 0,
    }));
  }

  const repo = {
    /**
     * Sessions matching the filter, last activity first; only those in `ids` when given (the
     * sessions a browser holds keys for). Title text matches case-insensitively anywhere in
     * the title, wildcards included literally.
     */
    async search(filter: SessionFilter, ids?: readonly string[]): Promise<LibraryEntry[]> {
      if (ids && ids.length === 0) return [];
      const ended = range(filter.endedFrom, filter.endedTo);
      const where: Prisma.SessionWhereInput = {
        ...(ids ? { id: { in: [...ids] } } : {}),
        ...(filter.q ? { title: { contains: likeLiteral(filter.q), mode: "insensitive" } } : {}),
        ...(filter.tag ? { tags: { has: filter.tag } } : {}),
        ...(filter.createdFrom || filter.createdTo
          ? { createdAt: range(filter.createdFrom, filter.createdTo) }
          : {}),
        ...(ended ? { events: { some: { type: ENDED, at: ended } } } : {}),
        ...(filter.archived === "hide"
          ? { archivedAt: null }
          : filter.archived === "only"
            ? { archivedAt: { not: null } }
            : {}),
      };
      const rows = await db.session.findMany({
        where,
        select: summarySelect,
        orderBy: [{ updatedAt: "desc" }, { id: "asc" }],
      });
      return entries(rows);
    },

    /** One session's library entry, or null. */
    async entry(id: string): Promise<LibraryEntry | null> {
      const row = await db.session.findUnique({ where: { id }, select: summarySelect });
      return row ? ((await entries([row]))[0] ?? null) : null;
    },

    /**
     * Renames, retags and archives (or unarchives) in one transaction; the session row is
     * locked while its tags are read and written, so two edits at once both count.
     */
    async update(id: string, patch: SessionPatch, now: Date): Promise<UpdateEntryResult> {
      const outcome = await db.$transaction(async (tx) => {
        const locked = await tx.$queryRaw<{ id: string }[]>`
          SELECT "id" FROM "Session" WHERE "id" = ${id} FOR UPDATE`;
        if (locked.length === 0) return { ok: false as const, code: "not-found" as const };
        const row = await tx.session.findUniqueOrThrow({
          where: { id },
          select: { tags: true, updatedAt: true, archivedAt: true },
        });
        const tags = nextTags(row.tags ?? [], patch.addTags ?? [], patch.removeTags ?? []);
        if (tags.length > LIMITS.tagsMax) {
          return { ok: false as const, code: "too-many-tags" as const, count: tags.length };
        }
        await tx.session.update({
          where: { id },
          data: {
            ...(patch.title !== undefined ? { title: patch.title } : {}),
            tags,
            ...(patch.archived === undefined
              ? {}
              : { archivedAt: patch.archived ? (row.archivedAt ?? now) : null }),
            // An edit is not play: keep the last activity (Prisma would set it to now).
            updatedAt: row.updatedAt,
          },
        });
        return { ok: true as const };
      });
      if (!outcome.ok) return outcome;
      const entry = await repo.entry(id);
      return entry ? { ok: true, entry } : { ok: false, code: "not-found" };
    },
  };
  return repo;
}
