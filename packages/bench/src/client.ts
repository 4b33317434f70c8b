/**
 * One socket.io connection speaking the session protocol: hello, commands with acks, pushed
 * views and view patches (applied with the protocol's own tracker, as the web client does). The same class drives the real server and the bare baseline. Each client has its own
 * engine.io connection (forceNew), as a browser tab would; without it socket.io multiplexes
 * every client of one URL over a single WebSocket.
 */
import { io } from "socket.io-client";
import type { Socket } from "socket.io-client";
import { createViewTracker, PROTOCOL_VERSION, SESSION_ROUTE_PARAM } from "@contend/protocol";
import type { RoleView, ViewPatchMessage } from "@contend/protocol";

export type Credentials =
  | { role: "facilitator"; sessionId: string; key: string }
  | { role: "seat"; sessionId: string; key: string }
  | { role: "spectator"; sessionId: string; key: string };

export interface AckLike {
  ok: boolean;
  code?: string;
  message?: string;
  data?: Record<string, unknown> & { seq?: number; view?: ViewLike };
}

/** The few view fields the driver reads (the real RoleView has many more). */
export interface ViewLike {
  status: string;
  round: number;
  rounds: unknown[];
  you?: { seatIndex: number; sealedEffort: number | null; clientMoveId: string | null };
}

interface Waiter {
  test: (view: ViewLike) => boolean;
  resolve: (at: number) => void;
}

export interface ClientOptions {
  url: string;
  credentials: Credentials;
  /** reconnect (and say hello again with lastSeq) after the connection drops */
  reconnect?: boolean;
  ackTimeoutMs?: number;
}

export class SessionClient {
  readonly socket: Socket;
  readonly credentials: Credentials;
  lastSeq = 0;
  lastView: ViewLike | null = null;
  /** patches that did not fit the view held (each answered with a new hello) */
  patchGaps = 0;
  private readonly tracker = createViewTracker();
  private helloInFlight = false;
  viewsReceived = 0;
  viewBytes = 0;
  hellos = 0;
  /** reasons the connection dropped, as socket.io reports them */
  disconnects: string[] = [];
  private waiters: Waiter[] = [];
  private readonly ackTimeoutMs: number;
  private helloListeners: Array<(ack: AckLike) => void> = [];

  constructor(opts: ClientOptions) {
    this.credentials = opts.credentials;
    this.ackTimeoutMs = opts.ackTimeoutMs ?? 30_000;
    this.socket = io(opts.url, {
      transports: ["websocket"],
      // as the web app does: the session this socket is for (WORKERS=N keeps them together)
      ...("sessionId" in opts.credentials
        ? { query: { [SESSION_ROUTE_PARAM]: opts.credentials.sessionId } }
        : {}),
      forceNew: true,
      autoConnect: false,
      reconnection: opts.reconnect ?? false,
      reconnectionDelay: 200,
      reconnectionDelayMax: 1000,
      timeout: 20_000,
    });
    this.socket.on("view", (msg: { seq: number; view: ViewLike }) => {
      this.viewsReceived++;
      if (this.tracker.snapshot(msg.seq, msg.view as unknown as RoleView)) this.took();
    });
    this.socket.on("viewPatch", (msg: ViewPatchMessage) => {
      this.viewsReceived++;
      if (this.helloInFlight) return;
      const outcome = this.tracker.patch(msg);
      if (outcome === "applied") this.took();
      else if (outcome === "resync") {
        this.patchGaps++;
        void this.hello();
      }
    });
    this.socket.on("disconnect", (reason) => {
      if (reason !== "io client disconnect") this.disconnects.push(reason);
    });
    if (opts.reconnect) {
      // After a reconnect the server knows nothing about this socket: say hello again.
      this.socket.io.on("reconnect", () => {
        void this.hello().then((ack) => {
          for (const l of this.helloListeners) l(ack);
        });
      });
    }
  }

