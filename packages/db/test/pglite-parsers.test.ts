import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { PGlite } from "@electric-sql/pglite";
import { useLeanParsers } from "../src/pgliteParsers";

// One value (and a NULL) of every type PGlite parses by default, and arrays of them.
const SAMPLE = `SELECT
  true AS bool, '\\x0102ff'::bytea AS bytea, 9007199254740993::int8 AS int8, 12::int2 AS int2,
  -7::int4 AS int4, 'it''s "text"' AS text, 26::oid AS oid, '{"a":[1,2.5,null]}'::json AS json,
  1.5::float4 AS float4, -0.1::float8 AS float8, 'ab'::char(3) AS bpchar, 'v'::varchar AS varchar,
  '2026-03-01'::date AS date, '2026-03-01 09:30:00.123'::timestamp AS ts,
  '2026-03-01 09:30:00.123+02'::timestamptz AS tstz, '{"k":{"n":1e3}}'::jsonb AS jsonb,
  NULL::int4 AS none,
  '{t,f,NULL}'::bool[] AS bools, '{1,-2,3}'::int4[] AS ints, '{10,20}'::int8[] AS bigs,
  '{"a","b,c","NULL",NULL}'::text[] AS texts, '{1.5,2}'::float8[] AS floats,
  '{"2026-03-01T09:30:00Z"}'::timestamptz[] AS stamps,
  ARRAY['{"x":1}'::jsonb, '[2]'::jsonb] AS docs, '{{1,2},{3,4}}'::int4[] AS grid`;

describe("PGlite with the lean parser table", () => {
  let full: PGlite;
  let lean: PGlite;
  beforeAll(async () => {
    [full, lean] = await Promise.all([PGlite.create(), PGlite.create()]);
    await useLeanParsers(lean);
  });
  afterAll(async () => {
    await Promise.all([full.close(), lean.close()]);
  });

  it("keeps a few dozen entries of the hundreds PGlite starts with", () => {
    const before = Object.keys(full.parsers).length;
    const after = Object.keys(lean.parsers).length;
    expect(before).toBeGreaterThan(200);
    expect(after).toBeGreaterThanOrEqual(16);
    expect(after).toBeLessThan(40);
  });

  it("reads every value exactly as PGlite's own full table does", async () => {
    // The second method: the same query on an instance left as PGlite made it.
    const want = await full.query(SAMPLE);
    const got = await lean.query(SAMPLE);
    expect(got.rows).toEqual(want.rows);
    // and through exec (the simple protocol our prepared statements use)
    const [wantExec] = await full.exec(SAMPLE);
    const [gotExec] = await lean.exec(SAMPLE);
    expect(gotExec?.rows).toEqual(wantExec?.rows);
    // the arrays came back parsed, not as text
    const row = got.rows[0] as Record<string, unknown>;
    expect(row.ints).toEqual([1, -2, 3]);
    expect(row.grid).toEqual([
      [1, 2],
      [3, 4],
    ]);
    expect(row.docs).toEqual([{ x: 1 }, [2]]);
  });
});
