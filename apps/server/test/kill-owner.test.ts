/**
 * Two real server processes (src/main.ts) on one PostgreSQL, seats of one session on both,
 * a computer seat and a round clock. The process holding the session's lease (seen in
 * pg_locks, by the feed connection's application_name) is SIGKILLed mid-round, right after
 * acknowledging a move: the other takes the clock over within LEASE_RETRY_MS (plus a generous
 * margin for a loaded machine), the killed process's clients reconnect to it, the clock closes
 * the round once, and the log holds every acknowledged move with no gap or repeat. Real
 * processes run on real time: every wait here is for an event, with a generous bound.
 */
import type { ChildProcess } from "node:child_process";
import { spawnServer } from "@contend/bench/serverProcess";
import { leaseKey, openDatabase } from "@contend/db";
import pg from "pg";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { LEASE_RETRY_MS } from "../src/live/duties";
import {
  command,
  connect,
  createSessionOverHttp,
  eventLog,
  eventually,
  expectOk,
  hello,
  lastView,
} from "./helpers";
import type { Client } from "./helpers";
import { printShops } from "./fixtures";
import { freshPostgres, TEST_DATABASE_URL } from "./pgDatabase";

interface Proc {
  proc: ChildProcess;
  url: string;
  output: () => string;
}

function startProcess(databaseUrl: string): Promise<Proc> {
  const proc = spawnServer({
    env: {
      DATABASE_URL: databaseUrl,
      PORT: "0",
      HOST: "127.0.0.1",
      WEB: "off",
      DEMO: "off",
      PUBLIC_URL: "",
      LOG_LEVEL: "info",
      CONTEND_OPERATOR_KEY: "k".repeat(32),
    },
  });
  let out = "";
  return new Promise((resolve, reject) => {
    const onData = (chunk: Buffer) => {
      out += chunk.toString();
      const m = /listening on (http:\/\/127\.0\.0\.1:\d+)/.exec(out);
      if (m) resolve({ proc, url: m[1]!, output: () => out });
    };
    proc.stdout!.on("data", onData);
    proc.stderr!.on("data", onData);
    proc.once("exit", (code) => reject(new Error(`server exited (${code}):\n${out}`)));
  });
}

/** The OS pid of the server process holding the session's lease, or null. */
async function leaseHolder(admin: pg.Client, sessionId: string): Promise<number | null> {
  const key = BigInt.asUintN(64, BigInt(leaseKey(sessionId)));
  const r = await admin.query<{ name: string }>(
    `SELECT a.application_name AS name FROM pg_locks l JOIN pg_stat_activity a ON a.pid = l.pid
     WHERE l.locktype = 'advisory' AND l.granted AND l.objsubid = 1
       AND l.classid = $1::bigint::oid AND l.objid = $2::bigint::oid`,
    [(key >> 32n).toString(), (key & 0xffffffffn).toString()],
  );
  const m = /^contend-feed-(\d+)$/.exec(r.rows[0]?.name ?? "");
  return m ? Number(m[1]) : null;
}

