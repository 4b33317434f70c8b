/** A real server on an ephemeral port with a real embedded database, and real socket clients. */
import { cpSync, mkdtempSync, rmSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { openDatabase } from "@contend/db";
import type { Database } from "@contend/db";
import type {
  Ack,
  ClientToServerEvents,
  CommandAckData,
  CreateSessionResponse,
  HelloAckData,
  ServerToClientEvents,
  SessionEvent,
  ViewMessage,
  ViewTracker,
} from "@contend/protocol";
import { createViewTracker } from "@contend/protocol";
import { io as connectClient } from "socket.io-client";
import type { Socket } from "socket.io-client";
import { afterAll, beforeAll, inject } from "vitest";
import { createApplication } from "../src/app";
import type { Application, ApplicationDeps } from "../src/app";
import type { Clock } from "../src/clock";
import { fixedGauge } from "../src/loadGauge";

export interface TestServer {
  app: Application;
  db: Database;
  url: string;
  dataDir: string;
  stop(): Promise<void>;
}

/** A fresh data directory holding a migrated, empty database. */
export function freshDataDir(): string {
  const root = mkdtempSync(path.join(os.tmpdir(), "contend-server-test-"));
  const dir = path.join(root, "pglite");
  cpSync(inject("templateDir"), dir, { recursive: true });
  return dir;
}

export function removeDataDir(dir: string) {
  rmSync(path.dirname(dir), { recursive: true, force: true });
}

export async function startServer(
  opts: {
    dataDir?: string;
    clock?: Clock;
    /** changes the database before the server uses it (e.g. to hold back its feed) */
    wrapDatabase?: (db: Database) => Database;
  } & Omit<ApplicationDeps, "db" | "clock"> = {},
): Promise<TestServer> {
  const dataDir = opts.dataDir ?? freshDataDir();
  const opened = await openDatabase({ url: dataDir });
  const db = opts.wrapDatabase ? opts.wrapDatabase(opened) : opened;
  const { dataDir: _d, wrapDatabase: _w, ...deps } = opts;
  // A fixed quiet reading: the test machine's own load must not change the progress window.
  const app = createApplication({ load: fixedGauge(0), ...deps, db });
  await app.restore();
  const { port } = await app.listen(0, "127.0.0.1");
  let stopped = false;
  return {
    app,
    db,
    url: `http://127.0.0.1:${port}`,
    dataDir,
    async stop() {
      if (stopped) return;
      stopped = true;
      await app.close();
      await db.close();
    },
  };
}

export type Client = Socket<ServerToClientEvents, ClientToServerEvents> & {
  /** every view this client held, in order: full views, and each pushed patch applied */
  views: ViewMessage[];
  /** patches that did not fit the view held (a client would say hello again) */
  patchGaps: number;
  tracker: ViewTracker;
  /** every payload this client received, as JSON text, in order */
  received: string[];
};

/** A test client; `query` is added to the socket.io handshake (e.g. the session it is for). */
export async function connect(url: string, query?: Record<string, string>): Promise<Client> {
  const socket = connectClient(url, {
    transports: ["websocket"],
    ...(query ? { query } : {}),
    reconnection: false,
    forceNew: true,
  }) as Client;
  socket.views = [];
  socket.received = [];
  socket.patchGaps = 0;
  socket.tracker = createViewTracker();
  socket.on("view", (msg) => {
    if (socket.tracker.snapshot(msg.seq, msg.view)) socket.views.push(msg);
  });
  socket.on("viewPatch", (msg) => {
    const outcome = socket.tracker.patch(msg);
    if (outcome === "resync") socket.patchGaps++;
    if (outcome === "applied") socket.views.push({ seq: msg.seq, view: socket.tracker.view! });
  });
  socket.onAny((event: string, ...args: unknown[]) =>
    socket.received.push(JSON.stringify([event, ...args])),
  );
  await new Promise<void>((resolve, reject) => {
    socket.once("connect", () => resolve());
    socket.once("connect_error", reject);
  });
  return socket;
}

/**
 * Emits with an ack and a timeout; records the ack in `received` as well. A hello ack's view
 * goes to the tracker inside the ack callback, before any push queued behind it is handled.
 */
export function request<T>(socket: Client, event: string, payload: unknown): Promise<Ack<T>> {
  const emitter = socket.timeout(10_000) as unknown as {
    emit(event: string, payload: unknown, cb: (err: Error | null, res: Ack<T>) => void): void;
  };
  return new Promise((resolve, reject) => {
    emitter.emit(event, payload, (err, res) => {
      if (err) return reject(err);
      socket.received.push(JSON.stringify(["ack", res]));
      if (event === "hello" && res.ok) {
        const data = res.data as HelloAckData;
        socket.tracker.snapshot(data.seq, data.view, true);
      }
      resolve(res);
    });
  });
}

export function hello(socket: Client, credentials: unknown, lastSeq?: number) {
  return request<HelloAckData>(socket, "hello", {
    protocol: 2,
    credentials,
    ...(lastSeq === undefined ? {} : { lastSeq }),
  });
}

export function command(socket: Client, cmd: unknown) {
  return request<CommandAckData>(socket, "command", cmd);
}

export function expectOk<T>(ack: Ack<T>): T {
  if (!ack.ok) throw new Error(`expected ok, got ${ack.code}: ${ack.message}`);
  return ack.data;
}

export async function createSessionOverHttp(
  url: string,
  body: unknown,
): Promise<CreateSessionResponse> {
  const res = await fetch(`${url}/api/sessions`, {
    method: "POST",
    headers: { "content-type": "application/json" },
    body: JSON.stringify(body),
  });
  if (res.status !== 201) throw new Error(`create failed ${res.status}: ${await res.text()}`);
  return (await res.json()) as CreateSessionResponse;
}

/**
 * Connects and says hello as every role of a created session: facilitator, big screen, a guest
 * by join code and each of its first `seatCount` seats (the leak tests watch all of them).
 */
export async function helloEveryRole(
  client: () => Promise<Client>,
  created: CreateSessionResponse,
  seatCount: number,
) {
  const id = created.id;
  const fac = await client();
  const screen = await client();
  const guest = await client();
  const seats: Client[] = [];
  for (let i = 0; i < seatCount; i++) seats.push(await client());
  expectOk(await hello(fac, { role: "facilitator", sessionId: id, key: created.facilitatorKey }));
  expectOk(await hello(screen, { role: "spectator", sessionId: id, key: created.spectatorKey }));
  expectOk(await hello(guest, { role: "guest", joinCode: created.joinCode }));
  for (const [i, s] of seats.entries()) {
    expectOk(await hello(s, { role: "seat", sessionId: id, key: created.seats[i]!.key }));
  }
  return { fac, screen, guest, seats };
}

/** GET with the key in the Authorization header (the only place REST reads keys from). */
export function getWithKey(url: string, key: string): Promise<Response> {
  return fetch(url, { headers: { authorization: `Bearer ${key}` } });
}

export async function eventLog(db: Database, sessionId: string): Promise<SessionEvent[]> {
  return await db.events.list(sessionId);
}

/** Waits until `check` passes (polling), for pushed views that arrive after an ack. */
export async function eventually<T>(check: () => T | Promise<T>, timeoutMs = 5_000): Promise<T> {
  const start = Date.now();
  for (;;) {
    try {
      return await check();
    } catch (error) {
      if (Date.now() - start > timeoutMs) throw error;
      await new Promise((r) => setTimeout(r, 20));
    }
  }
}

export function lastView(socket: Client) {
  const msg = socket.views.at(-1);
  if (!msg) throw new Error("no view received yet");
  return msg.view;
}

/** Limits per connection and per address so high that a flood of messages reaches validation. */
export const FLOOD_LIMITS = {
  ratePerSecond: 1e6,
  rateBurst: 1e6,
  messagesPerIpPerSecond: 1e6,
  authFailuresPerIpPerMinute: 1e6,
};

/**
 * One server for a whole test file (started before its tests, stopped and its data removed
 * after) and a `client()` whose sockets are all closed at the end.
 */
export function serverForFile(opts: Parameters<typeof startServer>[0] = {}) {
  let current: TestServer | null = null;
  const clients: Client[] = [];
  beforeAll(async () => {
    current = await startServer(opts);
  });
  afterAll(async () => {
    for (const c of clients) c.disconnect();
    if (!current) return;
    await current.stop();
    removeDataDir(current.dataDir);
  });
  const file = {
    get server(): TestServer {
      if (!current) throw new Error("the server starts in beforeAll");
      return current;
    },
    /** a connected client (to this file's server unless another url is given) */
    async client(url?: string): Promise<Client> {
      const c = await connect(url ?? file.server.url);
      clients.push(c);
      return c;
    },
  };
  return file;
}
