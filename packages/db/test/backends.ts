import { randomBytes } from "node:crypto";
import path from "node:path";
import pg from "pg";
import { tempDir } from "./fixtures";

/** A fresh, empty database per call; dispose() removes it. */
export interface Backend {
  name: string;
  fresh(): Promise<{ url: string; dispose(): Promise<void> }>;
}

const memory: Backend = {
  name: "pglite in memory",
  fresh: async () => ({ url: "memory://", dispose: async () => {} }),
};

const directory: Backend = {
  name: "pglite in a directory",
  async fresh() {
    const tmp = tempDir();
    return { url: `pglite:${path.join(tmp.dir, "pglite")}`, dispose: async () => tmp.dispose() };
  },
};

/**
 * TEST_DATABASE_URL names a PostgreSQL role allowed to create databases; each call creates
 * its own database and drops it afterwards, so runs never see each other's rows.
 */
function postgres(adminUrl: string): Backend {
  return {
    name: "postgresql",
    async fresh() {
      const name = `contend_test_${randomBytes(6).toString("hex")}`;
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
    },
  };
}

export const TEST_DATABASE_URL = process.env.TEST_DATABASE_URL?.trim() || undefined;

export const backends: Backend[] = [
  memory,
  directory,
  ...(TEST_DATABASE_URL ? [postgres(TEST_DATABASE_URL)] : []),
];

if (!TEST_DATABASE_URL) {
  console.info("db tests: TEST_DATABASE_URL not set, PostgreSQL backend skipped (PGlite only)");
}
