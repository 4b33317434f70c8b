/**
 * The saved-scenario library over REST. A saved scenario may hold private numbers, so it is
 * private by default: the first save (POST /api/scenarios) answers a library key, shown once
 * and stored hashed; that key or the operator key (Authorization: Bearer) opens it from then
 * on, and any other key gets the answer of an unknown id. Bodies are session scenarios,
 * checked by @contend/protocol, so any version starts a session through POST /api/sessions.
 *
 *   POST   /api/scenarios                      {name, note?, scenario} -> 201 {id, key, version: 1}
 *   GET    /api/scenarios                      operator: every saved scenario
 *   POST   /api/scenarios/mine                 {scenarios: [{id, key}]} -> those the keys open
 *   GET    /api/scenarios/:id                  -> {id, name, createdAt, versions (newest first)}
 *   PATCH  /api/scenarios/:id                  {name} -> the renamed entry (as GET answers it)
 *   POST   /api/scenarios/:id/versions         {note?, scenario} -> 201 {version}
 *   GET    /api/scenarios/:id/versions/:n      -> {version, note, createdAt, scenario}
 *   DELETE /api/scenarios/:id                  -> 204 (every version goes)
 */
import { randomBytes } from "node:crypto";
import type { IncomingMessage, ServerResponse } from "node:http";
import type { Database, SavedScenarioRecord } from "@contend/db";
import { isOperatorKey, newKey } from "@contend/db";
import {
  mineScenariosBodySchema,
  parseInput,
  parseScenarioSave,
  renameScenarioBodySchema,
} from "@contend/protocol";
import type { SavedScenario } from "@contend/protocol";
import { clientAddress } from "../abuse";
import type { AbuseBudgets } from "../abuse";
import type { Logger } from "../logger";
import { credentialFrom, readJsonBody, sendError, sendJson } from "./io";

export interface SavedScenarioDeps {
  db: Database;
  logger: Logger;
  maxBodyBytes: number;
  operatorKeyDigest: Buffer | null;
  budgets: AbuseBudgets;
  trustProxy: boolean;
  sessionsPerIpPerHour: number;
}

const ONE = /^\/api\/scenarios\/([A-Za-z0-9_-]{1,64})\/?$/;
const VERSIONS = /^\/api\/scenarios\/([A-Za-z0-9_-]{1,64})\/versions\/?$/;
const VERSION = /^\/api\/scenarios\/([A-Za-z0-9_-]{1,64})\/versions\/([1-9]\d{0,8})\/?$/;

function wire(s: SavedScenarioRecord): SavedScenario {
  return {
    id: s.id,
    name: s.name,
    createdAt: s.createdAt.toISOString(),
    versions: s.versions.map((v) => ({
      version: v.version,
      note: v.note,
      createdAt: v.createdAt.toISOString(),
    })),
  };
}

