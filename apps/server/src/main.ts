/** Starts the server: environment, database, web app, sessions restored, then listen. */
import path from "node:path";
import { openDatabase } from "@contend/db";
import { createApplication } from "./app";
import { systemClock } from "./clock";
import { describeLinks, ensureDemoSession } from "./demo";
import { parseEnv, WEB_DIR } from "./env";
import { createConsoleLogger } from "./logger";
import { createShutdown } from "./shutdown";
import { loadWebApp } from "./web";

async function main() {
  const env = parseEnv();
  const logger = createConsoleLogger(env.logLevel);
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
    adminKey: env.adminKey,
    publicUrl: env.publicUrl,
    allowedOrigins: env.allowedOrigins,
  });
  const restored = await app.restore();
  const { port } = await app.listen(env.port, env.host);
  const shownHost = env.host === "0.0.0.0" || env.host === "::" ? "localhost" : env.host;
  const baseUrl = env.publicUrl ?? `http://${shownHost}:${port}`;
  logger.info(`listening on ${baseUrl}`, { restoredSessions: restored });
  if (env.demo) {
    const demo = await ensureDemoSession(db, { now: systemClock.now(), baseUrl });
    if (demo) console.log(`\n${describeLinks(demo)}\n`);
    else logger.info(`sessions are in the database; start a new one at ${baseUrl}/new`);
  }

  const stop = createShutdown({
    steps: [() => app.close(), async () => web?.close(), () => db.close()],
    clock: systemClock,
    logger,
    exit: (code) => process.exit(code),
  });
  process.on("SIGINT", () => void stop("SIGINT"));
  process.on("SIGTERM", () => void stop("SIGTERM"));
}

main().catch((error: unknown) => {
  console.error(error instanceof Error ? (error.stack ?? error.message) : error);
  process.exit(1);
});
