/**
 * Several server processes starting together on one empty PostgreSQL database: the
 * migrations run once (an advisory lock makes the processes take turns), and the readiness
 * check reports a database that answers and holds every migration.
 */
import { spawn } from "node:child_process";
import { fileURLToPath } from "node:url";
import pg from "pg";
import { describe, expect, it } from "vitest";
import { MIGRATIONS_TABLE, openDatabase, readMigrations } from "../src/index";
import { backends, TEST_DATABASE_URL } from "./backends";

const CHILD = fileURLToPath(new URL("./openChild.ts", import.meta.url));

/** Runs openChild.ts on url; resolves with the migration names that child applied. */
function openInChild(url: string): Promise<string[]> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, ["--import", "tsx", CHILD, url], {
      stdio: ["ignore", "pipe", "pipe"],
    });
    let out = "";
    let err = "";
    child.stdout.on("data", (chunk: Buffer) => (out += chunk.toString()));
    child.stderr.on("data", (chunk: Buffer) => (err += chunk.toString()));
    child.on("error", reject);
    child.on("exit", (code) => {
      if (code !== 0) return reject(new Error(`child exited with ${code}:\n${err}`));
      resolve(JSON.parse(out.trim()) as string[]);
    });
  });
}

describe.skipIf(!TEST_DATABASE_URL)("processes starting together on one empty PostgreSQL", () => {
  it("three processes open it at once: each migration is applied by exactly one, recorded once", async () => {
    const fresh = await backends.find((b) => b.name === "postgresql")!.fresh();
    try {
      const results = await Promise.all([1, 2, 3].map(() => openInChild(fresh.url)));
      const names = readMigrations().map((m) => m.name);
      expect(names.length).toBeGreaterThan(0);
      expect(results.flat().sort()).toEqual(names);
      const client = new pg.Client({ connectionString: fresh.url });
      await client.connect();
      try {
        const rows = await client.query<{ name: string }>(
          `SELECT "name" FROM "${MIGRATIONS_TABLE}" ORDER BY "name"`,
        );
        expect(rows.rows.map((r) => r.name)).toEqual(names);
      } finally {
        await client.end();
      }
      // a later start finds nothing to do
      expect(await openInChild(fresh.url)).toEqual([]);
    } finally {
      await fresh.dispose();
    }
  });
});

describe("readiness", () => {
  it("ok once open; migrations-pending when a known migration is missing; unreachable after close", async () => {
    const db = await openDatabase({ url: "memory://" });
    const names = readMigrations().map((m) => m.name);
    expect(await db.readiness()).toEqual({ ok: true, applied: names.length });
    // positive control: take the last migration's record away, as if it had not run
    await db.prisma.$executeRawUnsafe(
      `DELETE FROM "${MIGRATIONS_TABLE}" WHERE "name" = '${names.at(-1)!}'`,
    );
    expect(await db.readiness()).toMatchObject({
      ok: false,
      reason: "migrations-pending",
      message: expect.stringContaining(names.at(-1)!) as unknown,
    });
    await db.close();
    expect(await db.readiness()).toMatchObject({ ok: false, reason: "unreachable" });
  });
});
