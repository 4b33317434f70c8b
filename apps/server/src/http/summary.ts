/**
 * GET /api/sessions/:id/summary: the session's rounds and seats as numbers to compare
 * (`summarizeSession` in @contend/session computes them). Only resolved rounds count: the open
 * round's sealed moves stay private.
 */
import type { ServerResponse } from "node:http";
import type { Database } from "@contend/db";
import { fold, summarizeSession, truthSealed } from "@contend/session";
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
  // R41: a session with private numbers is summarised once it has ended, never before.
  const state = fold(events);
  if (state.status !== "empty" && truthSealed(state)) {
    return sendError(
      res,
      409,
      "wrong-state",
      "this session has private costs or values: its summary is available once it has ended",
    );
  }
  const summary = summarizeSession(events);
  if (!summary) return sendError(res, 404, "not-found", "no such session");
  sendJson(res, 200, summary);
}
