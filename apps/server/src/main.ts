/**
 * Starts the server: environment, database, web app, sessions restored, then listen. With
 * WORKERS=N the first process becomes the primary (cluster.ts) and each worker runs this
 * same start, taking its connections from the primary instead of listening.
 */
import cluster from "node:cluster";
import path from "node:path";
import { setupWorker } from "@socket.io/sticky";
import { ensureOperatorKey, openDatabase } from "@contend/db";
import type { Database } from "@contend/db";
import { createApplication } from "./app";
import type { Application } from "./app";
import type { Logger } from "./logger";
import { systemClock } from "./clock";
import { runPrimary, WORKER_INDEX_VAR, WORKER_READY } from "./cluster";
import { describeLinks, ensureDemoSession } from "./demo";
import { parseEnv, WEB_DIR } from "./env";
import { createConsoleLogger } from "./logger";
import { createShutdown } from "./shutdown";
import { loadWebApp } from "./web";

async function main() {
  const env = parseEnv();
  const logger = createConsoleLogger(env.logLevel);
  if (env.workers > 1 && cluster.isPrimary) return runPrimary(env, logger);
  /** this worker's index (WORKERS > 1); null when this process serves alone */
  const worker = cluster.isWorker ? Number(process.env[WORKER_INDEX_VAR] ?? 0) : null;
  /** one process runs the once-per-deployment chores: the demo session and retention */
  const chores = worker === null || worker === 0;
  const operator = ensureOperatorKey(env.dataDir, env.operatorKey);
  const db = await openDatabase({ url: env.databaseUrl });
  logger.info("database open", {
    kind: db.kind,
    where: db.kind === "pglite" ? path.relative(process.cwd(), env.databaseUrl) || "." : "postgres",
    migrationsApplied: db.migrationsApplied,
  });
  // Without its database the server could only refuse every command; exiting lets a
  // supervisor restart it, and the restart restores every session from the log.
  void db.lost.then((error) => {
    logger.error("database lost; exiting", { error: error.message });
    process.exit(1);
  });
  const web = env.web
    ? await loadWebApp({
        dir: WEB_DIR,
        dev: env.webDev,
        hostname: env.host,
        port: env.port,
        logger,
      })
    : null;
  if (!web) logger.info("web pages off; serving the API and a placeholder page");
  const app = createApplication({
    db,
    clock: systemClock,
    logger,
    web: web?.handle ?? null,
    webUpgrade: web?.upgrade ?? null,
    limits: env.limits,
    operatorKeyDigest: operator.digest,
    webDev: env.webDev,
    publicUrl: env.publicUrl,
    allowedOrigins: env.allowedOrigins,
    worker,
  });
  const restored = await app.restore();
  const shownHost = env.host === "0.0.0.0" || env.host === "::" ? "localhost" : env.host;
  let baseUrl = env.publicUrl ?? `http://${shownHost}:${env.port}`;
  if (worker === null) {
    const { port } = await app.listen(env.port, env.host);
    baseUrl = env.publicUrl ?? `http://${shownHost}:${port}`;
    logger.info(`listening on ${baseUrl}`, { restoredSessions: restored });
  } else {
    // The primary owns the port and hands this worker its connections.
    setupWorker(app.io);
    process.send?.({ type: WORKER_READY });
    logger.info("worker taking connections", { worker, restoredSessions: restored });
  }
  if (operator.created) {
    // Printed this once; only its digest is kept (docs/security.md).
    console.log(
      `\nOperator key (shown once; it lists and exports every session, keep it safe):\n  ${operator.created}\n` +
        `Open ${baseUrl}/replays#operator=${operator.created} to see every session.\n`,
    );
  }
  const stopRetention =
    env.retainDays === null || !chores ? () => {} : startRetention(db, env.retainDays, app, logger);
  if (env.demo && chores) {
    const demo = await ensureDemoSession(db, { now: systemClock.now(), baseUrl });
    if (demo) console.log(`\n${describeLinks(demo)}\n`);
    else logger.info(`sessions are in the database; start a new one at ${baseUrl}/new`);
  }

  const stop = createShutdown({
    steps: [
      async () => stopRetention(),
      () => app.close(),
      async () => web?.close(),
      () => db.close(),
    ],
    clock: systemClock,
    logger,
    exit: (code) => process.exit(code),
  });
  process.on("SIGINT", () => void stop("SIGINT"));
  process.on("SIGTERM", () => void stop("SIGTERM"));
}

/** Deletes sessions idle for longer than the retention period: at start, then every hour. */
function startRetention(db: Database, days: number, app: Application, logger: Logger): () => void {
  const sweep = async () => {
    const before = new Date(systemClock.now() - days * 86_400_000);
    const ids = await db.sessions.deleteIdleSince(before);
    for (const id of ids) {
      app.sessionDeleted(id);
      logger.info("session deleted", { sessionId: id, by: `retention (${days} days)` });
    }
  };
  const run = () =>
    void sweep().catch((error: unknown) => logger.error("retention failed", { error }));
  run();
  const timer = setInterval(run, 3_600_000);
  timer.unref();
  return () => clearInterval(timer);
}

main().catch((error: unknown) => {
  console.error(error instanceof Error ? (error.stack ?? error.message) : error);
  process.exit(1);
});
