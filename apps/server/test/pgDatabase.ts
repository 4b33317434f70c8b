/**
 * A fresh PostgreSQL database per test file, from TEST_DATABASE_URL (a role allowed to create
 * databases; CI starts one). Without it the PostgreSQL tests are skipped, as the db package's are.
 */
import { randomBytes } from "node:crypto";
import pg from "pg";
import { afterAll, beforeAll } from "vitest";
import { connect, startServer } from "./helpers";
import type { Client, TestServer } from "./helpers";

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

/**
 * Several server processes' worth of applications on one fresh PostgreSQL database for a whole
 * test file (each with its own pool and feed connection), and clients that are all closed,
 * servers stopped and the database dropped after it.
 */
export function serversOnOnePostgres(opts: Parameters<typeof startServer>[0] = {}) {
  let database: { url: string; dispose(): Promise<void> } | null = null;
  const servers: TestServer[] = [];
  const clients: Client[] = [];
  beforeAll(async () => {
    database = await freshPostgres(TEST_DATABASE_URL!);
  });
  afterAll(async () => {
    for (const c of clients) c.disconnect();
    for (const s of servers) await s.stop();
    await database?.dispose();
  });
  return {
    async server(more: Partial<Parameters<typeof startServer>[0]> = {}) {
      const s = await startServer({ ...opts, ...more, dataDir: database!.url });
      servers.push(s);
      return s;
    },
    async client(s: TestServer) {
      const c = await connect(s.url);
      clients.push(c);
      return c;
    },
  };
}
