import { createHash } from "node:crypto";
import { existsSync, readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";
import type { SqlRunner } from "./sqlRunner";

/** prisma/migrations at the repository root, next to schema.prisma. */
export const DEFAULT_MIGRATIONS_DIR = fileURLToPath(
  new URL("../../../prisma/migrations/", import.meta.url),
);

export const MIGRATIONS_TABLE = "_contend_migrations";

export interface Migration {
  name: string;
  sql: string;
  checksum: string;
}

/** Migration folders (<stamp>_<name>/migration.sql), in name order, which is time order. */
export function readMigrations(dir: string = DEFAULT_MIGRATIONS_DIR): Migration[] {
  if (!existsSync(dir)) throw new Error(`migrations folder not found: ${dir}`);
  return readdirSync(dir, { withFileTypes: true })
    .filter(
      (entry) => entry.isDirectory() && existsSync(path.join(dir, entry.name, "migration.sql")),
    )
    .map((entry) => entry.name)
    .sort()
    .map((name) => {
      const sql = readFileSync(path.join(dir, name, "migration.sql"), "utf8");
      // Line endings are normalised so a checkout with CRLF does not look like an edited migration.
      const checksum = createHash("sha256").update(sql.replace(/\r\n/g, "\n")).digest("hex");
      return { name, sql, checksum };
    });
}

// Several server processes may start at once against one PostgreSQL; a transaction-scoped
// advisory lock makes them take turns, and each re-reads the table once it holds the lock.
const LOCK = `SELECT pg_advisory_xact_lock(hashtext('${MIGRATIONS_TABLE}'))`;
const CREATE_TABLE = `CREATE TABLE IF NOT EXISTS "${MIGRATIONS_TABLE}" (
  "name" TEXT PRIMARY KEY,
  "checksum" TEXT NOT NULL,
  "appliedAt" TIMESTAMPTZ(3) NOT NULL DEFAULT CURRENT_TIMESTAMP
)`;

/**
 * Applies the migrations not yet recorded, each in its own transaction together with its
 * record, so a failed migration leaves nothing behind. Returns the names applied now.
 * Throws (a deployment bug, not an expected failure) when an applied migration was edited
 * afterwards or the database knows a migration this code does not have.
 */
export async function applyMigrations(
  runner: SqlRunner,
  migrations: Migration[],
): Promise<string[]> {
  const recorded = await runner.transaction(async (tx) => {
    await tx.query(LOCK);
    await tx.exec(CREATE_TABLE);
    return tx.query<{ name: string; checksum: string }>(
      `SELECT "name", "checksum" FROM "${MIGRATIONS_TABLE}"`,
    );
  });
  const known = new Set(migrations.map((m) => m.name));
  const unknown = recorded.filter((r) => !known.has(r.name)).map((r) => r.name);
  if (unknown.length > 0) {
    throw new Error(
      `database has migrations this code does not know (${unknown.join(", ")}); run a newer version`,
    );
  }

  const applied: string[] = [];
  for (const migration of migrations) {
    const done = await runner.transaction(async (tx) => {
      await tx.query(LOCK);
      const [row] = await tx.query<{ checksum: string }>(
        `SELECT "checksum" FROM "${MIGRATIONS_TABLE}" WHERE "name" = $1`,
        [migration.name],
      );
      if (row) {
        if (row.checksum !== migration.checksum) {
          throw new Error(`migration ${migration.name} was changed after it was applied`);
        }
        return false;
      }
      await tx.exec(migration.sql);
      await tx.query(`INSERT INTO "${MIGRATIONS_TABLE}" ("name", "checksum") VALUES ($1, $2)`, [
        migration.name,
        migration.checksum,
      ]);
      return true;
    });
    if (done) applied.push(migration.name);
  }
  return applied;
}

export type MigrationStatus =
  | { ok: true; applied: number }
  | { ok: false; reason: "unreachable" | "migrations-pending"; message: string };

/**
 * Whether the database answers and holds every migration this code knows (the readiness
 * check). A failed query is an expected outcome here (the server is down or the network
 * is cut), so it comes back as a value; the message names no table rows.
 */
export async function migrationStatus(
  runner: SqlRunner,
  migrations: Migration[],
): Promise<MigrationStatus> {
  let recorded: { name: string }[];
  try {
    const [table] = await runner.query<{ present: boolean }>(
      `SELECT to_regclass('"${MIGRATIONS_TABLE}"') IS NOT NULL AS "present"`,
    );
    recorded = table?.present
      ? await runner.query<{ name: string }>(`SELECT "name" FROM "${MIGRATIONS_TABLE}"`)
      : [];
  } catch (error) {
    const message = error instanceof Error ? error.message : String(error);
    return { ok: false, reason: "unreachable", message: `database unreachable: ${message}` };
  }
  const have = new Set(recorded.map((r) => r.name));
  const pending = migrations.filter((m) => !have.has(m.name)).map((m) => m.name);
  if (pending.length > 0) {
    return {
      ok: false,
      reason: "migrations-pending",
      message: `migrations not applied yet: ${pending.join(", ")}`,
    };
  }
  return { ok: true, applied: migrations.length };
}
