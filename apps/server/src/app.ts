/**
 * createApplication(deps) builds the HTTP server, the REST routes, socket.io and the live
 * session hub without listening; main.ts wires the real dependencies and listens. Tests start
 * it on port 0 with a real database in a temporary directory.
 */
import { createServer } from "node:http";
import type { IncomingMessage, Server as HttpServer, ServerResponse } from "node:http";
import type { AddressInfo } from "node:net";
import type { Duplex } from "node:stream";
import { Server } from "socket.io";
import type { Database } from "@contend/db";
import { systemClock } from "./clock";
import type { Clock } from "./clock";
import { DEFAULT_LIMITS } from "./env";
import type { Limits } from "./env";
import { createAbuseBudgets } from "./abuse";
import { setApiHeaders, setPageHeaders } from "./http/headers";
import { sendError, sendText } from "./http/io";
import { createRestHandler } from "./http/rest";
import { createSessionHub } from "./live/hub";
import type { SessionHub } from "./live/hub";
import { eventLoopGauge } from "./loadGauge";
import type { LoadGauge } from "./loadGauge";
import { silentLogger } from "./logger";
import type { Logger } from "./logger";
import { serverParser } from "./socket/encode";
import { attachSockets } from "./sockets";
import type { AppServer } from "./sockets";
import { placeholderPage } from "./web";
import type { NextRequestHandler, NextUpgradeHandler } from "./web";

export const SERVER_VERSION = "0.1.0";

export interface ApplicationDeps {
  db: Database;
  clock?: Clock;
  logger?: Logger;
  /** the built Next.js app's request handler; null serves a placeholder page */
  web?: NextRequestHandler | null;
  /** development only: Next's hot-reload upgrade handler */
  webUpgrade?: NextUpgradeHandler | null;
  limits?: Partial<Limits>;
  /** sha256 of the operator key (db's ensureOperatorKey); null or absent: no operator key */
  operatorKeyDigest?: Buffer | null;
  /** Next.js development mode: its hot reload needs eval in the page policy */
  webDev?: boolean;
  publicUrl?: string | null;
  /** origins allowed to open sockets besides the server's own (e.g. a separate dev server) */
  allowedOrigins?: string[];
  /** how busy the process is (default: its event-loop utilisation) */
  load?: LoadGauge;
  /** this worker's index with WORKERS above 1 (shown by /api/health); null or absent: alone */
  worker?: number | null;
}

export interface Application {
  http: HttpServer;
  io: AppServer;
  hub: SessionHub;
  /** rebuild every session that has not ended and re-arm its round clock */
  restore(): Promise<number>;
  /** a session was deleted outside a request (retention): forget it and close its sockets */
  sessionDeleted(sessionId: string): void;
  listen(port: number, host: string): Promise<{ port: number; host: string }>;
  close(): Promise<void>;
}

export const SOCKET_PATH = "/socket.io/";