describe.skipIf(!TEST_DATABASE_URL)("SIGKILL of the process that runs a session's clock", () => {
  let database: { url: string; dispose(): Promise<void> } | null = null;
  let admin: pg.Client | null = null;
  const procs: Proc[] = [];
  const clients: Client[] = [];

  beforeAll(async () => {
    database = await freshPostgres(TEST_DATABASE_URL!);
    admin = new pg.Client({ connectionString: database.url });
    await admin.connect();
  });
  afterAll(async () => {
    for (const c of clients) c.disconnect();
    for (const p of procs)
      if (p.proc.exitCode === null && p.proc.signalCode === null) p.proc.kill("SIGKILL");
    await admin?.end();
    await database?.dispose();
  });

  it("the other process takes the clock over, clients reconnect, no acked move is lost and no event repeats", async () => {
    const a = await startProcess(database!.url);
    procs.push(a);
    const b = await startProcess(database!.url);
    procs.push(b);
    const created = await createSessionOverHttp(
      a.url,
      printShops({ rounds: 2, computer: { "Cobble Copy": { kind: "fixed", effort: 13.25 } } }),
    );
    const id = created.id;
    const open = async (p: Proc) => {
      const c = await connect(p.url);
      clients.push(c);
      return c;
    };
    const seatCreds = (i: number) => ({ role: "seat", sessionId: id, key: created.seats[i]!.key });
    const facCreds = { role: "facilitator", sessionId: id, key: created.facilitatorKey };
    const fac = await open(a);
    expectOk(await hello(fac, facCreds));
    const seats = [await open(a), await open(b)];
    for (const [i, s] of seats.entries()) expectOk(await hello(s, seatCreds(i)));
    const screenB = await open(b);
    expectOk(await hello(screenB, { role: "spectator", sessionId: id, key: created.spectatorKey }));

    // Round 1, no clock: a seat on each process seals; every socket sees the reveal.
    expectOk(await command(fac, { type: "openRound" }));
    await eventually(() => expect(lastView(seats[1]!).status).toBe("open"), 20_000);
    const acked: number[] = [];
    acked.push(
      expectOk(await command(seats[0]!, { type: "sealMove", clientMoveId: "r1-0", effort: 30 }))
        .seq,
    );
    acked.push(
      expectOk(await command(seats[1]!, { type: "sealMove", clientMoveId: "r1-1", effort: 20 }))
        .seq,
    );
    for (const c of [fac, ...seats, screenB]) {
      await eventually(() => expect(lastView(c).rounds).toHaveLength(1), 20_000);
    }

    // Round 2 on a 10 s clock (room for the takeover on a loaded machine).
    const holderPid = await eventually(async () => {
      const pid = await leaseHolder(admin!, id);
      expect([a.proc.pid, b.proc.pid]).toContain(pid);
      return pid!;
    }, 20_000);
    const owner = holderPid === a.proc.pid ? a : b;
    const survivor = owner === a ? b : a;
    const facOnSurvivor = await open(survivor);
    expectOk(await hello(facOnSurvivor, facCreds));
    expectOk(await command(facOnSurvivor, { type: "openRound", durationSeconds: 10 }));
    // the seat on the owner seals; the owner is killed right after acknowledging it
    const ownerSeat = owner === a ? 0 : 1;
    await eventually(() => expect(lastView(seats[ownerSeat]!).status).toBe("open"), 20_000);
    acked.push(
      expectOk(
        await command(seats[ownerSeat]!, { type: "sealMove", clientMoveId: "r2", effort: 25 }),
      ).seq,
    );
    const killedAt = Date.now();
    owner.proc.kill("SIGKILL");
    await eventually(
      async () => expect(await leaseHolder(admin!, id)).toBe(survivor.proc.pid),
      20_000,
    );
    const takeoverMs = Date.now() - killedAt;
    // LEASE_RETRY_MS is the stated bound; the margin covers a machine shared with other work
    expect(takeoverMs).toBeLessThan(LEASE_RETRY_MS + 3_000);

    // The killed process's clients reconnect (to the survivor, as a proxy would send them).
    const rejoined: Client[] = [];
    for (const [i, s] of seats.entries()) {
      if (i !== ownerSeat) continue;
      await eventually(() => expect(s.connected).toBe(false), 20_000);
      const again = await open(survivor);
      const ack = expectOk(await hello(again, seatCreds(i)));
      // its acknowledged move is there after the crash
      expect(ack.view.seats[i]!.sealed).toBe(true);
      rejoined.push(again);
    }
    const watchers = [facOnSurvivor, ...rejoined, ...(survivor === b ? [screenB] : [])];
    // the survivor's clock closes round 2, which ends the session
    for (const c of watchers) {
      await eventually(() => expect(lastView(c).status).toBe("ended"), 30_000);
    }
    expect(lastView(facOnSurvivor).rounds.map((r) => r.reason)).toEqual(["all-sealed", "clock"]);

    const db = await openDatabase({ url: database!.url });
    try {
      const log = await eventLog(db, id);
      expect(log.map((e) => e.seq)).toEqual(log.map((_, i) => i + 1));
      for (const seq of acked) expect(log.find((e) => e.seq === seq)?.type).toBe("move-sealed");
      expect(log.filter((e) => e.type === "round-resolved")).toHaveLength(2);
      const computer = log.filter((e) => e.type === "move-sealed" && e.seatIndex === 2);
      expect(computer.map((e) => (e.type === "move-sealed" ? e.round : 0))).toEqual([1, 2]);
    } finally {
      await db.close();
    }
    expect(survivor.output()).not.toMatch(/clock close failed|catch-up failed/);
  }, 120_000);
});
