/**
 * The JSON endpoints under /api. Every body is validated by the protocol package; failures
 * answer {error: {code, path, message}} naming the field, and nothing internal leaks out.
 */
import type { IncomingMessage, ServerResponse } from "node:http";
import type { Database } from "@contend/db";
import {
  attachmentHeader,
  downloadFileName,
  nameProblem,
  parseSessionScenario,
} from "@contend/protocol";
import type { Health } from "@contend/protocol";
import { fold, truthSealed } from "@contend/session";
import type { Clock } from "../clock";
import type { Limits } from "../env";
import { buildExport, listItem, roundsCsv } from "../live/export";
import { createLiveSession } from "../live/create";
import { baseUrlOf } from "../live/links";
import { toSessionEvent } from "../live/hub";
import { summaryRoute } from "./summary";
import type { Logger } from "../logger";
import { credentialFrom, readJsonBody, sendError, sendJson, sendText } from "./io";
import { sendReady } from "./ready";

export interface RestDeps {
  db: Database;
  clock: Clock;
  logger: Logger;
  limits: Limits;
  adminKey: string | null;
  publicUrl: string | null;
  version: string;
  /** true once a shutdown has begun (readiness then answers 503) */
  draining: () => boolean;
}

const EXPORT_PATH = /^\/api\/sessions\/([^/]+)\/export\/?$/;
const SUMMARY_PATH = /^\/api\/sessions\/([^/]+)\/summary\/?$/;

export function createRestHandler(deps: RestDeps) {
  const { db } = deps;

  /** With an admin key configured, reading sessions needs it (or that session's facilitator key). */
  async function allowed(req: IncomingMessage, url: URL, sessionId: string | null) {
    if (deps.adminKey === null) return true;
    const presented = credentialFrom(req, url);
    if (presented === null) return false;
    if (presented === deps.adminKey) return true;
    if (sessionId === null) return false;
    const grant = await db.keys.resolve(sessionId, presented);
    return grant?.role === "facilitator";
  }

  async function createSessionRoute(req: IncomingMessage, res: ServerResponse) {
    const body = await readJsonBody(req, deps.limits.maxBodyBytes);
    if (!body.ok) return sendError(res, body.status, body.code, body.message);
    const parsed = parseSessionScenario(body.value);
    if (!parsed.ok) return sendError(res, 400, parsed.code, parsed.message, parsed.path);
    const created = await createLiveSession(db, parsed.value, {
      now: deps.clock.now(),
      baseUrl: baseUrlOf(deps.publicUrl, req),
    });
    deps.logger.info("session created", { sessionId: created.id, title: parsed.value.title });
    sendJson(res, 201, created);
  }

  async function listRoute(req: IncomingMessage, res: ServerResponse, url: URL) {
    if (!(await allowed(req, url, null))) {
      return sendError(res, 401, "unauthorized", "listing sessions needs the admin key");
    }
    const [summaries, counts] = await Promise.all([
      db.sessions.list(),
      db.events.countOfType("round-resolved"),
    ]);
    sendJson(
      res,
      200,
      summaries.map((s) => listItem(s, counts[s.id] ?? 0)),
    );
  }

  async function exportRoute(req: IncomingMessage, res: ServerResponse, url: URL, id: string) {
    if (id.length > 64) return sendError(res, 404, "not-found", "no such session");
    if (!(await allowed(req, url, id))) {
      return sendError(
        res,
        401,
        "unauthorized",
        "exporting needs the admin key or the session's facilitator key",
      );
    }
    const format = url.searchParams.get("format") ?? "json";
    if (format !== "json" && format !== "csv") {
      return sendError(res, 400, "bad-request", "format: must be json or csv", "format");
    }
    const summary = await db.sessions.get(id);
    if (!summary) return sendError(res, 404, "not-found", "no such session");
    const events = (await db.events.list(id)).map(toSessionEvent);
    // R41: a session with private numbers exports once it has ended, never before.
    const state = fold(events);
    if (state.status !== "empty" && truthSealed(state)) {
      return sendError(
        res,
        409,
        "wrong-state",
        "this session has private costs or values: its export is available once it has ended",
      );
    }
    const record = buildExport(summary, events);
    // Always an attachment: a link to it downloads a file instead of replacing the page.
    const disposition = {
      "content-disposition": attachmentHeader(
        downloadFileName(summary.title, format, summary.createdAt),
      ),
    };
    if (format === "json") return sendJson(res, 200, record, disposition);
    sendText(
      res,
      200,
      roundsCsv(record.rounds, record.shocks),
      "text/csv; charset=utf-8",
      disposition,
    );
  }

  function health(res: ServerResponse) {
    const body: Health = { ok: true, version: deps.version, db: db.kind };
    sendJson(res, 200, body);
  }

  /** Handles the request when it is an API route; returns false to let others try. */
  return async function handleApi(req: IncomingMessage, res: ServerResponse): Promise<boolean> {
    const url = new URL(req.url ?? "/", "http://localhost");
    const path = url.pathname;
    if (!path.startsWith("/api/") && path !== "/api") return false;
    const method = req.method ?? "GET";
    try {
      if (path === "/api/health" || path === "/api/health/") {
        if (method !== "GET" && method !== "HEAD") return methodNotAllowed(res, "GET");
        health(res);
      } else if (path === "/api/ready" || path === "/api/ready/") {
        if (method !== "GET" && method !== "HEAD") return methodNotAllowed(res, "GET");
        await sendReady(res, deps);
      } else if (path === "/api/sessions" || path === "/api/sessions/") {
        if (method === "POST") await createSessionRoute(req, res);
        else if (method === "GET") await listRoute(req, res, url);
        else methodNotAllowed(res, "GET, POST");
      } else if (SUMMARY_PATH.test(path)) {
        if (method !== "GET") return methodNotAllowed(res, "GET");
        const id = safeDecode(SUMMARY_PATH.exec(path)![1]!);
        if (id === null) sendError(res, 404, "not-found", "no such session");
        else await summaryRoute({ db, allowed: () => allowed(req, url, id) }, res, id);
      } else {
        const m = EXPORT_PATH.exec(path);
        if (m) {
          if (method !== "GET") return methodNotAllowed(res, "GET");
          const id = safeDecode(m[1]!);
          if (id === null) sendError(res, 404, "not-found", "no such session");
          else await exportRoute(req, res, url, id);
        } else {
          sendError(res, 404, "not-found", `no API route ${method} ${path}`);
        }
      }
    } catch (error) {
      deps.logger.error("API request failed", { method, path, error });
      if (!res.headersSent) sendError(res, 500, "internal", "internal error");
      else res.destroy();
    }
    return true;
  };
}

function methodNotAllowed(res: ServerResponse, allow: string): true {
  res.setHeader("allow", allow);
  sendError(res, 405, "bad-request", `method not allowed; use ${allow}`);
  return true;
}

/** A path segment as an id, or null when it cannot name a session (the text rule of ids). */
function safeDecode(segment: string): string | null {
  try {
    const id = decodeURIComponent(segment);
    return nameProblem(id) === null ? id : null;
  } catch {
    return null;
  }
}
