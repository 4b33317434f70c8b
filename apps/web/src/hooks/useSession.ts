"use client";

import { useCallback, useEffect, useRef, useState } from "react";
import { io } from "socket.io-client";
import type { Socket } from "socket.io-client";
import { createViewTracker, PROTOCOL_VERSION, SESSION_ROUTE_PARAM } from "@contend/protocol";
import type {
  Ack,
  ClientToServerEvents,
  Command,
  CommandAckData,
  Credentials,
  Hello,
  HelloAckData,
  RoleView,
  ServerToClientEvents,
} from "@contend/protocol";
import { SERVER_URL } from "../lib/env";
import { clockOffsetMs } from "../lib/live";

export type ConnectionStatus = "connecting" | "live" | "reconnecting" | "resynced" | "failed";

export interface Connection {
  status: ConnectionStatus;
  message: string | null;
}

type ClientSocket = Socket<ServerToClientEvents, ClientToServerEvents>;

const ACK_TIMEOUT_MS = 10_000;
/** How long the "resynced" banner stays before it settles to "live". */
const RESYNC_NOTICE_MS = 3_000;

export interface SessionHandle {
  connection: Connection;
  view: RoleView | null;
  seq: number;
  hello: HelloAckData | null;
  /** the server's clock minus ours, measured at the last hello (0 until then) */
  clockOffsetMs: number;
  /** facilitator only: seats with a connected page (null until the server says) */
  presence: readonly number[] | null;
  /** sends a command and resolves with the server's ack (or a local timeout error) */
  send: (cmd: Command) => Promise<Ack<CommandAckData>>;
}

/**
 * One live session connection. On every (re)connect it says hello with its credentials and the
 * last event seq it saw; the ack carries a full view, and later commits arrive as patches of the
 * view held (or, rarely, full views). A patch for another base makes it say hello again, and a
 * view older than the one held is ignored, so a late push never rolls the screen back.
 */
export function useSession(credentials: Credentials | null): SessionHandle {
  const [connection, setConnection] = useState<Connection>({ status: "connecting", message: null });
  const [view, setView] = useState<RoleView | null>(null);
  const [seq, setSeq] = useState(0);
  const [hello, setHello] = useState<HelloAckData | null>(null);
  const [offset, setOffset] = useState(0);
  const [presence, setPresence] = useState<readonly number[] | null>(null);
  const socketRef = useRef<ClientSocket | null>(null);
  const seqRef = useRef(0);
  const credKey = credentials === null ? "" : JSON.stringify(credentials);

  useEffect(() => {
    if (credKey === "") return;
    const creds = JSON.parse(credKey) as Credentials;
    let connectedBefore = false;
    let fatal = false;
    let settle: ReturnType<typeof setTimeout> | null = null;
    const socket: ClientSocket = io(SERVER_URL || undefined, {
      transports: ["websocket", "polling"],
      // Which session this socket is for, so several server processes keep its sockets together.
      ...("sessionId" in creds ? { query: { [SESSION_ROUTE_PARAM]: creds.sessionId } } : {}),
      reconnectionDelay: 500,
      reconnectionDelayMax: 5_000,
    });
    socketRef.current = socket;

    const tracker = createViewTracker();
    const show = () => {
      seqRef.current = tracker.seq;
      setSeq(tracker.seq);
      setView(tracker.view);
    };

    let helloInFlight = false;
    const sayHello = () => {
      helloInFlight = true;
      const msg: Hello = {
        protocol: PROTOCOL_VERSION,
        credentials: creds,
        ...(seqRef.current > 0 ? { lastSeq: seqRef.current } : {}),
      };
      // The ack is handled in its callback, not after an await: a patch queued right behind it
      // is then applied to the ack's view instead of being dropped.
      const sentAt = Date.now();
      socket
        .timeout(ACK_TIMEOUT_MS)
        .emit("hello", msg, (err: Error | null, ack: Ack<HelloAckData>) => {
          helloInFlight = false;
          if (err) {
            setConnection({
              status: "reconnecting",
              message: "the server did not answer the hello; retrying",
            });
            socket.disconnect().connect();
            return;
          }
          if (!ack.ok) {
            const permanent = [
              "unauthorized",
              "not-found",
              "version-mismatch",
              "bad-request",
              "forbidden",
            ];
            if (permanent.includes(ack.code)) {
              fatal = true;
              socket.disconnect();
            }
            setConnection({ status: "failed", message: ack.message });
            return;
          }
          // The hello view is a full snapshot of the committed state: it always replaces ours.
          tracker.snapshot(ack.data.seq, ack.data.view, true);
          show();
          setHello(ack.data);
          setOffset(clockOffsetMs(sentAt, Date.now(), ack.data.serverNow));
          if (connectedBefore) {
            setConnection({ status: "resynced", message: null });
            if (settle) clearTimeout(settle);
            settle = setTimeout(
              () => setConnection({ status: "live", message: null }),
              RESYNC_NOTICE_MS,
            );
          } else {
            setConnection({ status: "live", message: null });
          }
          connectedBefore = true;
        });
    };

    socket.on("connect", sayHello);
    socket.on("view", (msg) => {
      if (tracker.snapshot(msg.seq, msg.view)) show();
    });
    socket.on("viewPatch", (msg) => {
      // Patches queued before the hello's answer are for the old base; the ack replaces them.
      if (helloInFlight) return;
      const outcome = tracker.patch(msg);
      if (outcome === "applied") show();
      else if (outcome === "resync") sayHello();
    });
    socket.on("presence", (msg) => setPresence(msg.seats));
    // The key no longer opens the session (a new link, or the session was deleted): say why
    // and stop; reconnecting with the same key could only be refused.
    socket.on("revoked", (msg) => {
      fatal = true;
      setConnection({ status: "failed", message: msg.message });
      socket.disconnect();
    });
    socket.on("disconnect", (reason) => {
      setPresence(null);
      if (fatal) return;
      setConnection({ status: "reconnecting", message: `connection lost (${reason})` });
      // A server-side disconnect is not retried by socket.io itself.
      if (reason === "io server disconnect") socket.connect();
    });
    socket.on("connect_error", (err) => {
      if (fatal) return;
      setConnection({
        status: connectedBefore ? "reconnecting" : "connecting",
        message: `cannot reach the server (${err.message})`,
      });
    });

    return () => {
      if (settle) clearTimeout(settle);
      socket.removeAllListeners();
      socket.disconnect();
      socketRef.current = null;
    };
  }, [credKey]);

  const send = useCallback(async (cmd: Command): Promise<Ack<CommandAckData>> => {
    const socket = socketRef.current;
    if (!socket || !socket.connected) {
      return {
        ok: false,
        code: "internal",
        message: "not connected: wait for the connection to return and try again",
      };
    }
    try {
      return await socket.timeout(ACK_TIMEOUT_MS).emitWithAck("command", cmd);
    } catch {
      return {
        ok: false,
        code: "internal",
        message: "no answer from the server in time; check the connection and try again",
      };
    }
  }, []);

  return { connection, view, seq, hello, clockOffsetMs: offset, presence, send };
}

/** Current time, refreshed every `ms` (for countdowns). */
export function useNow(ms = 250): number {
  const [now, setNow] = useState(() => Date.now());
  useEffect(() => {
    const t = setInterval(() => setNow(Date.now()), ms);
    return () => clearInterval(t);
  }, [ms]);
  return now;
}