export function savedScenarioRoutes(deps: SavedScenarioDeps) {
  const { db } = deps;

  function notFound(res: ServerResponse) {
    sendError(res, 404, "not-found", "no saved scenario with this id opens with this key");
  }

  function allowed(res: ServerResponse, method: string, allow: string): boolean {
    if (allow.split(", ").includes(method)) return true;
    res.setHeader("allow", allow);
    sendError(res, 405, "bad-request", `method not allowed; use ${allow}`);
    return false;
  }

  /** The key of the request opens this saved scenario (its own key, or the operator's). */
  async function opens(req: IncomingMessage, res: ServerResponse, id: string) {
    const key = credentialFrom(req);
    if (key === null) {
      res.setHeader("www-authenticate", "Bearer");
      sendError(
        res,
        401,
        "unauthorized",
        "a saved scenario needs its library key: send Authorization: Bearer <key>",
      );
      return false;
    }
    if (isOperatorKey(deps.operatorKeyDigest, key) || (await db.scenarios.keyOpens(id, key))) {
      return true;
    }
    notFound(res);
    return false;
  }

  async function create(req: IncomingMessage, res: ServerResponse) {
    const body = await readJsonBody(req, deps.maxBodyBytes);
    if (!body.ok) return sendError(res, body.status, body.code, body.message);
    const parsed = parseScenarioSave(body.value, true);
    if (!parsed.ok) return sendError(res, 400, parsed.code, parsed.message, parsed.path);
    if (!(await deps.budgets.sessions.take(clientAddress(req, deps.trustProxy)))) {
      return sendError(
        res,
        429,
        "rate-limited",
        `at most ${deps.sessionsPerIpPerHour} new sessions or saved scenarios an hour from one address`,
      );
    }
    const { name = "", note, scenario } = parsed.value;
    for (;;) {
      const id = randomBytes(12).toString("base64url");
      const key = newKey();
      const saved = await db.scenarios.create({ id, name, key, note, body: scenario });
      if (saved.ok) {
        deps.logger.info("scenario saved", { scenarioId: id, version: 1 });
        return sendJson(res, 201, { id, key, version: 1 });
      }
      // a clash of 96 or 256 random bits: draw again
    }
  }

  async function mine(req: IncomingMessage, res: ServerResponse) {
    const body = await readJsonBody(req, deps.maxBodyBytes);
    if (!body.ok) return sendError(res, body.status, body.code, body.message);
    const parsed = parseInput(mineScenariosBodySchema, body.value);
    if (!parsed.ok) return sendError(res, 400, parsed.code, parsed.message, parsed.path);
    const open: string[] = [];
    for (const { id, key } of parsed.value.scenarios) {
      if (await db.scenarios.keyOpens(id, key)) open.push(id);
    }
    sendJson(res, 200, (await db.scenarios.list(open)).map(wire));
  }

  async function addVersion(req: IncomingMessage, res: ServerResponse, id: string) {
    const body = await readJsonBody(req, deps.maxBodyBytes);
    if (!body.ok) return sendError(res, body.status, body.code, body.message);
    const parsed = parseScenarioSave(body.value, false);
    if (!parsed.ok) return sendError(res, 400, parsed.code, parsed.message, parsed.path);
    const added = await db.scenarios.addVersion(id, parsed.value.note, parsed.value.scenario);
    if (!added.ok) return notFound(res);
    deps.logger.info("scenario saved", { scenarioId: id, version: added.version });
    sendJson(res, 201, { version: added.version });
  }

  async function rename(req: IncomingMessage, res: ServerResponse, id: string) {
    const body = await readJsonBody(req, deps.maxBodyBytes);
    if (!body.ok) return sendError(res, body.status, body.code, body.message);
    const parsed = parseInput(renameScenarioBodySchema, body.value);
    if (!parsed.ok) return sendError(res, 400, parsed.code, parsed.message, parsed.path);
    const renamed = await db.scenarios.rename(id, parsed.value.name);
    if (!renamed) return notFound(res);
    deps.logger.info("scenario renamed", { scenarioId: id });
    sendJson(res, 200, wire(renamed));
  }

  /** Handles /api/scenarios routes; false when the path is not one of them. */
  return async function handle(
    req: IncomingMessage,
    res: ServerResponse,
    method: string,
    path: string,
  ): Promise<boolean> {
    if (path === "/api/scenarios" || path === "/api/scenarios/") {
      if (!allowed(res, method, "GET, POST")) return true;
      if (method === "POST") await create(req, res);
      else {
        const key = credentialFrom(req);
        if (key === null || !isOperatorKey(deps.operatorKeyDigest, key)) {
          sendError(
            res,
            key === null ? 401 : 403,
            key === null ? "unauthorized" : "forbidden",
            "listing every saved scenario needs the operator key; a browser lists its own with POST /api/scenarios/mine",
          );
        } else sendJson(res, 200, (await db.scenarios.list()).map(wire));
      }
      return true;
    }
    if (path === "/api/scenarios/mine" || path === "/api/scenarios/mine/") {
      if (allowed(res, method, "POST")) await mine(req, res);
      return true;
    }
    const version = VERSION.exec(path);
    if (version) {
      const [, id = "", n = ""] = version;
      if (!allowed(res, method, "GET") || !(await opens(req, res, id))) return true;
      const found = await db.scenarios.version(id, Number(n));
      if (!found) {
        sendError(res, 404, "not-found", `this saved scenario has no version ${n}`, "version");
        return true;
      }
      const { body, createdAt, ...info } = found;
      sendJson(res, 200, { ...info, createdAt: createdAt.toISOString(), scenario: body });
      return true;
    }
    const versions = VERSIONS.exec(path);
    if (versions) {
      const id = versions[1] ?? "";
      if (allowed(res, method, "POST") && (await opens(req, res, id))) {
        await addVersion(req, res, id);
      }
      return true;
    }
    const one = ONE.exec(path);
    if (one) {
      const id = one[1] ?? "";
      if (!allowed(res, method, "GET, PATCH, DELETE") || !(await opens(req, res, id))) return true;
      if (method === "PATCH") await rename(req, res, id);
      else if (method === "GET") {
        const saved = await db.scenarios.get(id);
        if (saved) sendJson(res, 200, wire(saved));
        else notFound(res);
      } else if (await db.scenarios.delete(id)) {
        deps.logger.info("scenario deleted", { scenarioId: id });
        res.writeHead(204, { "cache-control": "no-store" });
        res.end();
      } else notFound(res);
      return true;
    }
    if (path.startsWith("/api/scenarios/")) {
      notFound(res);
      return true;
    }
    return false;
  };
}
