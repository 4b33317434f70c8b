/**
 * The JSON endpoints under /api. Every body is validated by the protocol package; failures
 * answer {error: {code, path, message}} naming the field, and nothing internal leaks out.
 * Nothing about a session is read without a key for it (docs/security.md): the operator key
 * lists and exports every session, a facilitator key its own; keys travel only in the
 * Authorization header. An id the key does not open answers exactly like an unknown id.
 */
import type { IncomingMessage, ServerResponse } from "node:http";
import type { Database } from "@contend/db";
import { isOperatorKey } from "@contend/db";
import {
  attachmentHeader,
  downloadFileName,
  nameProblem,
  parseSessionScenario,
} from "@contend/protocol";
import type { Health } from "@contend/protocol";
import { clientAddress } from "../abuse";
import type { AbuseBudgets } from "../abuse";
import type { Clock } from "../clock";
import type { Limits } from "../env";
import { buildExport, frontNamesOf, roundsCsv } from "../live/export";
import { createLiveSession } from "../live/create";
import { baseUrlOf } from "../live/links";
import { summaryRoute } from "./summary";
import { libraryRoutes } from "./library";
import { savedScenarioRoutes } from "./savedScenarios";
import type { Logger } from "../logger";
import { credentialFrom, readJsonBody, sendError, sendJson, sendText } from "./io";
import { sendReady } from "./ready";
import { refusedWhileSealed } from "./sealed";

export interface RestDeps {
  db: Database;
  clock: Clock;
  logger: Logger;
  limits: Limits;
  /** sha256 of the operator key; null: no operator (facilitator keys only) */
  operatorKeyDigest: Buffer | null;
  publicUrl: string | null;
  version: string;
  /** this worker's index with WORKERS above 1; null when the process serves alone */
  worker: number | null;
  /** true once a shutdown has begun (readiness then answers 503) */
  draining: () => boolean;
  budgets: AbuseBudgets;
  /** a session was deleted: drop it from memory and close its sockets */
  onDeleted(sessionId: string): void;
}

const SESSION_PATH = /^\/api\/sessions\/([^/]+)\/?$/;
const EXPORT_PATH = /^\/api\/sessions\/([^/]+)\/export\/?$/;
const SUMMARY_PATH = /^\/api\/sessions\/([^/]+)\/summary\/?$/;
const MINE_PATH = /^\/api\/sessions\/mine\/?$/;

type Access = "operator" | "facilitator" | "none";

