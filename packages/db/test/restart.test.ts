import { spawnSync } from "node:child_process";
import { existsSync, writeFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { describe, expect, it } from "vitest";
import { openDatabase } from "../src/index";
import { dataDirs } from "./dataDirs";
import { label, note, sessionInput, takeSeat } from "./fixtures";

describe("PGlite in a directory", () => {
  const dataDir = dataDirs("nested", "pglite");

  it("close then reopen: sessions, seats, keys and events are all there; no migration re-applied", async () => {
    const dir = dataDir();
    const { input, facilitatorKey, seatKeys } = sessionInput();

    const first = await openDatabase({ url: dir });
    expect(first.migrationsApplied.length).toBeGreaterThan(0);
    expect((await first.sessions.create(input)).ok).toBe(true);
    expect(await first.events.append(input.id, 1, [note(1, "a"), note(2, "b")])).toEqual({
      ok: true,
      seqs: [2, 3],
    });
    await takeSeat(first, input.id, 0, "Ada");
    await first.close();

    const second = await openDatabase({ url: `pglite:${dir}` });
    try {
      expect(second.migrationsApplied).toEqual([]);
      expect((await second.events.list(input.id)).map(label)).toEqual([
        "session-created",
        "a",
        "b",
      ]);
      const session = await second.sessions.get(input.id);
      expect(session?.lastSeq).toBe(3);
      expect(session?.seats[0]?.displayName).toBe("Ada");
      expect(await second.keys.resolve(input.id, facilitatorKey)).toEqual({
        role: "facilitator",
        seatIndex: null,
      });
      expect(await second.keys.resolve(input.id, seatKeys[0]!)).toEqual({
        role: "seat",
        seatIndex: 0,
      });
      expect(await second.events.append(input.id, 3, [note(3, "c")])).toEqual({
        ok: true,
        seqs: [4],
      });
    } finally {
      await second.close();
    }
  });

  it("a process killed right after its commits: everything acknowledged is there on reopen", async () => {
    const dir = dataDir();
    const child = spawnSync(
      process.execPath,
      ["--import", "tsx", fileURLToPath(new URL("./killChild.ts", import.meta.url)), dir],
      { encoding: "utf8", timeout: 120_000 },
    );
    expect(child.signal).toBe("SIGKILL");
    const acked = JSON.parse(child.stdout.trim()) as { id: string; facilitatorKey: string };
    expect(existsSync(`${dir}.lock`)).toBe(true); // left behind by the dead process

    const db = await openDatabase({ url: dir });
    try {
      expect(db.migrationsApplied).toEqual([]);
      expect((await db.events.list(acked.id)).map((e) => [e.seq, label(e)])).toEqual([
        [1, "session-created"],
        [2, "a"],
        [3, "b"],
      ]);
      expect((await db.keys.resolve(acked.id, acked.facilitatorKey))?.role).toBe("facilitator");
    } finally {
      await db.close();
    }
  }, 180_000);

  it("a second open of a directory already open in this process is refused", async () => {
    const dir = dataDir();
    const db = await openDatabase({ url: dir });
    try {
      await expect(openDatabase({ url: dir })).rejects.toThrow(/in use by process/);
    } finally {
      await db.close();
    }
    expect(existsSync(`${dir}.lock`)).toBe(false);
  });

  it("a lock file left by a process that has exited is taken over", async () => {
    const dir = dataDir();
    const exited = spawnSync(process.execPath, ["-e", "process.exit(0)"]);
    expect(exited.pid).toBeGreaterThan(0);
    const first = await openDatabase({ url: dir });
    await first.close();
    writeFileSync(`${dir}.lock`, String(exited.pid));
    const db = await openDatabase({ url: dir });
    try {
      expect(db.migrationsApplied).toEqual([]);
    } finally {
      await db.close();
    }
  });
});
