import path from "node:path";
import { freshPostgres, TEST_DATABASE_URL } from "../src/freshPostgres";
import type { FreshDatabase } from "../src/freshPostgres";
import { tempDir } from "./fixtures";

/** A fresh, empty database per call; dispose() removes it. */
export interface Backend {
  name: string;
  fresh(): Promise<FreshDatabase>;
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

/** Each call creates its own PostgreSQL database and drops it afterwards. */
function postgres(adminUrl: string): Backend {
  return { name: "postgresql", fresh: () => freshPostgres(adminUrl) };
}

export { TEST_DATABASE_URL };

export const backends: Backend[] = [
  memory,
  directory,
  ...(TEST_DATABASE_URL ? [postgres(TEST_DATABASE_URL)] : []),
];

if (!TEST_DATABASE_URL) {
  console.info("db tests: TEST_DATABASE_URL not set, PostgreSQL backend skipped (PGlite only)");
}
