/**
 * socket.io transport. Handlers stay thin: rate-limit -> validate (protocol) -> authorise ->
 * hub.execute (engine + database) -> ack. Views are pushed by the hub's commit listener, each
 * socket getting the view of its own role (as a patch from the one it holds), so a sealed
 * effort reaches only its owner.
 */
import type { Server, Socket } from "socket.io";
import type { Database } from "@contend/db";
import { newKey, normaliseJoinCode } from "@contend/db";
import {
  ackError,
  COMMAND_ROLES,
  diffJson,
  parseCommand,
  parseHello,
  PROTOCOL_VERSION,
  roleMaySend,
} from "@contend/protocol";
import type {
  Ack,
  AckError,
  ClientToServerEvents,
  Command,
  CommandAckData,
  Credentials,
  HelloAckData,
  IssueLinksAckData,
  PatchOp,
  Role,
  RevokedMessage,
  RoleView,
  ServerToClientEvents,
} from "@contend/protocol";
import { viewFor } from "@contend/session";
import type { Viewer } from "@contend/session";
import type { Clock, TimerHandle } from "./clock";
import type { Limits } from "./env";
import type { ExecuteResult, LiveSession, SessionHub } from "./live/hub";
import { baseUrlOf, sessionLinks } from "./live/links";
import { progressWindowMs } from "./loadGauge";
import type { LoadGauge } from "./loadGauge";
import type { Logger } from "./logger";
import { clientAddress } from "./abuse";
import type { AbuseBudgets } from "./abuse";
import { createTokenBucket } from "./rateLimit";
import type { TokenBucket } from "./rateLimit";

interface Identity {
  role: Role;
  sessionId: string;
  seatIndex?: number;
  /** facilitator only: shown in its view (the facilitator is trusted with it) */
  joinCode?: string;
  /** seat only: the key this connection said hello with (a claim of its own seat returns it) */
  key?: string;
}

interface SocketData {
  bucket: TokenBucket;
  /** the client address the per-address limits count against */
  address: string;
  identity: Identity | null;
  /** consecutive rate-limited messages; a client that keeps flooding is disconnected */
  strikes: number;
  /** the view this connection holds (hello ack or last push): the base of the next patch */
  shown: { seq: number; view: RoleView } | null;
}

type AppSocket = Socket<
  ClientToServerEvents,
  ServerToClientEvents,
  Record<string, never>,
  SocketData
>;
export type AppServer = Server<
  ClientToServerEvents,
  ServerToClientEvents,
  Record<string, never>,
  SocketData
>;

type AnyAck = (res: Ack<unknown>) => void;

/** A patch with more operations than this goes as a full view (e.g. a round closing with many seats). */
const MAX_PATCH_OPS = 200;

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

