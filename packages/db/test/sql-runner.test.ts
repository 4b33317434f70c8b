import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { PGlite } from "@electric-sql/pglite";
import { pgliteRunner, sqlLiteral } from "../src/sqlRunner";
import type { PreparedStatement, PreparedValue } from "../src/sqlRunner";

const ECHO: PreparedStatement = {
  name: "test_echo",
  types: ["text", "text[]", "jsonb[]", "int[]", "timestamptz[]", "boolean"],
  sql: `SELECT $1::text AS a, $2::text[] AS b, $3::jsonb[] AS c, $4::int[] AS d,
          $5::timestamptz[] AS e, $6::boolean AS f`,
};

// Strings that break naive quoting: quotes of both kinds, backslashes, array punctuation, the
// word NULL, an attempt to end the statement, line breaks and characters outside ASCII.
const AWKWARD = [
  "plain",
  "it's",
  "''",
  'say "hi"',
  "back\\slash",
  "\\",
  '\\"',
  "{a,b}",
  "a,b",
  "NULL",
  "",
  " padded ",
  "x'); DROP TABLE marker; --",
  "line\nbreak\ttab",
  "café ✓ 東京 🍞",
];

describe("prepared statements on PGlite (values written as SQL literals)", () => {
  let db: PGlite;
  beforeAll(async () => {
    db = await PGlite.create();
    await db.exec("CREATE TABLE marker (x int)");
  });
  afterAll(() => db.close());

  it("every awkward value comes back exactly as PGlite's own parameter binding gives it", async () => {
    const runner = pgliteRunner(db);
    const cases: PreparedValue[][] = [
      ...AWKWARD.map((s, k): PreparedValue[] => [
        s,
        [s, null, s],
        [JSON.stringify({ s, k, nested: [s, { q: s }] })],
        [k, -k, 2147483647],
        ["2026-03-01T09:30:00.123Z"],
        k % 2 === 0,
      ]),
      [null, [], [], [], [], null],
    ];
    for (const params of cases) {
      const got = await runner.prepared(ECHO, params);
      // The second method: the extended protocol with PGlite serialising the same values.
      const want = await db.query(ECHO.sql, params as unknown[]);
      expect(got, JSON.stringify(params)).toEqual(want.rows);
    }
    // nothing was executed but the statement itself
    expect((await db.query("SELECT to_regclass('marker') AS t")).rows).toEqual([{ t: "marker" }]);
  });

  it("refuses values it cannot write: NUL characters and non-finite numbers", () => {
    expect(() => sqlLiteral("a\0b")).toThrow(/NUL/);
    expect(() => sqlLiteral([Number.NaN])).toThrow(/NaN/);
    expect(() => sqlLiteral(Number.POSITIVE_INFINITY)).toThrow(/Infinity/);
  });

  it("writes literals in PostgreSQL's documented forms", () => {
    // PostgreSQL manual 4.1.2.1 (quotes doubled) and 8.15.6 (array element quoting)
    expect(sqlLiteral("it's")).toBe("'it''s'");
    expect(sqlLiteral(null)).toBe("NULL");
    expect(sqlLiteral(42)).toBe("'42'");
    expect(sqlLiteral(["a", null, 'b"c', "d\\e"])).toBe(`'{"a",NULL,"b\\"c","d\\\\e"}'`);
    expect(sqlLiteral([])).toBe("'{}'");
  });
});
