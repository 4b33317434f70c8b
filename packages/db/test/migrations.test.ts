import { execFileSync } from "node:child_process";
import { cpSync, mkdirSync, writeFileSync } from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { PGlite } from "@electric-sql/pglite";
import { describe, expect, it } from "vitest";
import {
  applyMigrations,
  DEFAULT_MIGRATIONS_DIR,
  MIGRATIONS_TABLE,
  openDatabase,
  readMigrations,
} from "../src/index";
import { pgliteRunner } from "../src/sqlRunner";
import { catalog } from "./catalog";
import { tempDir } from "./fixtures";

const packageDir = fileURLToPath(new URL("..", import.meta.url));
const schemaPath = path.join(packageDir, "..", "..", "prisma", "schema.prisma");

/** What schema.prisma says today, as SQL from an empty database (the Prisma CLI, offline). */
function schemaScript(): string {
  return execFileSync(
    path.join(packageDir, "..", "..", "node_modules", ".bin", "prisma"),
    ["migrate", "diff", "--from-empty", "--to-schema-datamodel", schemaPath, "--script"],
    { cwd: packageDir, encoding: "utf8", stdio: ["ignore", "pipe", "pipe"] },
  );
}

describe("migration history", () => {
  it("migrations applied in order give the same catalog as schema.prisma's from-empty script", async () => {
    const script = schemaScript();
    expect(script).toContain('CREATE TABLE "Event"');

    const migrated = await PGlite.create();
    const fromSchema = await PGlite.create();
    try {
      const applied = await applyMigrations(pgliteRunner(migrated), readMigrations());
      expect(applied.length).toBeGreaterThan(0);
      await fromSchema.exec(script);

      const a = await pgliteRunner(migrated).transaction((tx) => catalog(tx, [MIGRATIONS_TABLE]));
      const b = await pgliteRunner(fromSchema).transaction((tx) => catalog(tx));
      expect(a.tables.map((t) => (t as unknown as { table: string }).table)).toEqual([
        "AccessKey",
        "Event",
        "RateLimit",
        "SavedScenario",
        "SavedScenarioVersion",
        "Seat",
        "Session",
      ]);
      expect(a.columns.length).toBeGreaterThan(20);
      expect(a).toEqual(b);
    } finally {
      await migrated.close();
      await fromSchema.close();
    }
  }, 180_000); // the Prisma CLI boots its WebAssembly schema engine: 8 s idle, more on a busy machine

  it("catalog() notices a difference (a changed default), so the comparison above can fail", async () => {
    const one = await PGlite.create();
    const two = await PGlite.create();
    try {
      await one.exec(`CREATE TABLE "T" ("n" INTEGER NOT NULL DEFAULT 0)`);
      await two.exec(`CREATE TABLE "T" ("n" INTEGER NOT NULL DEFAULT 1)`);
      const a = await pgliteRunner(one).transaction((tx) => catalog(tx));
      const b = await pgliteRunner(two).transaction((tx) => catalog(tx));
      expect(a).not.toEqual(b);
      await two.exec(
        `ALTER TABLE "T" ALTER COLUMN "n" SET DEFAULT 0; CREATE INDEX "T_n" ON "T"("n")`,
      );
      const c = await pgliteRunner(two).transaction((tx) => catalog(tx));
      expect(c.columns).toEqual(a.columns);
      expect(c.indexes).not.toEqual(a.indexes);
    } finally {
      await one.close();
      await two.close();
    }
  });

  it("readMigrations() lists folders in name order with a checksum", () => {
    const migrations = readMigrations(DEFAULT_MIGRATIONS_DIR);
    const names = migrations.map((m) => m.name);
    expect(names).toEqual([...names].sort());
    for (const m of migrations) {
      expect(m.name).toMatch(/^\d{14}_[a-z0-9_]+$/);
      expect(m.checksum).toMatch(/^[0-9a-f]{64}$/);
    }
  });
});

describe("applyMigrations", () => {
  function copyMigrations() {
    const tmp = tempDir("contend-migrations-");
    const dir = path.join(tmp.dir, "migrations");
    cpSync(DEFAULT_MIGRATIONS_DIR, dir, { recursive: true });
    return { dir, dispose: tmp.dispose };
  }

  it("applies only new migrations, each once", async () => {
    const copy = copyMigrations();
    const db = await PGlite.create();
    try {
      const runner = pgliteRunner(db);
      const first = await applyMigrations(runner, readMigrations(copy.dir));
      expect(await applyMigrations(runner, readMigrations(copy.dir))).toEqual([]);

      mkdirSync(path.join(copy.dir, "29990101000000_add_note"));
      writeFileSync(
        path.join(copy.dir, "29990101000000_add_note", "migration.sql"),
        `ALTER TABLE "Session" ADD COLUMN "note" TEXT;`,
      );
      expect(await applyMigrations(runner, readMigrations(copy.dir))).toEqual([
        "29990101000000_add_note",
      ]);
      const rows = await db.query<{ name: string }>(
        `SELECT "name" FROM "${MIGRATIONS_TABLE}" ORDER BY "name"`,
      );
      expect(rows.rows.map((r) => r.name)).toEqual([...first, "29990101000000_add_note"]);
    } finally {
      await db.close();
      copy.dispose();
    }
  });

  it("a failing migration leaves no trace: neither its changes nor its record", async () => {
    const copy = copyMigrations();
    const db = await PGlite.create();
    try {
      const runner = pgliteRunner(db);
      await applyMigrations(runner, readMigrations(copy.dir));
      mkdirSync(path.join(copy.dir, "29990101000000_broken"));
      writeFileSync(
        path.join(copy.dir, "29990101000000_broken", "migration.sql"),
        `ALTER TABLE "Session" ADD COLUMN "note" TEXT;\nSELECT no_such_function();`,
      );
      await expect(applyMigrations(runner, readMigrations(copy.dir))).rejects.toThrow();
      const note = await db.query(
        `SELECT 1 FROM information_schema.columns WHERE table_name = 'Session' AND column_name = 'note'`,
      );
      expect(note.rows).toEqual([]);
      const recorded = await db.query(
        `SELECT 1 FROM "${MIGRATIONS_TABLE}" WHERE "name" = '29990101000000_broken'`,
      );
      expect(recorded.rows).toEqual([]);
    } finally {
      await db.close();
      copy.dispose();
    }
  });

  it("refuses an applied migration whose file was edited, and one the code does not know", async () => {
    const copy = copyMigrations();
    const db = await PGlite.create();
    try {
      const runner = pgliteRunner(db);
      const migrations = readMigrations(copy.dir);
      await applyMigrations(runner, migrations);
      const edited = migrations.map((m, i) => (i === 0 ? { ...m, checksum: "0".repeat(64) } : m));
      await expect(applyMigrations(runner, edited)).rejects.toThrow(/changed after it was applied/);
      await expect(applyMigrations(runner, migrations.slice(1))).rejects.toThrow(/does not know/);
    } finally {
      await db.close();
      copy.dispose();
    }
  });

  it("openDatabase({migrationsDir}) with a missing folder throws a clear error", async () => {
    await expect(
      openDatabase({ url: "memory://", migrationsDir: "/nonexistent/migrations" }),
    ).rejects.toThrow(/migrations folder not found/);
  });
});
