/**
 * SIGTERM to a real server process (src/main.ts, started by the one helper that starts the
 * real server, with the Node flags `npm start` uses): it drains and exits 0, a connected
 * client sees its transport close (socket.io reconnects after that by itself), the port takes
 * no new connections, and every acked move is in the log afterwards. Nothing here waits on a
 * timer: each step waits for the process's own output or events.
 */
import type { ChildProcess } from "node:child_process";
import { spawnServer } from "@contend/bench/serverProcess";
import { openDatabase } from "@contend/db";
import { afterAll, describe, expect, it } from "vitest";
import {
  command,
  connect,
  createSessionOverHttp,
  eventLog,
  expectOk,
  freshDataDir,
  hello,
  removeDataDir,
} from "./helpers";
import type { Client } from "./helpers";
import { printShops } from "./fixtures";

const dataDir = freshDataDir();
const clients: Client[] = [];
let child: ChildProcess | null = null;
afterAll(() => {
  for (const c of clients) c.disconnect();
  if (child && child.exitCode === null && child.signalCode === null) child.kill("SIGKILL");
  removeDataDir(dataDir);
});

/** Starts src/main.ts; resolves with its address once it logs that it listens. */
function startProcess(): Promise<{ proc: ChildProcess; url: string; output: () => string }> {
  const proc = spawnServer({
    env: {
      DATABASE_URL: dataDir,
      PORT: "0",
      HOST: "127.0.0.1",
      WEB: "off",
      DEMO: "off",
      PUBLIC_URL: "",
      LOG_LEVEL: "info",
    },
  });
  let out = "";
  const output = () => out;
  return new Promise((resolve, reject) => {
    const onData = (chunk: Buffer) => {
      out += chunk.toString();
      const m = /listening on (http:\/\/127\.0\.0\.1:\d+)/.exec(out);
      if (m) resolve({ proc, url: m[1]!, output });
    };
    proc.stdout!.on("data", onData);
    proc.stderr!.on("data", onData);
    proc.once("exit", (code) =>
      reject(new Error(`server exited (${code}) before listening:\n${out}`)),
    );
  });
}

function exited(proc: ChildProcess): Promise<{ code: number | null; signal: string | null }> {
  if (proc.exitCode !== null || proc.signalCode !== null) {
    return Promise.resolve({ code: proc.exitCode, signal: proc.signalCode });
  }
  return new Promise((resolve) => proc.once("exit", (code, signal) => resolve({ code, signal })));
}

describe("SIGTERM to a real server process", () => {
  it("drains: the acked move is kept, the client's transport closes, the port closes, exit 0", async () => {
    const started = await startProcess();
    child = started.proc;
    const { url } = started;
    expect((await fetch(`${url}/api/ready`)).status).toBe(200);
    const created = await createSessionOverHttp(url, printShops({ rounds: 2 }));
    const fac = await connect(url);
    const seat = await connect(url);
    clients.push(fac, seat);
    expectOk(
      await hello(fac, { role: "facilitator", sessionId: created.id, key: created.facilitatorKey }),
    );
    expectOk(await command(fac, { type: "openRound" }));
    expectOk(
      await hello(seat, { role: "seat", sessionId: created.id, key: created.seats[0]!.key }),
    );
    const sealed = expectOk(
      await command(seat, { type: "sealMove", clientMoveId: "m-term", effort: 42 }),
    );

    const disconnected = new Promise<string>((resolve) => seat.once("disconnect", resolve));
    child.kill("SIGTERM");
    // "transport close" is a reason socket.io clients reconnect after by themselves
    expect(await disconnected).toBe("transport close");
    expect(await exited(child)).toEqual({ code: 0, signal: null });
    expect(started.output()).toContain("SIGTERM: draining");
    expect(started.output()).toContain("shut down cleanly");
    await expect(fetch(`${url}/api/health`)).rejects.toThrow();

    const db = await openDatabase({ url: dataDir });
    try {
      const log = await eventLog(db, created.id);
      expect(log.find((e) => e.seq === sealed.seq)).toMatchObject({
        type: "move-sealed",
        clientMoveId: "m-term",
        effort: 42,
      });
    } finally {
      await db.close();
    }
  });
});
