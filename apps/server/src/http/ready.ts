/**
 * GET /api/ready, the readiness probe a reverse proxy or orchestrator polls before sending
 * players here: the database answers within the time allowed, every migration this code knows
 * is applied, and the process is not draining for a shutdown. The answer names only a reason
 * code; the database's own error text (host names, roles) goes to the log, never the client.
 */
import type { ServerResponse } from "node:http";
import type { Database } from "@contend/db";
import type { Ready } from "@contend/protocol";
import type { Clock } from "../clock";
import type { Logger } from "../logger";
import { sendJson } from "./io";

/** how long the database may take to answer before the process counts as not ready */
export const READY_TIMEOUT_MS = 2_000;

export interface ReadyDeps {
  db: Database;
  clock: Clock;
  logger: Logger;
  /** true once a shutdown has begun */
  draining: () => boolean;
}

export async function readiness(deps: ReadyDeps): Promise<Ready> {
  const { db, clock } = deps;
  if (deps.draining()) return { ok: false, db: db.kind, reason: "draining" };
  let timer: ReturnType<Clock["setTimer"]> | null = null;
  const timeout = new Promise<{ ok: false; reason: "unreachable"; message: string }>((resolve) => {
    timer = clock.setTimer(
      () =>
        resolve({
          ok: false,
          reason: "unreachable",
          message: `no answer within ${READY_TIMEOUT_MS} ms`,
        }),
      READY_TIMEOUT_MS,
    );
  });
  const status = await Promise.race([db.readiness(), timeout]);
  if (timer) clock.clearTimer(timer);
  if (status.ok) return { ok: true, db: db.kind };
  deps.logger.warn("not ready", { reason: status.reason, message: status.message });
  return { ok: false, db: db.kind, reason: status.reason };
}

export async function sendReady(res: ServerResponse, deps: ReadyDeps): Promise<void> {
  const body = await readiness(deps);
  sendJson(res, body.ok ? 200 : 503, body);
}
