/**
 * The library of sessions over REST: list and search (GET /api/sessions with the operator key,
 * POST /api/sessions/mine with facilitator keys), and PATCH /api/sessions/:id to rename, tag,
 * archive or unarchive. Filters and edits are parsed by @contend/protocol (library.ts), whose
 * errors name the field. Only a facilitator key of that session or the operator key may edit;
 * any other key gets the answer of an unknown id (docs/security.md).
 */
import type { IncomingMessage, ServerResponse } from "node:http";
import type { Database, LibraryEntry } from "@contend/db";
import {
  filterFromQuery,
  LIMITS,
  parseInput,
  sessionFilterSchema,
  sessionPatchSchema,
} from "@contend/protocol";
import type { SessionListItem } from "@contend/protocol";
import { z } from "zod";
import type { Clock } from "../clock";
import type { Logger } from "../logger";
import { readJsonBody, sendError, sendJson } from "./io";

/** Sessions a browser asks about at once (POST /api/sessions/mine). */
export const MINE_MAX = 200;

const mineBodySchema = z.strictObject({
  sessions: z
    .array(z.strictObject({ id: z.string().min(1).max(64), key: z.string().min(1).max(128) }))
    .max(MINE_MAX, { error: `must list at most ${MINE_MAX} sessions` }),
  /** the library search (archived sessions hidden unless `archived` says otherwise) */
  filter: z.unknown().optional(),
});

export function libraryItem(entry: LibraryEntry): SessionListItem {
  return {
    id: entry.id,
    title: entry.title,
    status: entry.status as SessionListItem["status"],
    createdAt: entry.createdAt.toISOString(),
    updatedAt: entry.updatedAt.toISOString(),
    rounds: entry.rounds,
    tags: entry.tags,
    archivedAt: entry.archivedAt?.toISOString() ?? null,
    endedAt: entry.endedAt?.toISOString() ?? null,
  };
}

export interface LibraryDeps {
  db: Database;
  clock: Clock;
  logger: Logger;
  maxBodyBytes: number;
}

export function libraryRoutes(deps: LibraryDeps) {
  const { db } = deps;

  /** GET /api/sessions: the operator's search over every session (the caller checked the key). */
  async function listAll(res: ServerResponse, url: URL) {
    const filter = parseInput(sessionFilterSchema, filterFromQuery(url.searchParams));
    if (!filter.ok) return sendError(res, 400, filter.code, filter.message, filter.path);
    sendJson(res, 200, (await db.library.search(filter.value)).map(libraryItem));
  }

  /** POST /api/sessions/mine: the sessions among those listed whose facilitator key is right. */
  async function listMine(req: IncomingMessage, res: ServerResponse) {
    const body = await readJsonBody(req, deps.maxBodyBytes);
    if (!body.ok) return sendError(res, body.status, body.code, body.message);
    const parsed = parseInput(mineBodySchema, body.value);
    if (!parsed.ok) return sendError(res, 400, parsed.code, parsed.message, parsed.path);
    const filter = parseInput(sessionFilterSchema, parsed.value.filter ?? {});
    if (!filter.ok) {
      const path = filter.path === "" ? "filter" : `filter.${filter.path}`;
      return sendError(res, 400, filter.code, `filter.${filter.message}`, path);
    }
    const open: string[] = [];
    for (const { id, key } of parsed.value.sessions) {
      const grant = await db.keys.resolve(id, key);
      if (grant?.role === "facilitator") open.push(id);
    }
    sendJson(res, 200, (await db.library.search(filter.value, open)).map(libraryItem));
  }

  /**
   * PATCH /api/sessions/:id (the caller checked the key: operator, or this session's
   * facilitator). 200 with the session's list item.
   */
  async function edit(req: IncomingMessage, res: ServerResponse, id: string, by: string) {
    const body = await readJsonBody(req, deps.maxBodyBytes);
    if (!body.ok) return sendError(res, body.status, body.code, body.message);
    const patch = parseInput(sessionPatchSchema, body.value);
    if (!patch.ok) return sendError(res, 400, patch.code, patch.message, patch.path);
    const result = await db.library.update(id, patch.value, new Date(deps.clock.now()));
    if (!result.ok && result.code === "not-found") {
      return sendError(res, 404, "not-found", "no session with this id opens with this key");
    }
    if (!result.ok) {
      return sendError(
        res,
        400,
        "bad-request",
        `addTags: a session carries at most ${LIMITS.tagsMax} tags (this change would give it ${result.count})`,
        "addTags",
      );
    }
    deps.logger.info("session edited", { sessionId: id, by, fields: Object.keys(patch.value) });
    sendJson(res, 200, libraryItem(result.entry));
  }

  return { listAll, listMine, edit };
}
