/**
 * The only reader of process.env in the server. Parsed once with zod so a typo in a variable
 * fails at start with a clear message instead of surfacing later as odd behaviour.
 */
import { existsSync } from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { resolveTarget } from "@contend/db";
import { z } from "zod";
import { DEFAULT_ABUSE_LIMITS } from "./abuse";
import type { AbuseLimits } from "./abuse";

const here = path.dirname(fileURLToPath(import.meta.url));
/** apps/server */
export const SERVER_ROOT = path.resolve(here, "..");
/** apps/web, whose built Next.js app the server hands page requests to */
export const WEB_DIR = path.resolve(SERVER_ROOT, "../web");

const positiveInt = (fallback: number) => z.coerce.number().int().positive().default(fallback);
const positiveNumber = (fallback: number) => z.coerce.number().positive().default(fallback);

const EnvSchema = z.object({
  PORT: z.coerce.number().int().min(0).max(65535).default(3000),
  HOST: z.string().min(1).default("0.0.0.0"),
  /** postgres://... for a PostgreSQL server, or a directory for embedded PGlite */
  DATABASE_URL: z.string().min(1).optional(),
  /** where the embedded database lives when DATABASE_URL is not set */
  CONTEND_DATA_DIR: z.string().min(1).optional(),
  /**
   * opens every session's list and export; unset: one is made on first start, printed once,
   * and only its sha256 kept in the data directory
   */
  CONTEND_OPERATOR_KEY: z.string().min(24, { error: "must be at least 24 characters" }).optional(),
  /** delete sessions with no activity for this many days (checked hourly); unset: keep */
  CONTEND_RETAIN_DAYS: z.coerce.number().int().positive().optional(),
  /** "on" behind a reverse proxy: limits count the last X-Forwarded-For address */
  TRUST_PROXY: z.enum(["on", "off"]).default("off"),
  /** abuse limits per client address (see docs/security.md) */
  LIMIT_CONNECTIONS_PER_IP: positiveInt(200),
  LIMIT_CONNECTS_PER_IP_PER_MINUTE: positiveInt(400),
  LIMIT_MESSAGES_PER_IP_PER_SECOND: positiveInt(400),
  LIMIT_AUTH_FAILURES_PER_IP_PER_MINUTE: positiveInt(20),
  LIMIT_SESSIONS_PER_IP_PER_HOUR: positiveInt(30),
  WEB: z.enum(["on", "off"]).optional(),
  /** Next.js development mode (hot reload); off for `npm start` */
  WEB_DEV: z.enum(["on", "off"]).default("off"),
  /** base address printed in links, e.g. https://workshop.example.org */
  PUBLIC_URL: z.url().optional(),
  /** token bucket per socket connection */
  RATE_LIMIT_PER_SECOND: positiveNumber(20),
  RATE_LIMIT_BURST: positiveInt(40),
  /** largest socket.io message in bytes */
  MAX_MESSAGE_BYTES: positiveInt(64 * 1024),
  /** largest REST body in bytes */
  MAX_BODY_BYTES: positiveInt(256 * 1024),
  /** ms another seat's seal may wait to reach the rest of a session, merged with others; 0: at once */
  PROGRESS_PUSH_MS: z.coerce.number().int().min(0).max(5_000).default(200),
  /** the same window when the event loop is near full (longer merges fewer frames); see loadGauge.ts */
  PROGRESS_PUSH_BUSY_MS: z.coerce.number().int().min(0).max(5_000).default(1_000),
  /** "off" skips creating the demo session on an empty database */
  DEMO: z.enum(["on", "off"]).default("on"),
  LOG_LEVEL: z.enum(["debug", "info", "warn", "error"]).default("info"),
  /** worker processes behind one port (node:cluster, sticky by socket.io session); >1 needs PostgreSQL */
  WORKERS: positiveInt(1),
  /** comma-separated extra origins allowed to open sockets (e.g. a separate dev server) */
  ALLOWED_ORIGINS: z.string().optional(),
});

export interface ServerEnv {
  port: number;
  host: string;
  databaseUrl: string;
  /** where the server keeps its files (the embedded database, the operator key's digest) */
  dataDir: string;
  operatorKey: string | null;
  retainDays: number | null;
  web: boolean;
  webDev: boolean;
  publicUrl: string | null;
  limits: Limits;
  demo: boolean;
  logLevel: "debug" | "info" | "warn" | "error";
  allowedOrigins: string[];
  /** worker processes behind one port (1: this process serves alone) */
  workers: number;
}

