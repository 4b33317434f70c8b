/**
 * A hand-rolled socket.io v4 client over a plain WebSocket (engine.io protocol 4), for what a
 * well-behaved client library will not do: send malformed or non-JSON packets, stop reading
 * the socket, or never answer pings. Packet text: "0" open, "2"/"3" ping/pong, "40" namespace
 * connect, "42<id>[event, ...args]" event with ack id, "43<id>[...]" ack.
 */
import WebSocket from "ws";

export interface RawAck {
  id: number;
  payload: unknown;
}

export class RawClient {
  readonly ws: WebSocket;
  closed = false;
  closeCode: number | null = null;
  private nextId = 1;
  private pending = new Map<number, (payload: unknown) => void>();
  private ready: Promise<boolean>;
  answerPings = true;

  constructor(baseUrl: string) {
    const url = `${baseUrl.replace(/^http/, "ws")}/socket.io/?EIO=4&transport=websocket`;
    this.ws = new WebSocket(url, { maxPayload: 10 * 1024 * 1024 });
    this.ready = new Promise((resolve) => {
      const timer = setTimeout(() => resolve(false), 10_000);
      this.ws.on("message", (data) => {
        const text = data.toString();
        if (text.startsWith("0")) this.ws.send("40");
        else if (text.startsWith("40")) {
          clearTimeout(timer);
          resolve(true);
        } else if (text === "2") {
          if (this.answerPings) this.ws.send("3");
        } else if (text.startsWith("43")) {
          const m = /^43(\d+)(.*)$/s.exec(text);
          if (m) {
            const id = Number(m[1]);
            const done = this.pending.get(id);
            this.pending.delete(id);
            let payload: unknown = null;
            try {
              payload = (JSON.parse(m[2]!) as unknown[])[0];
            } catch {
              payload = { unparsable: m[2] };
            }
            done?.(payload);
          }
        }
      });
      this.ws.on("error", () => {
        clearTimeout(timer);
        resolve(false);
      });
    });
    this.ws.on("close", (code) => {
      this.closed = true;
      this.closeCode = code;
      for (const done of this.pending.values()) done(undefined);
      this.pending.clear();
    });
  }

  /** true once the namespace connect was accepted */
  open(): Promise<boolean> {
    return this.ready;
  }

  /** Sends raw packet text; resolves with the ack payload for ackId, undefined when none came. */
  sendRaw(text: string, ackId: number | null, timeoutMs = 5000): Promise<unknown> {
    if (this.closed || this.ws.readyState !== WebSocket.OPEN) return Promise.resolve(undefined);
    this.ws.send(text);
    if (ackId === null) return Promise.resolve(undefined);
    return new Promise((resolve) => {
      const timer = setTimeout(() => {
        this.pending.delete(ackId);
        resolve(undefined);
      }, timeoutMs);
      this.pending.set(ackId, (payload) => {
        clearTimeout(timer);
        resolve(payload);
      });
    });
  }

  /** An event with an ack; `json` is the already serialised argument text (may be invalid JSON). */
  emitText(event: string, json: string, timeoutMs?: number): Promise<unknown> {
    const id = this.nextId++;
    return this.sendRaw(`42${id}[${JSON.stringify(event)},${json}]`, id, timeoutMs);
  }

  emit(event: string, arg: unknown, timeoutMs?: number): Promise<unknown> {
    return this.emitText(event, JSON.stringify(arg), timeoutMs);
  }

  /** Stops reading: the kernel buffers fill and the server must cope with a stuck peer. */
  stopReading() {
    this.answerPings = false;
    const raw = (this.ws as unknown as { _socket?: { pause(): void } })._socket;
    raw?.pause();
  }

  close() {
    this.closed = true;
    this.ws.terminate();
  }
}
