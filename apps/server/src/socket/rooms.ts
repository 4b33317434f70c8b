/**
 * The sockets of each session in this process, and what reaches them: pushed views (each
 * socket its own role's view, as a patch from the one it holds, so a sealed move reaches only
 * its owner), presence for the facilitator (socket/presence.ts), and revocation. Commits made by another process
 * arrive here the same way as this process's own (the hub's commit listener).
 */
import { diffJson } from "@contend/protocol";
import type { RevokedMessage, RoleView, ViewMessage, ViewPatchMessage } from "@contend/protocol";
import { viewFor } from "@contend/session";
import type { Clock, TimerHandle } from "../clock";
import type { Limits } from "../env";
import type { LiveSession, SessionHub } from "../live/hub";
import { progressWindowMs } from "../loadGauge";
import type { LoadGauge } from "../loadGauge";
import { patchPayload, viewPayload } from "./encode";
import type { TextCache } from "./encode";
import { createPresence } from "./presence";
import type { PresenceSignal } from "./presence";
import { viewerOf } from "./types";
import type { AppSocket, Identity } from "./types";

/** A patch with more operations than this goes as a full view (e.g. a round closing with many seats). */
const MAX_PATCH_OPS = 200;

export interface RoomsDeps {
  hub: SessionHub;
  clock: Clock;
  limits: Limits;
  load: LoadGauge;
}

export type Rooms = ReturnType<typeof createRooms>;

export function createRooms(deps: RoomsDeps) {
  const { hub, clock, limits, load } = deps;
  /** sockets that said hello, by session */
  const rooms = new Map<string, Set<AppSocket>>();
  const presence = createPresence({
    clock,
    publish: (signal) => void hub.publish(signal),
    changed(sessionId) {
      for (const s of rooms.get(sessionId) ?? []) {
        if (s.data.identity?.role === "facilitator") sendPresence(s, sessionId);
      }
    },
  });

  function join(socket: AppSocket, identity: Identity) {
    leave(socket);
    socket.data.identity = identity;
    let room = rooms.get(identity.sessionId);
    if (!room) rooms.set(identity.sessionId, (room = new Set()));
    room.add(socket);
    if (identity.role === "seat" && identity.seatIndex !== undefined) {
      presence.count(identity.sessionId, identity.seatIndex, +1);
    }
  }

  function leave(socket: AppSocket) {
    const identity = socket.data.identity;
    if (!identity) return;
    const room = rooms.get(identity.sessionId);
    room?.delete(socket);
    if (room && room.size === 0) rooms.delete(identity.sessionId);
    socket.data.identity = null;
    socket.data.shown = null;
    if (identity.role === "seat" && identity.seatIndex !== undefined) {
      presence.count(identity.sessionId, identity.seatIndex, -1);
    }
  }

  /** The seats with a connected page in any process (socket/presence.ts). */
  function sendPresence(socket: AppSocket, sessionId: string) {
    socket.emit("presence", { seats: presence.seats(sessionId) });
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
    const patches = new Map<RoleView, { next: RoleView; payload: ViewPatchMessage | null }>();
    const fulls = new Map<RoleView, ViewMessage>();
    const texts: TextCache = new Map();
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
        const payload =
          ops.length > MAX_PATCH_OPS ? null : patchPayload(seq, shown.seq, ops, texts);
        patch = { next: view, payload };
        patches.set(shown.view, patch);
      }
      if (shown && patch?.payload) socket.emit("viewPatch", patch.payload);
      else {
        let full = fulls.get(view);
        if (!full) fulls.set(view, (full = viewPayload(seq, view, texts)));
        socket.emit("view", full);
      }
      socket.data.shown = { seq, view };
    }
  }

  /** sessions whose progress push to the other sockets is waiting, with its timer */
  const pendingProgress = new Map<string, TimerHandle>();

  /**
   * After every commit (this process's or, on PostgreSQL, another's). A commit that only
   * seals moves changes, for everyone but the sealers, one `sealed` flag: the sealers' own
   * sockets get it at once, everyone else within `limits.progressPushMs` as one frame for all
   * the seals of that window (short enough to read as live on a progress display, long enough
   * to merge the seals of a busy round), and up to `limits.progressPushBusyMs` while the event
   * loop is near full. Any other commit (a round opening or resolving, a pause, a shock) goes
   * to every socket at once and takes the waiting progress with it.
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

  return {
    join,
    leave,
    sendPresence,
    /** a facilitator joined here: asks the other processes for their seats' presence */
    askPresence: (sessionId: string) => presence.ask(sessionId),
    /** a presence message from another process */
    heardPresence: (signal: PresenceSignal) => presence.heard(signal),
    revoke,
    /** drops the progress pushes still waiting (the server is closing) */
    stop() {
      presence.stop();
      for (const timer of pendingProgress.values()) clock.clearTimer(timer);
      pendingProgress.clear();
    },
    connectedTo: (sessionId: string) => rooms.get(sessionId)?.size ?? 0,
  };
}
