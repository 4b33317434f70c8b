import type { PGlite } from "@electric-sql/pglite";
import type pg from "pg";

/** Raw SQL access to the same connection (PGlite instance or pg pool) the Prisma adapter uses. */
export interface SqlRunner {
  /** Runs fn inside one transaction: committed if fn resolves, rolled back if it throws. */
  transaction<T>(fn: (tx: SqlTx) => Promise<T>): Promise<T>;
  /** One statement on its own, committed as its own transaction. */
  query<Row extends Record<string, unknown>>(sql: string, params?: unknown[]): Promise<Row[]>;
}

export interface SqlTx {
  /** Runs a script of several statements without parameters. */
  exec(script: string): Promise<void>;
  query<Row extends Record<string, unknown>>(sql: string, params?: unknown[]): Promise<Row[]>;
}

export function pgliteRunner(db: PGlite): SqlRunner {
  return {
    transaction: (fn) =>
      db.transaction((tx) =>
        fn({
          exec: async (script) => {
            await tx.exec(script);
          },
          query: async <Row extends Record<string, unknown>>(sql: string, params?: unknown[]) =>
            (await tx.query<Row>(sql, params)).rows,
        }),
      ),
    query: async <Row extends Record<string, unknown>>(sql: string, params?: unknown[]) =>
      (await db.query<Row>(sql, params)).rows,
  };
}

export function poolRunner(pool: pg.Pool): SqlRunner {
  return {
    async transaction(fn) {
      const client = await pool.connect();
      try {
        await client.query("BEGIN");
        // A script without parameters goes through the simple query protocol, which allows
        // several statements in one call.
        const result = await fn({
          exec: async (script) => {
            await client.query(script);
          },
          query: async <Row extends Record<string, unknown>>(sql: string, params?: unknown[]) =>
            (await client.query<Row>(sql, params)).rows,
        });
        await client.query("COMMIT");
        return result;
      } catch (error) {
        await client.query("ROLLBACK").catch(() => undefined);
        throw error;
      } finally {
        client.release();
      }
    },
    query: async <Row extends Record<string, unknown>>(sql: string, params?: unknown[]) =>
      (await pool.query<Row>(sql, params)).rows,
  };
}
