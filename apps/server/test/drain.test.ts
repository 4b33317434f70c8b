/**
 * Operations: /api/health and /api/ready, and the drain a shutdown starts (stop taking
 * connections, let the commit under way finish, close every client's transport so it
 * reconnects elsewhere). In process, with a manual clock; sigterm.test.ts does the same
 * through a real server process and a real signal.
 */
import { afterAll, describe, expect, it } from "vitest";
import type { Database } from "@contend/db";
import { MIGRATIONS_TABLE, readMigrations } from "@contend/db";
import { createApplication } from "../src/app";
import { createManualClock } from "../src/clock";
import { fixedGauge } from "../src/loadGauge";
import { READY_TIMEOUT_MS } from "../src/http/ready";
import { createShutdown } from "../src/shutdown";
import { silentLogger } from "../src/logger";
import {
  command,
  connect,
  createSessionOverHttp,
  eventLog,
  eventually,
  expectOk,
  hello,
  removeDataDir,
  startServer,
} from "./helpers";
import type { Client, TestServer } from "./helpers";
import { printShops } from "./fixtures";

const servers: TestServer[] = [];
const clients: Client[] = [];
afterAll(async () => {
  for (const c of clients) c.disconnect();
  for (const s of servers) {
    await s.stop();
    removeDataDir(s.dataDir);
  }
});

async function server(opts: Parameters<typeof startServer>[0] = {}) {
  const s = await startServer(opts);
  servers.push(s);
  return s;
}
async function client(url: string) {
  const c = await connect(url);
  clients.push(c);
  return c;
}
async function getJson(url: string) {
  const res = await fetch(url);
  return { status: res.status, body: (await res.json()) as Record<string, unknown> };
}

describe("health and readiness", () => {
  it("both answer without any session data; the session export (positive control) has it", async () => {
    const s = await server();
    const created = await createSessionOverHttp(s.url, {
      ...printShops(),
      title: "Kiosk pricing drill",
    });
    // the session's own export (its facilitator key) is the positive control
    const list = await fetch(`${s.url}/api/sessions/${created.id}/export`, {
      headers: { authorization: `Bearer ${created.facilitatorKey}` },
    }).then((r) => r.text());
    expect(list).toContain("Kiosk pricing drill");
    expect(list).toContain(created.id);

    const health = await getJson(`${s.url}/api/health`);
    expect(health.status).toBe(200);
    expect(health.body).toEqual({ ok: true, version: expect.any(String) as unknown, db: "pglite" });
    const ready = await getJson(`${s.url}/api/ready`);
    expect(ready).toEqual({ status: 200, body: { ok: true, db: "pglite" } });
    for (const text of [JSON.stringify(health.body), JSON.stringify(ready.body)]) {
      expect(text).not.toContain("Kiosk");
      expect(text).not.toContain(created.id);
    }
    const post = await fetch(`${s.url}/api/ready`, { method: "POST" });
    expect(post.status).toBe(405);
  });

  it("503 migrations-pending when a migration is not recorded; 503 unreachable when the database does not answer in time", async () => {
    const clock = createManualClock();
    const s = await server({ clock });
    const last = readMigrations().at(-1)!.name;
    await s.db.prisma.$executeRawUnsafe(
      `DELETE FROM "${MIGRATIONS_TABLE}" WHERE "name" = '${last}'`,
    );
    expect(await getJson(`${s.url}/api/ready`)).toEqual({
      status: 503,
      body: { ok: false, db: "pglite", reason: "migrations-pending" },
    });

    // A database that never answers: the probe gives up after READY_TIMEOUT_MS on the clock.
    const stuck: Database = { ...s.db, readiness: () => new Promise(() => {}) };
    const stuckClock = createManualClock();
    const app = createApplication({ db: stuck, clock: stuckClock, load: fixedGauge(0) });
    const { port } = await app.listen(0, "127.0.0.1");
    try {
      const pending = getJson(`http://127.0.0.1:${port}/api/ready`);
      await eventually(() => expect(stuckClock.pending()).toBeGreaterThan(0));
      stuckClock.advance(READY_TIMEOUT_MS - 1);
      let settled = false;
      void pending.then(() => (settled = true));
      await new Promise((r) => setImmediate(r));
      expect(settled).toBe(false);
      stuckClock.advance(1);
      expect(await pending).toEqual({
        status: 503,
        body: { ok: false, db: "pglite", reason: "unreachable" },
      });
    } finally {
      await app.close();
    }
  });
});

