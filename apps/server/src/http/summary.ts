/**
 * GET /api/sessions/:id/summary: the session's rounds and seats as numbers to compare
 * (`summarizeSession` in @contend/session computes them). Only resolved rounds count: the open
 * round's sealed moves stay private.
 */
import type { ServerResponse } from "node:http";
import type { Database } from "@contend/db";
import { summarizeSession } from "@contend/session";
import { publicEvents } from "../live/export";
import { toSessionEvent } from "../live/hub";
import { sendError, sendJson } from "./io";

export interface SummaryDeps {
  db: Database;
  /** the access check of the REST layer for this request and session */
  allowed: () => Promise<boolean>;
}

export async function summaryRoute(deps: SummaryDeps, res: ServerResponse, id: string) {
  if (id.length > 64) return sendError(res, 404, "not-found", "no such session");
  if (!(await deps.allowed())) {
    return sendError(
      res,
      401,
      "unauthorized",
      "the summary needs the admin key or the session's facilitator key",
    );
  }
  const session = await deps.db.sessions.get(id);
  if (!session) return sendError(res, 404, "not-found", "no such session");
  const events = publicEvents((await deps.db.events.list(id)).map(toSessionEvent));
  const summary = summarizeSession(events);
  if (!summary) return sendError(res, 404, "not-found", "no such session");
  sendJson(res, 200, summary);
}