export function createApplication(deps: ApplicationDeps): Application {
  const clock = deps.clock ?? systemClock;
  const logger = deps.logger ?? silentLogger;
  const limits: Limits = { ...DEFAULT_LIMITS, ...deps.limits };
  const hub = createSessionHub({ db: deps.db, clock, logger });
  const load = deps.load ?? eventLoopGauge();
  let draining = false;
  const budgets = createAbuseBudgets(limits, deps.db.pool);
  let sessionDeleted = (_sessionId: string) => {};
  const api = createRestHandler({
    db: deps.db,
    clock,
    logger,
    limits,
    operatorKeyDigest: deps.operatorKeyDigest ?? null,
    publicUrl: deps.publicUrl ?? null,
    version: SERVER_VERSION,
    worker: deps.worker ?? null,
    draining: () => draining,
    budgets,
    onDeleted: (id) => sessionDeleted(id),
  });
  const web = deps.web ?? null;
  const webUpgrade = deps.webUpgrade ?? null;
  const allowedOrigins = new Set(deps.allowedOrigins ?? []);

  async function onRequest(req: IncomingMessage, res: ServerResponse) {
    try {
      const path = (req.url ?? "/").split("?")[0] ?? "/";
      if (web && !path.startsWith("/api/")) setPageHeaders(req, res, deps.webDev ?? false);
      else setApiHeaders(res);
      if (await api(req, res)) return;
      if (web) return await web(req, res);
      if (path === "/" || !path.startsWith("/_next")) {
        sendText(res, 200, placeholderPage(), "text/html; charset=utf-8");
      } else {
        sendError(res, 404, "not-found", "the web app is not built");
      }
    } catch (error) {
      logger.error("request failed", { url: req.url, error });
      if (!res.headersSent) sendError(res, 500, "internal", "internal error");
      else res.destroy();
    }
  }

  const http = createServer((req, res) => void onRequest(req, res));
  // Slow or stuck clients must not hold sockets forever.
  http.requestTimeout = 30_000;
  http.headersTimeout = 20_000;

  const io: AppServer = new Server(http, {
    path: SOCKET_PATH,
    // socket.io's parser, sending pushed views as the JSON text written once per push
    parser: serverParser,
    serveClient: false,
    maxHttpBufferSize: limits.maxMessageBytes,
    // With a dev upgrade handler, non-socket.io upgrades are Next's; otherwise drop them.
    destroyUpgrade: webUpgrade === null,
    allowRequest: (req, callback) => callback(null, originAllowed(req, allowedOrigins)),
  });
  if (webUpgrade) {
    http.on("upgrade", (req: IncomingMessage, socket: Duplex, head: Buffer) => {
      if ((req.url ?? "").startsWith(SOCKET_PATH)) return;
      void webUpgrade(req, socket, head).catch(() => socket.destroy());
    });
  }
  const sockets = attachSockets({
    io,
    db: deps.db,
    hub,
    clock,
    logger,
    limits,
    publicUrl: deps.publicUrl ?? null,
    load,
    budgets,
  });
  sessionDeleted = (id) => {
    hub.forget(id);
    sockets.sessionDeleted(id);
  };

  let closing: Promise<void> | null = null;

  return {
    http,
    io,
    hub,
    restore: () => hub.restoreAll(),
    sessionDeleted: (id) => sessionDeleted(id),
    listen(port, host) {
      return new Promise((resolve, reject) => {
        const onError = (error: Error) => reject(error);
        http.once("error", onError);
        http.listen(port, host, () => {
          http.off("error", onError);
          const address = http.address() as AddressInfo;
          resolve({ port: address.port, host: address.address });
        });
      });
    },
    close() {
      closing ??= (async () => {
        // Drain: readiness turns 503 and the port stops taking connections at once, so a
        // proxy sends newcomers elsewhere; open sockets and requests carry on meanwhile.
        draining = true;
        if (http.listening) http.close();
        // The commit under way finishes; commands queued behind it are refused.
        await hub.close();
        // Every handler sends its ack (the committed move's, or a refusal) before transports close.
        await sockets.settled();
        sockets.stop();
        load.stop();
        // Close every transport once its buffered packets (those acks) are written: a
        // socket.io client reconnects by itself after a transport close, through the proxy to
        // a process still running. io.close() alone would discard what is still buffered.
        await closeTransports(io);
        await new Promise<void>((resolve) => {
          void io.close(() => resolve());
        });
        http.closeAllConnections();
      })();
      return closing;
    },
  };
}

/** Closes each client's connection after its write buffer drains; resolves when all are closed. */
function closeTransports(io: AppServer): Promise<void> {
  const conns = new Set([...io.of("/").sockets.values()].map((socket) => socket.conn));
  return Promise.all(
    [...conns].map(
      (conn) =>
        new Promise<void>((resolve) => {
          if (conn.readyState === "closed") return resolve();
          conn.once("close", () => resolve());
          conn.close();
        }),
    ),
  ).then(() => undefined);
}

/**
 * Browsers send Origin with every WebSocket and cross-site request; CORS settings do not
 * cover WebSockets, so compare it with the Host the request came to. Clients without an
 * Origin (scripts, tests) are not browsers and are let through.
 */
function originAllowed(req: IncomingMessage, allowed: ReadonlySet<string>): boolean {
  const origin = req.headers.origin;
  if (!origin) return true;
  if (allowed.has(origin)) return true;
  try {
    return new URL(origin).host === req.headers.host;
  } catch {
    return false;
  }
}