describe("drain", () => {
  it("stops taking connections, lets the commit under way finish and ack, then closes every transport", async () => {
    const s = await server();
    const created = await createSessionOverHttp(s.url, printShops({ rounds: 2 }));
    const fac = await client(s.url);
    expectOk(
      await hello(fac, { role: "facilitator", sessionId: created.id, key: created.facilitatorKey }),
    );
    expectOk(await command(fac, { type: "openRound" }));
    const seat = await client(s.url);
    expectOk(
      await hello(seat, { role: "seat", sessionId: created.id, key: created.seats[0]!.key }),
    );

    // Hold the next commit at the database until the test lets it go.
    const append = s.db.events.append.bind(s.db.events);
    let release!: () => void;
    const gate = new Promise<void>((r) => (release = r));
    let reached!: () => void;
    const atGate = new Promise<void>((r) => (reached = r));
    s.db.events.append = async (...args: Parameters<typeof append>) => {
      reached();
      await gate;
      return append(...args);
    };
    const disconnects: string[] = [];
    seat.on("disconnect", (reason) => disconnects.push(reason));
    const ack = command(seat, { type: "sealMove", clientMoveId: "m-drain", effort: 30 });
    await atGate;

    let closed = false;
    const closing = s.app.close().then(() => (closed = true));
    // new connections are refused at once, while the commit is still held
    await eventually(() => expect(s.app.http.listening).toBe(false));
    await expect(fetch(`${s.url}/api/health`)).rejects.toThrow();
    await new Promise((r) => setImmediate(r));
    expect(closed).toBe(false);
    expect(disconnects).toEqual([]);

    // a command arriving during the drain is refused, and that refusal is acked too
    const late = command(seat, { type: "sealMove", clientMoveId: "m-late", effort: 31 });
    release();
    const sealed = expectOk(await ack);
    expect(await late).toEqual({
      ok: false,
      code: "unavailable",
      message: "the server is shutting down; try again",
    });
    await closing;
    expect(closed).toBe(true);
    // a transport close: socket.io clients reconnect by themselves (to another process)
    await eventually(() => expect(disconnects).toEqual(["transport close"]));
    const log = await eventLog(s.db, created.id);
    expect(log.find((e) => e.seq === sealed.seq)).toMatchObject({
      type: "move-sealed",
      clientMoveId: "m-drain",
    });
    expect(log.some((e) => e.type === "move-sealed" && e.clientMoveId === "m-late")).toBe(false);
  });
});

describe("shutdown", () => {
  it("runs every step in order and exits 0 once; a second signal changes nothing", async () => {
    const clock = createManualClock();
    const order: string[] = [];
    const exits: number[] = [];
    const stop = createShutdown({
      steps: ["app", "web", "db"].map((name) => async () => void order.push(name)),
      clock,
      logger: silentLogger,
      exit: (code) => exits.push(code),
    });
    await Promise.all([stop("SIGTERM"), stop("SIGINT")]);
    expect(order).toEqual(["app", "web", "db"]);
    expect(exits).toEqual([0]);
    expect(clock.pending()).toBe(0);
  });

  it("a drain that hangs is cut after the grace time with exit 1; a failing step exits 1", async () => {
    const clock = createManualClock();
    const exits: number[] = [];
    const stop = createShutdown({
      steps: [() => new Promise<void>(() => {})],
      clock,
      logger: silentLogger,
      exit: (code) => exits.push(code),
      graceMs: 5_000,
    });
    void stop("SIGTERM");
    await new Promise((r) => setImmediate(r));
    clock.advance(4_999);
    expect(exits).toEqual([]);
    clock.advance(1);
    expect(exits).toEqual([1]);

    const failed: number[] = [];
    await createShutdown({
      steps: [() => Promise.reject(new Error("db close failed"))],
      clock,
      logger: silentLogger,
      exit: (code) => failed.push(code),
    })("SIGTERM");
    expect(failed).toEqual([1]);
  });
});