  /** Measures pushed sizes too (a JSON.stringify per push; only used while sampling). */
  sampleViewSizes() {
    for (const event of ["view", "viewPatch"]) {
      this.socket.on(event, (msg: unknown) => {
        this.viewBytes += JSON.stringify(msg).length;
      });
    }
  }

  private took() {
    this.lastSeq = this.tracker.seq;
    this.lastView = this.tracker.view as unknown as ViewLike;
    this.checkWaiters(this.lastView);
  }

  onRehello(listener: (ack: AckLike) => void) {
    this.helloListeners.push(listener);
  }

  connect(timeoutMs = 20_000): Promise<void> {
    return new Promise((resolve, reject) => {
      const timer = setTimeout(() => reject(new Error("connect timeout")), timeoutMs);
      this.socket.once("connect", () => {
        clearTimeout(timer);
        resolve();
      });
      this.socket.once("connect_error", (error) => {
        clearTimeout(timer);
        reject(error);
      });
      this.socket.connect();
    });
  }

  async emit(event: string, payload: unknown): Promise<AckLike> {
    try {
      return (await this.socket.timeout(this.ackTimeoutMs).emitWithAck(event, payload)) as AckLike;
    } catch {
      return { ok: false, code: "timeout", message: `no ack within ${this.ackTimeoutMs} ms` };
    }
  }

  /** The ack's view goes to the tracker inside the ack callback, before any push behind it. */
  hello(): Promise<AckLike> {
    const msg = {
      protocol: PROTOCOL_VERSION,
      credentials: this.credentials,
      ...(this.lastSeq > 0 ? { lastSeq: this.lastSeq } : {}),
    };
    this.helloInFlight = true;
    return new Promise((resolve) => {
      this.socket.timeout(this.ackTimeoutMs).emit("hello", msg, (err: unknown, ack: AckLike) => {
        this.helloInFlight = false;
        if (err) {
          resolve({ ok: false, code: "timeout", message: `no ack within ${this.ackTimeoutMs} ms` });
          return;
        }
        if (ack.ok) {
          this.hellos++;
          const view = ack.data?.view;
          if (view && typeof ack.data?.seq === "number") {
            this.tracker.snapshot(ack.data.seq, view as unknown as RoleView, true);
            this.took();
          }
        }
        resolve(ack);
      });
    });
  }

  command(cmd: Record<string, unknown>): Promise<AckLike> {
    return this.emit("command", cmd);
  }

  /** Resolves with the arrival time (performance.now) of the first view passing test. */
  waitForView(test: (view: ViewLike) => boolean, timeoutMs = 60_000): Promise<number | null> {
    if (this.lastView && test(this.lastView)) return Promise.resolve(performance.now());
    return new Promise((resolve) => {
      const timer = setTimeout(() => {
        this.waiters = this.waiters.filter((w) => w !== waiter);
        resolve(null);
      }, timeoutMs);
      const waiter: Waiter = {
        test,
        resolve: (at) => {
          clearTimeout(timer);
          resolve(at);
        },
      };
      this.waiters.push(waiter);
    });
  }

  private checkWaiters(view: ViewLike) {
    if (this.waiters.length === 0) return;
    const at = performance.now();
    const still: Waiter[] = [];
    for (const w of this.waiters) {
      if (w.test(view)) w.resolve(at);
      else still.push(w);
    }
    this.waiters = still;
  }

  close() {
    this.socket.io.reconnection(false);
    this.socket.disconnect();
  }
}

/** Runs fn over items with at most `limit` in flight. */
export async function inBatches<T, R>(
  items: readonly T[],
  limit: number,
  fn: (item: T, index: number) => Promise<R>,
): Promise<R[]> {
  const out = new Array<R>(items.length);
  let next = 0;
  const worker = async () => {
    while (next < items.length) {
      const i = next++;
      out[i] = await fn(items[i]!, i);
    }
  };
  await Promise.all(Array.from({ length: Math.min(limit, items.length) }, worker));
  return out;
}

export const sleep = (ms: number) => new Promise<void>((r) => setTimeout(r, ms));
