/**
 * What a connection may say: hello (who it is) and command (what it does). Each handler
 * authenticates, hands the command to the hub (engine + database) and builds the ack; views
 * are pushed by rooms.ts after the commit.
 */
import type { Database } from "@contend/db";
import { hashKey, newKey, normaliseJoinCode } from "@contend/db";
import {
  ackError,
  COMMAND_ROLES,
  parseCommand,
  parseHello,
  PROTOCOL_VERSION,
  roleMaySend,
} from "@contend/protocol";
import type {
  Ack,
  AckError,
  Command,
  CommandAckData,
  Credentials,
  HelloAckData,
  IssueLinksAckData,
} from "@contend/protocol";
import { viewFor } from "@contend/session";
import type { Clock } from "../clock";
import type { Limits } from "../env";
import type { ExecuteResult, LiveSession, SessionHub } from "../live/hub";
import { baseUrlOf, sessionLinks } from "../live/links";
import type { Logger } from "../logger";
import type { AbuseBudgets } from "../abuse";
import type { Rooms } from "./rooms";
import { viewerOf } from "./types";
import type { AnyAck, AppSocket, Identity } from "./types";

export interface HandlerDeps {
  db: Database;
  hub: SessionHub;
  rooms: Rooms;
  clock: Clock;
  logger: Logger;
  limits: Limits;
  publicUrl: string | null;
  budgets: AbuseBudgets;
}

/** A seat's sockets opened with any key but the one whose digest is given: its old links. */
export function oldSeatLinks(sessionId: string, seatIndex: number, keyDigest: string) {
  return (id: Identity) =>
    id.sessionId === sessionId &&
    id.role === "seat" &&
    id.seatIndex === seatIndex &&
    (id.key === undefined || hashKey(id.key) !== keyDigest);
}

export const NEW_LINK_MESSAGE = {
  reason: "new-link",
  message:
    "The facilitator has given this seat a new link, so this one no longer opens it. " +
    "If the seat is yours, ask the facilitator for the new link.",
} as const;

export function createHandlers(deps: HandlerDeps) {
  const { db, hub, rooms, clock, logger, limits, publicUrl, budgets } = deps;

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
    rooms.join(socket, identity);
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
    if (identity.role === "facilitator") {
      rooms.sendPresence(socket, identity.sessionId);
      rooms.askPresence(identity.sessionId);
    }
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
    if (cmd.type === "claimSeat") {
      // R3/R6: a seat claiming its own seat (say, to set its display name) keeps its key.
      const own = identity.role === "seat";
      const seatKey = own ? (identity.key ?? "") : newKey();
      const result = await hub.execute(
        identity.sessionId,
        cmd,
        actor,
        own ? {} : { addKeys: [{ role: "seat", seatIndex: cmd.seatIndex, plaintext: seatKey }] },
      );
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
          ...(d.frontSpends ? { frontSpends: d.frontSpends } : {}),
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
      // A seat is held by one key at a time: the new link revokes the old ones (R25), on
      // every process holding one of its sockets.
      await db.keys.replaceSeat(identity.sessionId, seatIndex, key);
      const keyDigest = hashKey(key);
      rooms.revoke(oldSeatLinks(identity.sessionId, seatIndex, keyDigest), NEW_LINK_MESSAGE);
      await hub.publish({
        kind: "seat-relinked",
        sessionId: identity.sessionId,
        seatIndex,
        keyDigest,
      });
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

  function failure(result: Extract<ExecuteResult, { ok: false }>): AckError {
    return ackError(result.code, result.message, result.path);
  }

  return { hello, command };
}
