import { spawnSync } from "node:child_process";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { Worker } from "node:worker_threads";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { openChannel } from "../src/pglite-thread/channel";
import { startPgliteThread, type PgliteThread } from "../src/pglite-thread/proxy";

const here = path.dirname(fileURLToPath(import.meta.url));

describe("PGlite on its own thread", () => {
  let thread: PgliteThread;
  beforeAll(async () => {
    thread = await startPgliteThread(null);
    await thread.runner.query("CREATE TABLE note (id int PRIMARY KEY, body text)");
  });
  afterAll(() => thread.close());

  it("keeps the main thread's event loop turning while a long statement runs", async () => {
    // In-process, PGlite runs the statement as one synchronous WebAssembly call: the query
    // would be over before the event loop turned once. On its own thread the statement blocks
    // only that thread, so the main thread turns its loop while the answer is still pending.
    // No clock involved: what is counted is turns of the loop, against a statement of millions
    // of rows.
    let settled = false;
    const pending = thread.runner
      .query<{ n: string }>(
        "SELECT count(*)::text AS n FROM generate_series(1, 3000000) AS g(i) WHERE i % 7 = 0",
      )
      .finally(() => {
        settled = true;
      });
    for (let turn = 0; turn < 3; turn++) {
      await new Promise<void>((resolve) => setImmediate(resolve));
      expect(settled).toBe(false);
    }
    const [row] = await pending;
    expect(row?.n).toBe(String(Math.floor(3_000_000 / 7)));
  });

  it("brings a PostgreSQL error over with its code and message", async () => {
    await thread.runner.query("INSERT INTO note VALUES (1, 'first')");
    const error = await thread.runner
      .query("INSERT INTO note VALUES (1, 'again')")
      .catch((e: unknown) => e);
    expect(error).toBeInstanceOf(Error);
    // 23505 unique_violation (PostgreSQL manual, Appendix A)
    expect((error as { code?: string }).code).toBe("23505");
    expect((error as Error).message).toMatch(/duplicate key/);
  });

  it("a transaction that throws leaves nothing, and one that returns is kept", async () => {
    await expect(
      thread.runner.transaction(async (tx) => {
        await tx.query("INSERT INTO note VALUES (2, 'rolled back')");
        throw new Error("stop here");
      }),
    ).rejects.toThrow("stop here");
    const kept = await thread.runner.transaction(async (tx) => {
      await tx.exec("INSERT INTO note VALUES (3, 'kept'); INSERT INTO note VALUES (4, 'kept too')");
      return (await tx.query<{ n: number }>("SELECT count(*)::int AS n FROM note"))[0]?.n;
    });
    expect(kept).toBe(3);
    const ids = await thread.runner.query<{ id: number }>("SELECT id FROM note ORDER BY id");
    expect(ids.map((r) => r.id)).toEqual([1, 3, 4]);
  });

  it("fails every call clearly once the thread has ended, instead of waiting forever", async () => {
    const other = await startPgliteThread(null);
    await other.close();
    await expect(other.runner.query("SELECT 1")).rejects.toThrow(/database thread exited/);
  });

  it("an idle database does not keep a finished process alive", () => {
    // A script that opens, queries and never closes must still end, as with PGlite in-process.
    const script = `
      import { startPgliteThread } from ${JSON.stringify(path.join(here, "../src/pglite-thread/proxy.ts"))};
      const t = await startPgliteThread(null);
      const rows = await t.runner.query("SELECT 41 + 1 AS answer");
      console.log(JSON.stringify(rows));
    `;
    const child = spawnSync(
      process.execPath,
      ["--import", "tsx", "--input-type=module", "-e", script],
      {
        encoding: "utf8",
        timeout: 60_000,
      },
    );
    expect(child.signal).toBeNull();
    expect(child.stdout.trim()).toBe('[{"answer":42}]');
  });
});

describe("the channel to a database thread", () => {
  // A stand-in thread: answers its first request, then dies as a crashed database would.
  const DIES_ON_SECOND = `
    const { parentPort } = require("node:worker_threads");
    let n = 0;
    parentPort.on("message", (m) => {
      if (++n === 1) parentPort.postMessage({ id: m.id, ok: true, value: "first" });
      else process.exit(3);
    });`;
  // Settled or not once every callback already due has run (a turn of the event loop, no timer).
  const stateNow = (p: Promise<unknown>) =>
    Promise.race([
      p.then(() => "settled"),
      new Promise((r) => setImmediate(r)).then(() => "pending"),
    ]);

  it("a thread that dies fails the waiting call and every later one, and reports itself lost", async () => {
    const channel = openChannel(new Worker(DIES_ON_SECOND, { eval: true }));
    await expect(channel.call({ op: "runner.begin" })).resolves.toBe("first");
    await expect(channel.call({ op: "runner.begin" })).rejects.toThrow(/exited \(code 3\)/);
    await expect(channel.call({ op: "runner.begin" })).rejects.toThrow(/exited \(code 3\)/);
    const lost = await channel.lost;
    expect(lost.message).toMatch(/database thread exited \(code 3\)/);
  });

  it("a thread ended by close is not reported lost", async () => {
    const worker = new Worker(DIES_ON_SECOND, { eval: true });
    const channel = openChannel(worker);
    // registered after the channel's own exit listener, so that one has run when this resolves
    const exited = new Promise((r) => worker.once("exit", r));
    await channel.close({ op: "close" });
    await exited;
    expect(await stateNow(channel.lost)).toBe("pending");
    await expect(channel.call({ op: "runner.begin" })).rejects.toThrow(/exited/);
  });
});
