/**
 * GET /api/sessions/:id/summary: the session's rounds and seats as numbers to compare
 * (`summarizeSession` in @contend/session computes them). Only resolved rounds count: the open
 * round's sealed moves stay private.
 */
import type { ServerResponse } from "node:http";
import type { Database } from "@contend/db";
import { summarizeSession } from "@contend/session";
import { publicEvents } from "../live/export";
import { sendError, sendJson } from "./io";
import { refusedWhileSealed } from "./sealed";

/** The REST layer has checked the key (operator, or this session's facilitator). */
export async function summaryRoute(db: Database, res: ServerResponse, id: string) {
  const session = await db.sessions.get(id);
  if (!session) return sendError(res, 404, "not-found", "no such session");
  const events = publicEvents(await db.events.list(id));
  if (refusedWhileSealed(res, events, "summary")) return;
  const summary = summarizeSession(events, { tags: session.tags });
  if (!summary) return sendError(res, 404, "not-found", "no such session");
  // The library's title (a rename after the session was played) wins over the scenario's.
  sendJson(res, 200, { ...summary, session: { ...summary.session, title: session.title } });
}
