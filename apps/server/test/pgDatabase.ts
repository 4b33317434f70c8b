/**
 * A fresh PostgreSQL database per test file, from TEST_DATABASE_URL (a role allowed to create
 * databases; CI starts one). Without it the PostgreSQL tests are skipped, as the db package's are.
 */
import { afterAll, beforeAll } from "vitest";
import { freshPostgres as freshDatabase, TEST_DATABASE_URL } from "@contend/db/freshPostgres";
import type { FreshDatabase } from "@contend/db/freshPostgres";
import { connect, startServer } from "./helpers";
import type { Client, TestServer } from "./helpers";

export { TEST_DATABASE_URL };

/** A fresh database named for the server's tests (`contend_server_…`). */
export const freshPostgres = (adminUrl: string): Promise<FreshDatabase> =>
  freshDatabase(adminUrl, "contend_server");

/**
 * Several server processes' worth of applications on one fresh PostgreSQL database for a whole
 * test file (each with its own pool and feed connection), and clients that are all closed,
 * servers stopped and the database dropped after it.
 */
export function serversOnOnePostgres(opts: Parameters<typeof startServer>[0] = {}) {
  let database: FreshDatabase | null = null;
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