export interface Limits extends AbuseLimits {
  ratePerSecond: number;
  rateBurst: number;
  maxMessageBytes: number;
  maxBodyBytes: number;
  /** see PROGRESS_PUSH_MS */
  progressPushMs: number;
  /** see PROGRESS_PUSH_BUSY_MS; at or below progressPushMs the window never stretches */
  progressPushBusyMs: number;
}

export const DEFAULT_LIMITS: Limits = {
  ratePerSecond: 20,
  rateBurst: 40,
  maxMessageBytes: 64 * 1024,
  maxBodyBytes: 256 * 1024,
  progressPushMs: 200,
  progressPushBusyMs: 1_000,
  ...DEFAULT_ABUSE_LIMITS,
};

/** Parses an environment (process.env by default); throws with every problem listed. */
export function parseEnv(source: Record<string, string | undefined> = process.env): ServerEnv {
  // Empty strings mean "unset": shells and .env files often export VAR= to clear a value.
  const cleaned = Object.fromEntries(Object.entries(source).filter(([, v]) => v !== ""));
  const parsed = EnvSchema.safeParse(cleaned);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join(".")}: ${i.message}`);
    throw new Error(`invalid environment:\n${lines.join("\n")}`);
  }
  const e = parsed.data;
  if (cleaned.CONTEND_ADMIN_KEY !== undefined) {
    // The old name must not be ignored silently: a server that thinks it is keyed would print a
    // new operator key and the old one would stop working.
    throw new Error(
      "invalid environment:\n  CONTEND_ADMIN_KEY: renamed CONTEND_OPERATOR_KEY (at least 24 characters); " +
        "set that instead, or unset both to have the first start make a key",
    );
  }
  const workers = workersProblem(e.WORKERS, e.DATABASE_URL);
  if (workers) throw new Error(`invalid environment:\n  WORKERS: ${workers}`);
  const root = path.resolve(e.CONTEND_DATA_DIR ?? path.join(SERVER_ROOT, "data"));
  const dataDir = path.join(root, "pglite");
  const web = e.WEB ? e.WEB === "on" : existsSync(path.join(WEB_DIR, ".next"));
  return {
    port: e.PORT,
    host: e.HOST,
    databaseUrl: e.DATABASE_URL ?? dataDir,
    dataDir: root,
    operatorKey: e.CONTEND_OPERATOR_KEY ?? null,
    retainDays: e.CONTEND_RETAIN_DAYS ?? null,
    web,
    webDev: e.WEB_DEV === "on",
    publicUrl: e.PUBLIC_URL ? e.PUBLIC_URL.replace(/\/+$/, "") : null,
    limits: {
      ratePerSecond: e.RATE_LIMIT_PER_SECOND,
      rateBurst: e.RATE_LIMIT_BURST,
      maxMessageBytes: e.MAX_MESSAGE_BYTES,
      maxBodyBytes: e.MAX_BODY_BYTES,
      progressPushMs: e.PROGRESS_PUSH_MS,
      progressPushBusyMs: e.PROGRESS_PUSH_BUSY_MS,
      connectionsPerIp: e.LIMIT_CONNECTIONS_PER_IP,
      connectsPerIpPerMinute: e.LIMIT_CONNECTS_PER_IP_PER_MINUTE,
      messagesPerIpPerSecond: e.LIMIT_MESSAGES_PER_IP_PER_SECOND,
      authFailuresPerIpPerMinute: e.LIMIT_AUTH_FAILURES_PER_IP_PER_MINUTE,
      sessionsPerIpPerHour: e.LIMIT_SESSIONS_PER_IP_PER_HOUR,
      trustProxy: e.TRUST_PROXY === "on",
    },
    demo: e.DEMO === "on",
    logLevel: e.LOG_LEVEL,
    workers: e.WORKERS,
    allowedOrigins: (e.ALLOWED_ORIGINS ?? "")
      .split(",")
      .map((o) => o.trim())
      .filter((o) => o !== ""),
  };
}

/**
 * Several workers share one database, which the embedded one cannot be (one process holds its
 * directory), so any N > 1 without PostgreSQL is refused plainly rather than ignored.
 */
function workersProblem(workers: number, databaseUrl: string | undefined): string | null {
  if (workers === 1) return null;
  if (databaseUrl === undefined || resolveTarget(databaseUrl).kind !== "postgres") {
    return (
      `WORKERS=${workers} needs DATABASE_URL=postgres://...: ` +
      "the embedded database serves one process only"
    );
  }
  return null;
}
