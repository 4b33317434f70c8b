/**
 * A fresh PostgreSQL database per test file, from TEST_DATABASE_URL (a role allowed to create
 * databases; CI starts one). Without it the PostgreSQL tests are skipped, as the db package's are.
 */
import { randomBytes } from "node:crypto";
import pg from "pg";

export const TEST_DATABASE_URL = process.env.TEST_DATABASE_URL?.trim() || undefined;

export async function freshPostgres(
  adminUrl: string,
): Promise<{ url: string; dispose(): Promise<void> }> {
  const name = `contend_server_${randomBytes(6).toString("hex")}`;
  const admin = new pg.Client({ connectionString: adminUrl });
  await admin.connect();
  await admin.query(`CREATE DATABASE "${name}"`);
  await admin.end();
  const url = new URL(adminUrl);
  url.pathname = `/${name}`;
  return {
    url: url.toString(),
    async dispose() {
      const drop = new pg.Client({ connectionString: adminUrl });
      await drop.connect();
      await drop.query(`DROP DATABASE IF EXISTS "${name}" WITH (FORCE)`);
      await drop.end();
    },
  };
}
