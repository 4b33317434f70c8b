/**
 * Test support, exported as `@contend/db/freshPostgres` (not from the package's main entry):
 * a fresh, empty PostgreSQL database per call, for the db package's tests and the server's
 * multi-process tests alike.
 */
import { randomBytes } from "node:crypto";
import pg from "pg";

/**
 * TEST_DATABASE_URL names a PostgreSQL role allowed to create databases (CI starts one);
 * without it the PostgreSQL tests are skipped.
 */
export const TEST_DATABASE_URL = process.env.TEST_DATABASE_URL?.trim() || undefined;

/** A database made by freshPostgres: its URL, and dispose() that drops it. */
export interface FreshDatabase {
  url: string;
  dispose(): Promise<void>;
}

/**
 * Creates a database with a random name (`<prefix>_<12 hex digits>`) through `adminUrl`, so
 * runs never see each other's rows; dispose() drops it, closing any connection still open.
 */
export async function freshPostgres(
  adminUrl: string,
  prefix = "contend_test",
): Promise<FreshDatabase> {
  const name = `${prefix}_${randomBytes(6).toString("hex")}`;
  await asAdmin(adminUrl, `CREATE DATABASE "${name}"`);
  const url = new URL(adminUrl);
  url.pathname = `/${name}`;
  return {
    url: url.toString(),
    dispose: () => asAdmin(adminUrl, `DROP DATABASE IF EXISTS "${name}" WITH (FORCE)`),
  };
}

async function asAdmin(adminUrl: string, sql: string): Promise<void> {
  const admin = new pg.Client({ connectionString: adminUrl });
  await admin.connect();
  await admin.query(sql);
  await admin.end();
}
