import { mkdirSync } from "node:fs";
import path from "node:path";
import { PrismaPg } from "@prisma/adapter-pg";
import pg from "pg";
import { lockDataDir } from "./dirLock";
import { PrismaClient } from "./generated/prisma/client";
import {
  applyMigrations,
  DEFAULT_MIGRATIONS_DIR,
  migrationStatus,
  readMigrations,
  type MigrationStatus,
} from "./migrate";
import { openFeed, type ChangeFeed } from "./feed";
import { eventsRepository } from "./repos/events";
import { keysRepository } from "./repos/keys";
import { sessionsRepository } from "./repos/sessions";
import { libraryRepository } from "./repos/library";
import { savedScenariosRepository } from "./repos/savedScenarios";
import { startPgliteThread } from "./pglite-thread/proxy";
import { poolRunner, type SqlRunner } from "./sqlRunner";
import { resolveTarget } from "./target";
import type { Db } from "./types";

export interface OpenOptions {
  /** see resolveTarget; the caller passes process.env.DATABASE_URL if it wants the environment */
  url?: string;
  /** default: prisma/migrations at the repository root */
  migrationsDir?: string;
}

export interface Database {
  kind: "pglite" | "postgres";
  prisma: Db;
  sessions: ReturnType<typeof sessionsRepository>;
  events: ReturnType<typeof eventsRepository>;
  keys: ReturnType<typeof keysRepository>;
  /** search and edit the library of sessions (title, tags, archive) */
  library: ReturnType<typeof libraryRepository>;
  /** saved scenarios and their versions */
  scenarios: ReturnType<typeof savedScenariosRepository>;
  /** migrations applied by this open (empty when the database was up to date) */
  migrationsApplied: string[];
  /** the readiness check: the database answers now and holds every migration this code knows */
  readiness(): Promise<MigrationStatus>;
  /**
   * Resolves if the database is gone for good while open (the PGlite thread crashed): every
   * call fails from then on, and the process should restart. A PostgreSQL pool replaces lost
   * connections itself, so there it never resolves.
   */
  lost: Promise<Error>;
  /**
   * PostgreSQL only (null on the embedded database, which serves one process): committed
   * events, messages between processes and per-session leases (feed.ts).
   */
  feed: ChangeFeed | null;
  /**
   * PostgreSQL only (null on the embedded database): the connection pool, for libraries that
   * take one (the server's per-address abuse budgets, table "RateLimit").
   */
  pool: pg.Pool | null;
  close(): Promise<void>;
}

// The PGlite thread's adapter factory is built from plain objects (the real adapter,
// pglite-prisma-adapter, runs on that thread); Prisma reads it through the driver-adapter
// interface that PrismaPg implements, so only the type needs bridging.
type AdapterFactory = PrismaPg;

interface Connection {
  kind: Database["kind"];
  prisma: Db;
  runner: SqlRunner;
  lost: Promise<Error>;
  pool?: pg.Pool;
  close(): Promise<void>;
}

async function connectPglite(dataDir: string | null): Promise<Connection> {
  let release = () => {};
  if (dataDir) {
    mkdirSync(path.dirname(dataDir), { recursive: true });
    release = lockDataDir(dataDir);
    mkdirSync(dataDir, { recursive: true });
  }
  try {
    // PGlite on its own thread: its commits would otherwise hold up every socket in the server.
    const thread = await startPgliteThread(dataDir);
    const prisma = new PrismaClient({ adapter: thread.adapter as AdapterFactory });
    return {
      kind: "pglite",
      prisma,
      runner: thread.runner,
      lost: thread.lost,
      async close() {
        try {
          await prisma.$disconnect();
          await thread.close();
        } finally {
          release();
        }
      },
    };
  } catch (error) {
    release();
    throw error;
  }
}

function connectPostgres(url: string): Connection {
  const pool = new pg.Pool({ connectionString: url });
  // An idle client losing its server connection must not crash the process; the pool replaces it.
  pool.on("error", (error) => console.error("postgres pool:", error.message));
  const prisma = new PrismaClient({ adapter: new PrismaPg(pool) });
  return {
    kind: "postgres",
    prisma,
    pool,
    runner: poolRunner(pool),
    lost: new Promise<Error>(() => undefined),
    async close() {
      await prisma.$disconnect();
      await pool.end();
    },
  };
}

/** Opens (creating if needed) the database, applies pending migrations and returns the repositories. */
export async function openDatabase(opts: OpenOptions = {}): Promise<Database> {
  const migrations = readMigrations(opts.migrationsDir ?? DEFAULT_MIGRATIONS_DIR);
  const target = resolveTarget(opts.url);
  const connection =
    target.kind === "postgres" ? connectPostgres(target.url) : await connectPglite(target.dataDir);
  let migrationsApplied: string[];
  try {
    migrationsApplied = await applyMigrations(connection.runner, migrations);
  } catch (error) {
    await connection.close();
    throw error;
  }
  let feed: ChangeFeed | null = null;
  if (target.kind === "postgres") {
    try {
      feed = await openFeed(target.url);
    } catch (error) {
      await connection.close();
      throw error;
    }
  }
  const { prisma } = connection;
  return {
    kind: connection.kind,
    prisma,
    sessions: sessionsRepository(prisma),
    events: eventsRepository(prisma, connection.runner),
    keys: keysRepository(prisma, connection.runner),
    library: libraryRepository(prisma),
    scenarios: savedScenariosRepository(prisma),
    migrationsApplied,
    readiness: () => migrationStatus(connection.runner, migrations),
    lost: connection.lost,
    feed,
    pool: connection.pool ?? null,
    async close() {
      await feed?.close();
      await connection.close();
    },
  };
}
