import { types } from "@electric-sql/pglite";
import type { PGlite } from "@electric-sql/pglite";

/**
 * Shrinks a PGlite instance's table of result parsers to the types PGlite parses by default
 * and their arrays. PGlite copies this table into a fresh object on every query and exec
 * (@electric-sql/pglite 0.3: `parseResults` spreads it), and by the end of start-up it has added
 * an array parser for every array type in the catalogue, 316 entries in all. In a 1,600-seat
 * load run that copy was a fifth of everything the server allocated and added ~80 us to each
 * call. Every value keeps the JavaScript form it had: a scalar type outside the table was
 * already parsed by PGlite's static defaults or not at all, and the array parsers kept here look
 * their element parser up in the same table. Only arrays of types without a default parser
 * (e.g. uuid[], numeric[]) now arrive as their text, which nothing here reads.
 */
export async function useLeanParsers(pglite: PGlite): Promise<void> {
  const full = pglite.parsers;
  const scalar = Object.keys(types.parsers)
    .filter((key) => /^\d+$/.test(key))
    .map(Number);
  const { rows } = await pglite.query<{ typarray: number }>(
    "SELECT typarray::int AS typarray FROM pg_type WHERE oid = ANY($1::oid[]) AND typarray <> 0",
    [scalar],
  );
  const lean: typeof full = {};
  for (const oid of [...scalar, ...rows.map((r) => r.typarray)]) {
    const parser = full[oid];
    if (parser) lean[oid] = parser;
  }
  pglite.parsers = lean;
}
