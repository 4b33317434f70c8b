import type { PGlite } from "@electric-sql/pglite";
import type pg from "pg";

/** Raw SQL access to the same connection (PGlite instance or pg pool) the Prisma adapter uses. */
export interface SqlRunner {
  /** Runs fn inside one transaction: committed if fn resolves, rolled back if it throws. */
  transaction<T>(fn: (tx: SqlTx) => Promise<T>): Promise<T>;
  /** One statement on its own, committed as its own transaction. */
  query<Row extends Record<string, unknown>>(sql: string, params?: unknown[]): Promise<Row[]>;
  /**
   * The same, for a statement run often: it is parsed and planned once per connection and
   * from then on only executed, which on PGlite costs a fraction of a fresh statement.
   */
  prepared<Row extends Record<string, unknown>>(
    statement: PreparedStatement,
    params: readonly PreparedValue[],
  ): Promise<Row[]>;
}

export interface PreparedStatement {
  /** an SQL identifier, unique in the process */
  name: string;
  sql: string;
  /** PostgreSQL types of $1..$n, e.g. ["timestamptz", "int[]"] */
  types: readonly string[];
}

type Scalar = string | number | boolean | null;
export type PreparedValue = Scalar | readonly Scalar[];

export interface SqlTx {
  /** Runs a script of several statements without parameters. */
  exec(script: string): Promise<void>;
  query<Row extends Record<string, unknown>>(sql: string, params?: unknown[]): Promise<Row[]>;
}

export function pgliteRunner(db: PGlite): SqlRunner {
  /** statements PREPAREd on this connection (PGlite is one connection for the process) */
  const prepared = new Map<string, Promise<void>>();
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
    // PGlite's query() parses and plans every call; PREPARE once, then EXECUTE through the
    // simple protocol with the values written as literals.
    async prepared<Row extends Record<string, unknown>>(
      statement: PreparedStatement,
      params: readonly PreparedValue[],
    ) {
      if (!prepared.has(statement.name)) {
        prepared.set(statement.name, prepare(statement));
      }
      await prepared.get(statement.name);
      const results = await db.exec(
        `EXECUTE ${identifier(statement.name)} (${params.map(sqlLiteral).join(", ")})`,
      );
      return (results.at(-1)?.rows ?? []) as Row[];
    },
  };

  async function prepare(statement: PreparedStatement) {
    // Literals below double their quotes and nothing else, which is exact only with this on
    // (PostgreSQL's default since 9.1).
    const [setting] = await db.exec("SHOW standard_conforming_strings");
    const value = (setting?.rows[0] as { standard_conforming_strings?: string } | undefined)
      ?.standard_conforming_strings;
    if (value !== "on") throw new Error("standard_conforming_strings must be on");
    await db.exec(
      `PREPARE ${identifier(statement.name)} (${statement.types.join(", ")}) AS ${statement.sql}`,
    );
  }
}

function identifier(name: string): string {
  if (!/^[a-z_][a-z0-9_]*$/.test(name)) throw new Error(`bad statement name ${name}`);
  return name;
}

function scalarText(value: Scalar): string | null {
  if (value === null) return null;
  if (typeof value === "number") {
    if (!Number.isFinite(value)) throw new Error(`cannot write ${value} as an SQL value`);
    return String(value);
  }
  const text = String(value);
  // The simple protocol ends the query text at a NUL, and PostgreSQL text cannot hold one.
  if (text.includes("\0")) throw new Error("an SQL value cannot contain a NUL character");
  return text;
}

/**
 * A value as an SQL literal of unknown type, which EXECUTE then reads as the declared
 * parameter type: a quoted string with its quotes doubled (standard_conforming_strings on), an
 * array as its array literal (PostgreSQL manual, section 8.15.6: elements double-quoted,
 * backslash before `"` and `\`; NULL unquoted).
 */
export function sqlLiteral(value: PreparedValue): string {
  let text: string | null;
  if (Array.isArray(value)) {
    const elements = (value as readonly Scalar[]).map((v) => {
      const t = scalarText(v);
      return t === null ? "NULL" : `"${t.replace(/["\\]/g, "\\$&")}"`;
    });
    text = `{${elements.join(",")}}`;
  } else text = scalarText(value as Scalar);
  return text === null ? "NULL" : `'${text.replaceAll("'", "''")}'`;
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
    // node-postgres prepares a named statement once on each pooled connection.
    prepared: async <Row extends Record<string, unknown>>(
      statement: PreparedStatement,
      params: readonly PreparedValue[],
    ) =>
      (
        await pool.query<Row>({
          name: statement.name,
          text: statement.sql,
          values: params as unknown[],
        })
      ).rows,
  };
}
