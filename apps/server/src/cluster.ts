/**
 * WORKERS=N (PostgreSQL only): this primary process listens on the port and hands each
 * connection to one of N worker processes (node:cluster). @socket.io/sticky routes by the
 * socket.io session id, so every request of one client connection (long-polling included)
 * reaches the worker holding it. A new connection that names its Contend session
 * (SESSION_ROUTE_PARAM) goes to that session's worker (`workerForSession`), so one session's
 * sockets share one process: each commit is folded and pushed once, not once per process
 * holding some of its seats. Any other new connection goes to the worker with the fewest.
 * Workers share nothing but PostgreSQL, which fans commits out to all of them and gives each
 * session's clock to one (docs/deploy.md). A worker that dies is started again; SIGTERM
 * stops taking connections, drains every worker (each as a single server would) and exits.
 */
import cluster from "node:cluster";
import type { Worker } from "node:cluster";
import { createServer } from "node:http";
import { setupMaster } from "@socket.io/sticky";
import { ensureOperatorKey } from "@contend/db";
import { SESSION_ROUTE_PARAM } from "@contend/protocol";
import type { ServerEnv } from "./env";
import type { Logger } from "./logger";
import { SHUTDOWN_GRACE_MS } from "./shutdown";

/** The message a worker sends once it can take connections. */
export const WORKER_READY = "contend:worker-ready";
/** Which worker this is (0..N-1), kept across restarts; worker 0 also runs the demo and retention. */
export const WORKER_INDEX_VAR = "CONTEND_WORKER_INDEX";

/**
 * @socket.io/sticky's least-connection choice reads `clientsCount` off each Worker and keeps
 * it up to date; a worker still starting is weighed as if it were full, so no connection is
 * handed to it before it listens for them (the handle would be lost).
 */
const STARTING = 1_000_000_000;
type StickyWorker = Worker & { clientsCount?: number };

/** The worker index (0 to n-1) a session's connections go to: FNV-1a of its id, mod n. */
export function workerForSession(sessionId: string, n: number): number {
  let h = 0x811c9dc5;
  for (let i = 0; i < sessionId.length; i++) {
    h ^= sessionId.charCodeAt(i);
    h = Math.imul(h, 0x01000193) >>> 0;
  }
  return h % n;
}

const SID = /[?&]sid=/;
const SESSION = new RegExp(`[?&]${SESSION_ROUTE_PARAM}=([A-Za-z0-9_-]{1,100})(?:[&\\s]|$)`);

/**
 * @socket.io/sticky picks a new connection's worker with its least-connection rule, reading
 * `clientsCount` off each worker, and has no hook for another rule. This runs on each new
 * connection's first chunk just before sticky's own handler (prepended to it) and, when the
 * request names a session and carries no socket.io id yet, weighs every other ready worker
 * down for that one synchronous choice, so sticky picks the session's worker; the weights are
 * restored once the handler has run (a microtask later). A session whose worker is starting
 * or gone goes by the least-connection rule, as before.
 */
function steerToSession(
  http: ReturnType<typeof createServer>,
  indexOf: Map<number, number>,
  n: number,
) {
  http.on("connection", (socket) => {
    socket.prependOnceListener("data", (chunk: Buffer) => {
      const end = chunk.indexOf("\r\n");
      const line = chunk.subarray(0, end < 0 ? chunk.length : end).toString("latin1");
      if (SID.test(line)) return;
      const session = SESSION.exec(line)?.[1];
      if (!session) return;
      const target = workerForSession(session, n);
      const workers = Object.values(cluster.workers ?? {}) as StickyWorker[];
      const chosen = workers.find((w) => indexOf.get(w.id) === target);
      if (!chosen || (chosen.clientsCount ?? 0) >= STARTING) return;
      const others = workers.filter((w) => w !== chosen);
      for (const w of others) w.clientsCount = (w.clientsCount ?? 0) + STARTING;
      queueMicrotask(() => {
        for (const w of others) w.clientsCount = (w.clientsCount ?? 0) - STARTING;
      });
    });
  });
}

export async function runPrimary(env: ServerEnv, logger: Logger): Promise<void> {
  // Made (and printed) once here, before the workers read its digest.
  const operator = ensureOperatorKey(env.dataDir, env.operatorKey);
  const http = createServer();
  setupMaster(http, { loadBalancingMethod: "least-connection" });
  // Buffers stay Buffers over IPC (the first chunk of each connection travels with it).
  cluster.setupPrimary({ serialization: "advanced" });

  const indexOf = new Map<number, number>();
  // After setupMaster: its connection handler must have attached the handler this precedes.
  steerToSession(http, indexOf, env.workers);
  let stopping = false;

  function fork(index: number): Promise<void> {
    const worker: StickyWorker = cluster.fork({ [WORKER_INDEX_VAR]: String(index) });
    worker.clientsCount = STARTING;
    indexOf.set(worker.id, index);
    return new Promise((resolve) => {
      worker.on("message", (message: unknown) => {
        if ((message as { type?: string } | null)?.type !== WORKER_READY) return;
        worker.clientsCount = (worker.clientsCount ?? STARTING) - STARTING;
        logger.info("worker ready", { worker: index, pid: worker.process.pid });
        resolve();
      });
    });
  }

  cluster.on("exit", (worker, code, signal) => {
    const index = indexOf.get(worker.id) ?? 0;
    indexOf.delete(worker.id);
    if (stopping) return;
    logger.error("worker exited; starting it again", { worker: index, code, signal });
    void fork(index);
  });

  await Promise.all(Array.from({ length: env.workers }, (_, i) => fork(i)));
  await new Promise<void>((resolve, reject) => {
    http.once("error", reject);
    http.listen(env.port, env.host, () => resolve());
  });
  const shownHost = env.host === "0.0.0.0" || env.host === "::" ? "localhost" : env.host;
  const address = http.address();
  const port = typeof address === "object" && address ? address.port : env.port;
  const baseUrl = env.publicUrl ?? `http://${shownHost}:${port}`;
  logger.info(`listening on ${baseUrl} with ${env.workers} workers`);
  if (operator.created) {
    console.log(
      `\nOperator key (shown once; it lists and exports every session, keep it safe):\n  ${operator.created}\n` +
        `Open ${baseUrl}/replays#operator=${operator.created} to see every session.\n`,
    );
  }

  const stop = (signal: string) => {
    if (stopping) return;
    stopping = true;
    logger.info(`${signal}: draining ${env.workers} workers, then shutting down`);
    http.close();
    const workers = Object.values(cluster.workers ?? {}).filter((w): w is Worker => !!w);
    // Each worker drains within its own grace period; this one bounds the whole.
    const force = setTimeout(() => {
      logger.error("workers took too long to drain; exiting");
      process.exit(1);
    }, SHUTDOWN_GRACE_MS + 5_000);
    void Promise.all(
      workers.map(
        (w) =>
          new Promise<number>((resolve) => {
            w.once("exit", (code: number) => resolve(code));
            w.process.kill("SIGTERM");
          }),
      ),
    ).then((codes) => {
      clearTimeout(force);
      process.exit(codes.every((c) => c === 0) ? 0 : 1);
    });
  };
  process.on("SIGINT", () => stop("SIGINT"));
  process.on("SIGTERM", () => stop("SIGTERM"));
}
