/**
 * WORKERS=2 npm start on PostgreSQL (src/cluster.ts): one port, two worker processes, each
 * client's connection kept on one worker; a worker that dies is started again while the
 * other keeps serving; SIGTERM drains both and exits 0. Real processes: every wait is for
 * their output or an answer, with a generous bound.
 */
import type { ChildProcess } from "node:child_process";
import { spawnServer } from "@contend/bench/serverProcess";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import {
  command,
  connect,
  createSessionOverHttp,
  eventually,
  expectOk,
  hello,
  lastView,
} from "./helpers";
import type { Client } from "./helpers";
import { printShops } from "./fixtures";
import { SESSION_ROUTE_PARAM } from "@contend/protocol";
import type { Health } from "@contend/protocol";
import { get } from "node:http";
import { workerForSession } from "../src/cluster";
import { freshPostgres, TEST_DATABASE_URL } from "./pgDatabase";

/** GET on a connection of its own (no keep-alive reuse), as a new socket's handshake is. */
function healthOnNewConnection(url: string): Promise<Health> {
  return new Promise((resolve, reject) => {
    get(url, { agent: false }, (res) => {
      let body = "";
      res.on("data", (c: Buffer) => (body += c.toString()));
      res.on("end", () => resolve(JSON.parse(body) as Health));
    }).on("error", reject);
  });
}

describe.skipIf(!TEST_DATABASE_URL)("WORKERS=2 behind one port", () => {
  let database: { url: string; dispose(): Promise<void> } | null = null;
  let primary: ChildProcess | null = null;
  const clients: Client[] = [];

  beforeAll(async () => {
    database = await freshPostgres(TEST_DATABASE_URL!);
  });
  afterAll(async () => {
    for (const c of clients) c.disconnect();
    if (primary && primary.exitCode === null && primary.signalCode === null) {
      process.kill(-primary.pid!, "SIGKILL");
    }
    await database?.dispose();
  });

  it("serves a session through the one port, restarts a dead worker, and drains on SIGTERM", async () => {
    const proc = spawnServer({
      env: {
        DATABASE_URL: database!.url,
        WORKERS: "2",
        PORT: "0",
        HOST: "127.0.0.1",
        WEB: "off",
        DEMO: "off",
        PUBLIC_URL: "",
        LOG_LEVEL: "info",
        CONTEND_OPERATOR_KEY: "k".repeat(32),
      },
      detached: true,
    });
    primary = proc;
    let out = "";
    proc.stdout!.on("data", (c: Buffer) => (out += c.toString()));
    proc.stderr!.on("data", (c: Buffer) => (out += c.toString()));
    const url = await eventually(() => {
      const m = /listening on (http:\/\/127\.0\.0\.1:\d+) with 2 workers/.exec(out);
      expect(m, out).not.toBeNull();
      return m![1]!;
    }, 60_000);
    const workerPids = () =>
      [...out.matchAll(/worker ready.*?"pid":(\d+)/g)].map((m) => Number(m[1]));
    expect(workerPids()).toHaveLength(2);
    expect((await fetch(`${url}/api/ready`)).status).toBe(200);

    const created = await createSessionOverHttp(url, printShops({ rounds: 2 }));
    const id = created.id;
    const open = async () => {
      const c = await connect(url);
      clients.push(c);
      return c;
    };
    const fac = await open();
    expectOk(await hello(fac, { role: "facilitator", sessionId: id, key: created.facilitatorKey }));
    const seats: Client[] = [];
    for (let i = 0; i < 3; i++) {
      const s = await open();
      expectOk(await hello(s, { role: "seat", sessionId: id, key: created.seats[i]!.key }));
      seats.push(s);
    }
    expectOk(await command(fac, { type: "openRound" }));
    for (const [i, s] of seats.entries()) {
      await eventually(() => expect(lastView(s).status).toBe("open"), 20_000);
      expectOk(await command(s, { type: "sealMove", clientMoveId: `m${i}`, effort: 10 + i }));
    }
    for (const c of [fac, ...seats]) {
      await eventually(() => expect(lastView(c).rounds).toHaveLength(1), 20_000);
    }

    // A new connection naming a session goes to that session's worker, every time; the
    // answers come from both workers, so the check would fail if they all went to one.
    const sessionIds = ["route-a", "route-b", "route-c", "route-d", "route-e", "route-f"];
    const answeredBy = new Set<number>();
    for (const sessionId of sessionIds) {
      for (let k = 0; k < 3; k++) {
        const health = await healthOnNewConnection(
          `${url}/api/health?${SESSION_ROUTE_PARAM}=${sessionId}`,
        );
        expect(health.worker, sessionId).toBe(workerForSession(sessionId, 2));
        answeredBy.add(health.worker!);
      }
    }
    expect([...answeredBy].sort()).toEqual([0, 1]);

    // a worker dies: the primary starts it again, and the port keeps answering meanwhile
    const [first] = workerPids();
    process.kill(first!, "SIGKILL");
    await eventually(() => expect(out).toContain("worker exited; starting it again"), 20_000);
    await eventually(() => expect(workerPids()).toHaveLength(3), 60_000);
    expect((await fetch(`${url}/api/ready`)).status).toBe(200);

    const exit = new Promise<number | null>((resolve) =>
      proc.once("exit", (code) => resolve(code)),
    );
    proc.kill("SIGTERM");
    expect(await exit).toBe(0);
    expect(out).toContain("draining 2 workers");
  }, 120_000);
});
