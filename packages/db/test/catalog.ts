import type { SqlTx } from "../src/sqlRunner";

/**
 * The parts of a schema that matter to the application, as sorted plain rows: tables,
 * columns (type, length/precision, nullability, default), indexes (full definition) and
 * constraints (full definition). Column order is left out on purpose: a column added by a
 * later migration sits last, which no query depends on.
 */
export async function catalog(tx: SqlTx, exclude: string[] = []) {
  const skip = new Set(exclude);
  const keep = <T extends { table: unknown }>(rows: T[]) =>
    rows.filter((r) => !skip.has(String(r.table)));
  const tables = await tx.query<{ table: string; type: string }>(
    `SELECT table_name AS "table", table_type AS "type" FROM information_schema.tables
     WHERE table_schema = 'public' ORDER BY 1`,
  );
  const columns = await tx.query<{ table: string }>(
    `SELECT table_name AS "table", column_name AS "column", data_type, udt_name,
            character_maximum_length, numeric_precision, numeric_scale, datetime_precision,
            is_nullable, column_default
     FROM information_schema.columns WHERE table_schema = 'public' ORDER BY 1, 2`,
  );
  const indexes = await tx.query<{ table: string }>(
    `SELECT tablename AS "table", indexname AS "index", indexdef FROM pg_indexes
     WHERE schemaname = 'public' ORDER BY 1, 2`,
  );
  const constraints = await tx.query<{ table: string }>(
    `SELECT c.conrelid::regclass::text AS "table", c.conname AS "name", c.contype AS "type",
            pg_get_constraintdef(c.oid) AS "definition"
     FROM pg_constraint c JOIN pg_namespace n ON n.oid = c.connamespace
     WHERE n.nspname = 'public' ORDER BY 1, 2`,
  );
  const strip = (rows: { table: unknown }[]) =>
    keep(rows.map((r) => ({ ...r, table: String(r.table).replace(/^"|"$/g, "") })));
  return {
    tables: strip(tables),
    columns: strip(columns),
    indexes: strip(indexes),
    constraints: strip(constraints),
  };
}