export function attachSockets(deps: SocketDeps) {
  const { io, db, hub, clock, logger, limits, publicUrl, load, budgets } = deps;
  /** sockets that said hello, by session */
  const rooms = new Map<string, Set<AppSocket>>();
  /** per session: seat index -> how many seat sockets of that seat are connected */
  const present = new Map<string, Map<number, number>>();

  function join(socket: AppSocket, identity: Identity) {
    leave(socket);
    socket.data.identity = identity;
    let room = rooms.get(identity.sessionId);
    if (!room) rooms.set(identity.sessionId, (room = new Set()));
    room.add(socket);
    if (identity.role === "seat") countPresence(identity.sessionId, identity.seatIndex, +1);
  }

  function leave(socket: AppSocket) {
    const identity = socket.data.identity;
    if (!identity) return;
    const room = rooms.get(identity.sessionId);
    room?.delete(socket);
    if (room && room.size === 0) rooms.delete(identity.sessionId);
    socket.data.identity = null;
    socket.data.shown = null;
    if (identity.role === "seat") countPresence(identity.sessionId, identity.seatIndex, -1);
  }

  /**
   * Presence (facilitator only, not part of the event log): which seats have a connected seat
   * page. The facilitator's sockets get the list when a seat goes from no page to one or back.
   */
  function countPresence(sessionId: string, seatIndex: number | undefined, delta: 1 | -1) {
    if (seatIndex === undefined) return;
    let counts = present.get(sessionId);
    if (!counts) present.set(sessionId, (counts = new Map()));
    const before = counts.get(seatIndex) ?? 0;
    const after = Math.max(0, before + delta);
    if (after === 0) counts.delete(seatIndex);
    else counts.set(seatIndex, after);
    if (counts.size === 0) present.delete(sessionId);
    if ((before === 0) === (after === 0)) return;
    for (const s of rooms.get(sessionId) ?? []) {
      if (s.data.identity?.role === "facilitator") sendPresence(s, sessionId);
    }
  }

  function sendPresence(socket: AppSocket, sessionId: string) {
    const seats = [...(present.get(sessionId)?.keys() ?? [])].sort((a, b) => a - b);
    socket.emit("presence", { seats });
  }

  function viewerOf(identity: Identity): Viewer {
    if (identity.role === "seat") return { role: "seat", seatIndex: identity.seatIndex as number };
    if (identity.role === "facilitator" && identity.joinCode !== undefined) {
      return { role: "facilitator", joinCode: identity.joinCode };
    }
    return { role: identity.role };
  }

  /**
   * Brings the given sockets of a session up to its current state: each gets the patch from
   * the view it holds to its role's new view. Sockets of one role that hold the same view
   * object share one view build and one diff; a patch that would rewrite most of the view goes
   * as a full view; a socket already at this seq gets nothing.
   */
  function push(live: LiveSession, sockets: Iterable<AppSocket>) {
    if (live.state.status === "empty") return;
    const seq = live.state.seq;
    const views = new Map<string, RoleView>();
    const patches = new Map<RoleView, { next: RoleView; ops: PatchOp[] | null }>();
    for (const socket of sockets) {
      const identity = socket.data.identity;
      if (!identity || identity.sessionId !== live.id) continue;
      const shown = socket.data.shown;
      if (shown && shown.seq >= seq) continue;
      const viewer = viewerOf(identity);
      const key = `${viewer.role}:${viewer.seatIndex ?? ""}`;
      let view = views.get(key);
      if (!view) views.set(key, (view = viewFor(live.state, viewer)));
      let patch = shown ? patches.get(shown.view) : undefined;
      if (shown && (!patch || patch.next !== view)) {
        const ops = diffJson(shown.view, view);
        patch = { next: view, ops: ops.length > MAX_PATCH_OPS ? null : ops };
        patches.set(shown.view, patch);
      }
      if (shown && patch?.ops) socket.emit("viewPatch", { seq, base: shown.seq, ops: patch.ops });
      else socket.emit("view", { seq, view });
      socket.data.shown = { seq, view };
    }
  }

  /** sessions whose progress push to the other sockets is waiting, with its timer */
  const pendingProgress = new Map<string, TimerHandle>();

  /**
   * After every commit. A commit that only seals moves changes, for everyone but the sealers,
   * one `sealed` flag: the sealers' own sockets get it at once, everyone else within
   * `limits.progressPushMs` as one frame for all the seals of that window (short enough to
   * read as live on a progress display, long enough to merge the seals of a busy round), and
   * up to `limits.progressPushBusyMs` while the event loop is near full. Any other commit (a
   * round opening or resolving, a pause, a shock) goes to every socket at once and takes the
   * waiting progress with it.
   */
  hub.onCommit((live, events) => {
    const room = rooms.get(live.id);
    if (!room) return;
    if (limits.progressPushMs === 0 || !events.every((e) => e.type === "move-sealed")) {
      const waiting = pendingProgress.get(live.id);
      if (waiting) clock.clearTimer(waiting);
      pendingProgress.delete(live.id);
      push(live, room);
      return;
    }
    const sealers = new Set(events.map((e) => e.seatIndex));
    push(
      live,
      [...room].filter(
        (s) => s.data.identity?.role === "seat" && sealers.has(s.data.identity.seatIndex ?? -1),
      ),
    );
    if (pendingProgress.has(live.id)) return;
    const timer = clock.setTimer(
      () => {
        pendingProgress.delete(live.id);
        const current = rooms.get(live.id);
        if (current) push(live, current);
      },
      progressWindowMs(limits.progressPushMs, limits.progressPushBusyMs, load.busy()),
      { unref: true },
    );
    pendingProgress.set(live.id, timer);
  });

  /**
   * Who the credentials make this connection. Failed join codes and keys count against the
   * address (`authFailuresPerIpPerMinute`); past that budget every attempt is refused unread,
   * so codes cannot be guessed at speed.
   */
  async function authenticate(
    credentials: Credentials,
    address: string,
  ): Promise<{ ok: true; identity: Identity } | AckError> {
    if (!(await budgets.authFailures.left(address))) {
      return ackError(
        "rate-limited",
        `too many wrong join codes or keys from this address; wait a minute (at most ${limits.authFailuresPerIpPerMinute} a minute)`,
      );
    }
    if (credentials.role === "guest") {
      const session = await db.sessions.byJoinCode(normaliseJoinCode(credentials.joinCode));
      if (!session) {
        await budgets.authFailures.take(address);
        return ackError("not-found", "no session has this join code");
      }
      return { ok: true, identity: { role: "guest", sessionId: session.id } };
    }
    const grant = await db.keys.resolve(credentials.sessionId, credentials.key);
    if (!grant || grant.role !== credentials.role) {
      await budgets.authFailures.take(address);
      return ackError(
        "unauthorized",
        `this key does not open session ${credentials.sessionId} as ${credentials.role}`,
      );
    }
    if (grant.role === "seat") {
      if (grant.seatIndex === null) throw new Error("seat key without a seat index");
      return {
        ok: true,
        identity: {
          role: "seat",
          sessionId: credentials.sessionId,
          seatIndex: grant.seatIndex,
          key: credentials.key,
        },
      };
    }
    if (grant.role === "facilitator") {
      const session = await db.sessions.get(credentials.sessionId);
      if (!session) return ackError("not-found", "no such session");
      return {
        ok: true,
        identity: {
          role: "facilitator",
          sessionId: credentials.sessionId,
          joinCode: session.joinCode,
        },
      };
    }
    return { ok: true, identity: { role: grant.role, sessionId: credentials.sessionId } };
  }

  /** A seat's first hello with its own key claims the seat when nobody has yet. */
  async function claimOnHello(
    live: LiveSession,
    identity: Identity,
    displayName: string | undefined,
  ) {
    if (live.state.status === "empty" || identity.seatIndex === undefined) return;
    const seat = live.state.seats[identity.seatIndex];
    if (!seat || seat.claimed || seat.policy || !seat.active || live.state.status === "ended")
      return;
    const result = await hub.execute(
      live.id,
      { type: "claimSeat", seatIndex: seat.index, displayName: displayName ?? seat.name },
      { role: "seat", seatIndex: seat.index },
    );
    // conflict: someone claimed it a moment earlier; the hello still goes through.
    if (!result.ok && result.code !== "conflict" && result.code !== "wrong-state") {
      logger.warn("claim on hello failed", { sessionId: live.id, code: result.code });
    }
  }

  async function hello(socket: AppSocket, raw: unknown, ack: AnyAck): Promise<void> {
    const parsed = parseHello(raw);
    if (!parsed.ok) return ack(ackError(parsed.code, parsed.message, parsed.path));
    const auth = await authenticate(parsed.value.credentials, socket.data.address);
    if (!auth.ok) return ack(auth);
    const { identity } = auth;
    const live = await hub.get(identity.sessionId);
    if (!live || live.state.status === "empty")
      return ack(ackError("not-found", "no such session"));
    if (identity.role === "seat") {
      const creds = parsed.value.credentials;
      await claimOnHello(live, identity, creds.role === "seat" ? creds.displayName : undefined);
    }
    if (socket.disconnected) return;
    // Registering, reading the state and acknowledging happen in one synchronous step, so
    // every later commit reaches this socket as a pushed view after this ack's view.
    join(socket, identity);
    const state = live.state;
    const data: HelloAckData = {
      protocol: PROTOCOL_VERSION,
      role: identity.role,
      sessionId: identity.role === "guest" ? null : identity.sessionId,
      seq: state.seq,
      view: viewFor(state, viewerOf(identity)),
      serverNow: clock.now(),
    };
    if (identity.seatIndex !== undefined) data.seatIndex = identity.seatIndex;
    socket.data.shown = { seq: state.seq, view: data.view };
    ack({ ok: true, data });
    if (identity.role === "facilitator") sendPresence(socket, identity.sessionId);
  }

  async function command(socket: AppSocket, raw: unknown): Promise<Ack<CommandAckData>> {
    const identity = socket.data.identity;
    if (!identity) return ackError("unauthorized", "say hello first");
    const parsed = parseCommand(raw);
    if (!parsed.ok) return ackError(parsed.code, parsed.message, parsed.path);
    const cmd: Command = parsed.value;
    if (!roleMaySend(identity.role, cmd.type)) {
      const roles = COMMAND_ROLES[cmd.type].join(" or the ");
      return ackError("forbidden", `${cmd.type} is for the ${roles}, not the ${identity.role}`);
    }
    const actor =
      identity.role === "seat"
        ? { role: identity.role, seatIndex: identity.seatIndex as number }
        : { role: identity.role };
    if (cmd.type === "claimSeat" && identity.role === "seat") {
      // R3/R6: a seat claiming its own seat (say, to set its display name) keeps its key.
      const result = await hub.execute(identity.sessionId, cmd, actor);
      if (!result.ok) return failure(result);
      const seatKey = identity.key ?? "";
      return {
        ok: true,
        data: { seq: result.seq, sessionId: identity.sessionId, seatIndex: cmd.seatIndex, seatKey },
      };
    }
    if (cmd.type === "claimSeat") {
      const seatKey = newKey();
      const result = await hub.execute(identity.sessionId, cmd, actor, {
        addKeys: [{ role: "seat", seatIndex: cmd.seatIndex, plaintext: seatKey }],
      });
      if (!result.ok) return failure(result);
      return {
        ok: true,
        data: { seq: result.seq, sessionId: identity.sessionId, seatIndex: cmd.seatIndex, seatKey },
      };
    }
    const result = await hub.execute(identity.sessionId, cmd, actor);
    if (!result.ok) return failure(result);
    if (result.data.kind === "issueLinks") {
      return {
        ok: true,
        data: await issueLink(socket, identity, result.data.seatIndex, result.seq),
      };
    }
    if (result.data.kind === "sealMove") {
      const d = result.data;
      // Only a repeated seal (already in the log) needs the live session to find its seq; a
      // fresh one carries it, and looking the session up anyway would reload the whole log of
      // a session that this very seal ended (the hub drops ended sessions from memory).
      const sealed = result.events.find((e) => e.type === "move-sealed");
      const seq =
        sealed?.seq ??
        (await hub.get(identity.sessionId))?.moveSeqs.get(`${d.seatIndex}:${d.clientMoveId}`) ??
        result.seq;
      return {
        ok: true,
        data: {
          seq,
          round: d.round,
          seatIndex: d.seatIndex,
          clientMoveId: d.clientMoveId,
          effort: d.effort,
          spend: d.spend,
        },
      };
    }
    return { ok: true, data: { seq: result.seq } };
  }

  /** The engine has checked the seat; the new key is committed before the ack carries it. */
  async function issueLink(
    socket: AppSocket,
    identity: Identity,
    seatIndex: number | null,
    seq: number,
  ): Promise<IssueLinksAckData> {
    const key = newKey();
    const role = seatIndex === null ? "spectator" : "seat";
    if (seatIndex === null) await db.keys.add(identity.sessionId, role, null, key);
    else {
      // A seat is held by one key at a time: the new link revokes the old ones (R25).
      await db.keys.replaceSeat(identity.sessionId, seatIndex, key);
      revoke(
        (id) =>
          id.sessionId === identity.sessionId && id.role === "seat" && id.seatIndex === seatIndex,
        {
          reason: "new-link",
          message:
            "The facilitator has given this seat a new link, so this one no longer opens it. " +
            "If the seat is yours, ask the facilitator for the new link.",
        },
      );
    }
    const links = sessionLinks(
      baseUrlOf(publicUrl, socket.request),
      identity.sessionId,
      identity.joinCode ?? "",
    );
    return {
      seq,
      role,
      seatIndex,
      key,
      link: seatIndex === null ? links.spectator(key) : links.seat(key),
    };
  }

  /** Tells the sockets whose key no longer works why, then closes them. */
  function revoke(which: (identity: Identity) => boolean, msg: RevokedMessage) {
    for (const room of rooms.values()) {
      for (const socket of [...room]) {
        const identity = socket.data.identity;
        if (!identity || !which(identity)) continue;
        leave(socket);
        socket.emit("revoked", msg);
        socket.disconnect(true);
      }
    }
  }

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

  function failure(result: Extract<ExecuteResult, { ok: false }>): AckError {
    return ackError(result.code, result.message, result.path);
  }

  /** handlers still running, so a drain can wait for their acks before closing transports */
  const inFlight = new Set<Promise<void>>();

  io.on("connection", (raw) => {
    const socket = raw as AppSocket;
    socket.data.bucket = createTokenBucket(limits.ratePerSecond, limits.rateBurst, clock.now());
    socket.data.identity = null;
    socket.data.strikes = 0;
    socket.data.shown = null;
    socket.on("disconnect", () => leave(socket));
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
        work = within.then((ok) => (ok ? hello(socket, payload[0], ack) : ack(refused)));
      } else if (event === "command") {
        work = within.then(async (ok) => ack(ok ? await command(socket, payload[0]) : refused));
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
    stop() {
      for (const timer of pendingProgress.values()) clock.clearTimer(timer);
      pendingProgress.clear();
    },
    /** tells every socket of a deleted session so, and closes them */
    sessionDeleted(sessionId: string) {
      revoke((id) => id.sessionId === sessionId, {
        reason: "session-deleted",
        message: "This session has been deleted by its facilitator.",
      });
    },
    /** resolves once every message handler has sent its ack (new ones included) */
    async settled() {
      while (inFlight.size > 0) await Promise.all([...inFlight]);
    },
    /** sockets currently registered with a session (for tests and health) */
    connectedTo(sessionId: string): number {
      return rooms.get(sessionId)?.size ?? 0;
    },
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
