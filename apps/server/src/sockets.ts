/**
 * socket.io transport. Handlers stay thin: rate-limit -> validate (protocol) -> authorise ->
 * hub.execute (engine + database) -> ack (socket/handlers.ts). Views are pushed by the hub's
 * commit listener (socket/rooms.ts), each socket getting the view of its own role (as a patch
 * from the one it holds), so a sealed effort reaches only its owner.
 */
import type { Database } from "@contend/db";
import { ackError } from "@contend/protocol";
import type { Clock } from "./clock";
import type { Limits } from "./env";
import type { SessionHub } from "./live/hub";
import type { LoadGauge } from "./loadGauge";
import type { Logger } from "./logger";
import { clientAddress } from "./abuse";
import type { AbuseBudgets } from "./abuse";
import { createTokenBucket } from "./rateLimit";
import { createHandlers, NEW_LINK_MESSAGE, oldSeatLinks } from "./socket/handlers";
import { isPresenceSignal } from "./socket/presence";
import { createRooms } from "./socket/rooms";
import type { AnyAck, AppServer, AppSocket } from "./socket/types";

export type { AppServer } from "./socket/types";

/** Past this many refused messages in a row the connection is closed. */
const MAX_STRIKES = 200;

export interface SocketDeps {
  io: AppServer;
  db: Database;
  hub: SessionHub;
  clock: Clock;
  logger: Logger;
  limits: Limits;
  /** base of the links issueLinks returns; null: the Host the socket connected to */
  publicUrl: string | null;
  /** how busy the process is; stretches the progress window under load */
  load: LoadGauge;
  /** per-address limits shared by every connection (abuse.ts) */
  budgets: AbuseBudgets;
}

const SESSION_DELETED = {
  reason: "session-deleted",
  message: "This session has been deleted by its facilitator.",
} as const;

/** What one process tells the others about their sockets (hub.publish; presence: socket/presence.ts). */
type Signal =
  | { kind: "seat-relinked"; sessionId: string; seatIndex: number; keyDigest: string }
  | { kind: "session-deleted"; sessionId: string };

export function attachSockets(deps: SocketDeps) {
  const { io, hub, clock, logger, limits, budgets } = deps;
  const rooms = createRooms(deps);
  const handlers = createHandlers({ ...deps, rooms });

  hub.onSignal((raw) => {
    if (isPresenceSignal(raw)) return rooms.heardPresence(raw);
    const signal = raw as Signal;
    if (signal.kind === "seat-relinked") {
      rooms.revoke(
        oldSeatLinks(signal.sessionId, signal.seatIndex, signal.keyDigest),
        NEW_LINK_MESSAGE,
      );
    } else if (signal.kind === "session-deleted") {
      hub.forget(signal.sessionId);
      rooms.revoke((id) => id.sessionId === signal.sessionId, SESSION_DELETED);
    }
  });

  /** Per-address connection limits: how many at once, and how many new ones a minute. */
  const openByAddress = new Map<string, number>();
  io.use((raw, next) => {
    const socket = raw as AppSocket;
    const address = clientAddress(socket.request, limits.trustProxy);
    const open = openByAddress.get(address) ?? 0;
    if (open >= limits.connectionsPerIp) {
      return next(
        new Error(`rate-limited: at most ${limits.connectionsPerIp} connections per address`),
      );
    }
    void budgets.connects.take(address).then((ok) => {
      if (!ok) {
        return next(
          new Error(
            `rate-limited: at most ${limits.connectsPerIpPerMinute} new connections a minute`,
          ),
        );
      }
      socket.data.address = address;
      openByAddress.set(address, (openByAddress.get(address) ?? 0) + 1);
      socket.on("disconnect", () => {
        const n = (openByAddress.get(address) ?? 1) - 1;
        if (n <= 0) openByAddress.delete(address);
        else openByAddress.set(address, n);
      });
      next();
    }, next);
  });

  /** handlers still running, so a drain can wait for their acks before closing transports */
  const inFlight = new Set<Promise<void>>();

  io.on("connection", (raw) => {
    const socket = raw as AppSocket;
    socket.data.bucket = createTokenBucket(limits.ratePerSecond, limits.rateBurst, clock.now());
    socket.data.identity = null;
    socket.data.strikes = 0;
    socket.data.shown = null;
    socket.on("disconnect", () => rooms.leave(socket));
    socket.onAny((event: unknown, ...args: unknown[]) => {
      const last = args[args.length - 1];
      const ack = once(typeof last === "function" ? (last as AnyAck) : null);
      if (!socket.data.bucket.take(clock.now())) {
        if (++socket.data.strikes > MAX_STRIKES) socket.disconnect(true);
        ack(
          ackError(
            "rate-limited",
            `slow down: at most ${limits.ratePerSecond} messages per second`,
          ),
        );
        return;
      }
      socket.data.strikes = 0;
      const payload = typeof last === "function" ? args.slice(0, -1) : args;
      let work: Promise<void>;
      const within = budgets.messages.take(socket.data.address);
      const refused = ackError(
        "rate-limited",
        `slow down: at most ${limits.messagesPerIpPerSecond} messages per second from one address`,
      );
      if (event === "hello") {
        work = within.then((ok) => (ok ? handlers.hello(socket, payload[0], ack) : ack(refused)));
      } else if (event === "command") {
        work = within.then(async (ok) =>
          ack(ok ? await handlers.command(socket, payload[0]) : refused),
        );
      } else {
        ack(
          ackError(
            "bad-request",
            `unknown event ${JSON.stringify(String(event).slice(0, 40))}; send hello or command`,
          ),
        );
        return;
      }
      const handled = work.catch((error: unknown) => {
        logger.error("socket handler failed", { event: String(event), error });
        ack(ackError("internal", "internal error"));
      });
      inFlight.add(handled);
      void handled.finally(() => inFlight.delete(handled));
    });
  });

  return {
    /** drops the progress pushes still waiting (the server is closing) */
    stop: () => rooms.stop(),
    /** tells every socket of a deleted session (on every process) so, and closes them */
    sessionDeleted(sessionId: string) {
      rooms.revoke((id) => id.sessionId === sessionId, SESSION_DELETED);
      void hub.publish({ kind: "session-deleted", sessionId } satisfies Signal);
    },
    /** resolves once every message handler has sent its ack (new ones included) */
    async settled() {
      while (inFlight.size > 0) await Promise.all([...inFlight]);
    },
    /** sockets currently registered with a session (for tests and health) */
    connectedTo: (sessionId: string): number => rooms.connectedTo(sessionId),
  };
}

/** Calls the ack at most once; a missing ack (the client did not ask for one) is a no-op. */
function once(ack: AnyAck | null): AnyAck {
  let done = false;
  return (res) => {
    if (done || !ack) return;
    done = true;
    try {
      ack(res);
    } catch {
      // a broken client callback must not take the server down
    }
  };
}