export function createRestHandler(deps: RestDeps) {
  const { db } = deps;
  const library = libraryRoutes({ ...deps, maxBodyBytes: deps.limits.maxBodyBytes });
  const scenarios = savedScenarioRoutes({
    ...deps,
    maxBodyBytes: deps.limits.maxBodyBytes,
    trustProxy: deps.limits.trustProxy,
    sessionsPerIpPerHour: deps.limits.sessionsPerIpPerHour,
  });

  /** What the request's key opens: every session (operator), this one (facilitator), or nothing. */
  async function access(presented: string, sessionId: string | null): Promise<Access> {
    if (isOperatorKey(deps.operatorKeyDigest, presented)) return "operator";
    if (sessionId === null) return "none";
    const grant = await db.keys.resolve(sessionId, presented);
    return grant?.role === "facilitator" ? "facilitator" : "none";
  }

  function noKey(res: ServerResponse, what: string) {
    res.setHeader("www-authenticate", "Bearer");
    sendError(res, 401, "unauthorized", `${what} needs a key: send Authorization: Bearer <key>`);
  }

  /** The one answer for an id that is unknown or that the key does not open. */
  function noSession(res: ServerResponse) {
    sendError(res, 404, "not-found", "no session with this id opens with this key");
  }

  async function createSessionRoute(req: IncomingMessage, res: ServerResponse) {
    const address = clientAddress(req, deps.limits.trustProxy);
    const body = await readJsonBody(req, deps.limits.maxBodyBytes);
    if (!body.ok) return sendError(res, body.status, body.code, body.message);
    const parsed = parseSessionScenario(body.value);
    if (!parsed.ok) return sendError(res, 400, parsed.code, parsed.message, parsed.path);
    if (!(await deps.budgets.sessions.take(address))) {
      return sendError(
        res,
        429,
        "rate-limited",
        `at most ${deps.limits.sessionsPerIpPerHour} new sessions an hour from one address`,
      );
    }
    const created = await createLiveSession(db, parsed.value, {
      now: deps.clock.now(),
      baseUrl: baseUrlOf(deps.publicUrl, req),
    });
    deps.logger.info("session created", { sessionId: created.id });
    sendJson(res, 201, created);
  }

  async function listRoute(req: IncomingMessage, res: ServerResponse, url: URL) {
    const presented = credentialFrom(req);
    if (presented === null) return noKey(res, "listing sessions");
    if ((await access(presented, null)) !== "operator") {
      return sendError(
        res,
        403,
        "forbidden",
        "listing every session needs the operator key; a browser lists its own with POST /api/sessions/mine",
      );
    }
    await library.listAll(res, url);
  }

  /** PATCH /api/sessions/<id>: rename, tag, archive; facilitator of this session or operator. */
  async function editRoute(req: IncomingMessage, res: ServerResponse, id: string) {
    const presented = credentialFrom(req);
    if (presented === null) return noKey(res, "editing a session");
    const who = await access(presented, id);
    if (who === "none") return noSession(res);
    await library.edit(req, res, id, who);
  }

  async function exportRoute(req: IncomingMessage, res: ServerResponse, url: URL, id: string) {
    const presented = credentialFrom(req);
    if (presented === null) return noKey(res, "exporting a session");
    if ((await access(presented, id)) === "none") return noSession(res);
    const format = url.searchParams.get("format") ?? "json";
    if (format !== "json" && format !== "csv") {
      return sendError(res, 400, "bad-request", "format: must be json or csv", "format");
    }
    const summary = await db.sessions.get(id);
    if (!summary) return noSession(res);
    const events = await db.events.list(id);
    if (refusedWhileSealed(res, events, "export")) return;
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
      roundsCsv(record.rounds, record.shocks, frontNamesOf(record.events)),
      "text/csv; charset=utf-8",
      disposition,
    );
  }

  /** DELETE /api/sessions/<id>: final; events, seats and keys go with it; logged. */
  async function deleteRoute(req: IncomingMessage, res: ServerResponse, id: string) {
    const presented = credentialFrom(req);
    if (presented === null) return noKey(res, "deleting a session");
    const who = await access(presented, id);
    if (who === "none") return noSession(res);
    if (!(await db.sessions.delete(id))) return noSession(res);
    deps.onDeleted(id);
    deps.logger.info("session deleted", { sessionId: id, by: who });
    res.writeHead(204, { "cache-control": "no-store" });
    res.end();
  }

  function health(res: ServerResponse) {
    const body: Health = { ok: true, version: deps.version, db: db.kind };
    if (deps.worker !== null) body.worker = deps.worker;
    sendJson(res, 200, body);
  }

  async function sessionRoute(
    req: IncomingMessage,
    res: ServerResponse,
    url: URL,
    method: string,
    path: string,
  ): Promise<void> {
    const summarised = SUMMARY_PATH.exec(path);
    if (summarised) {
      if (method !== "GET") return void methodNotAllowed(res, "GET");
      const sid = safeDecode(summarised[1] ?? "");
      if (sid === null) return noSession(res);
      const presented = credentialFrom(req);
      if (presented === null) return noKey(res, "a session's summary");
      if ((await access(presented, sid)) === "none") return noSession(res);
      return summaryRoute(db, res, sid);
    }
    const exported = EXPORT_PATH.exec(path);
    const single = exported ? null : SESSION_PATH.exec(path);
    const id = safeDecode((exported ?? single)?.[1] ?? "");
    if (exported) {
      if (method !== "GET") return void methodNotAllowed(res, "GET");
      if (id === null) return noSession(res);
      return exportRoute(req, res, url, id);
    }
    if (single) {
      if (method !== "DELETE" && method !== "PATCH") {
        return void methodNotAllowed(res, "PATCH, DELETE");
      }
      if (id === null) return noSession(res);
      return method === "PATCH" ? editRoute(req, res, id) : deleteRoute(req, res, id);
    }
    sendError(res, 404, "not-found", `no API route ${method} ${path}`);
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
      } else if (MINE_PATH.test(path)) {
        if (method === "POST") await library.listMine(req, res);
        else methodNotAllowed(res, "POST");
      } else if (!(await scenarios(req, res, method, path))) {
        await sessionRoute(req, res, url, method, path);
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
    return id !== "" && id.length <= 64 && nameProblem(id) === null ? id : null;
  } catch {
    return null;
  }
}
