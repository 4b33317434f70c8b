import { mkdirSync } from "node:fs";
import path from "node:path";
import { PGlite } from "@electric-sql/pglite";
import { PrismaPg } from "@prisma/adapter-pg";
import pg from "pg";
import { PrismaPGlite } from "pglite-prisma-adapter";
import { lockDataDir } from "./dir-lock";
import { useLeanParsers } from "./pglite-parsers";
import { PrismaClient } from "./generated/prisma/client";
import { applyMigrations, DEFAULT_MIGRATIONS_DIR, readMigrations } from "./migrate";
import { eventsRepository } from "./repos/events";
import { keysRepository } from "./repos/keys";
import { scenariosRepository } from "./repos/scenarios";
import { seatsRepository } from "./repos/seats";
import { sessionsRepository } from "./repos/sessions";
import { pgliteRunner, poolRunner, type SqlRunner } from "./sql-runner";
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
  seats: ReturnType<typeof seatsRepository>;
  scenarios: ReturnType<typeof scenariosRepository>;
  /** migrations applied by this open (empty when the database was up to date) */
  migrationsApplied: string[];
  close(): Promise<void>;
}

// pglite-prisma-adapter 0.6.1 is typed against @prisma/driver-adapter-utils 6.10, whose
// ArgType differs from 6.19's; it never reads argTypes, so only the type needs bridging.
type AdapterFactory = PrismaPg;

interface Connection {
  kind: Database["kind"];
  prisma: Db;
  runner: SqlRunner;
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
    const pglite = dataDir ? await PGlite.create(dataDir) : await PGlite.create();
    await useLeanParsers(pglite);
    const prisma = new PrismaClient({
      adapter: new PrismaPGlite(pglite) as unknown as AdapterFactory,
    });
    return {
      kind: "pglite",
      prisma,
      runner: pgliteRunner(pglite),
      async close() {
        try {
          await prisma.$disconnect();
          await pglite.close();
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
    runner: poolRunner(pool),
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
  const { prisma } = connection;
  return {
    kind: connection.kind,
    prisma,
    sessions: sessionsRepository(prisma),
    events: eventsRepository(prisma, connection.runner),
    keys: keysRepository(prisma),
    seats: seatsRepository(prisma),
    scenarios: scenariosRepository(prisma),
    migrationsApplied,
    close: connection.close,
  };
}
