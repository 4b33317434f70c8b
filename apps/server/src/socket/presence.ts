/**
 * Presence (facilitator only, not part of the event log): which seats have a connected seat
 * page, in this process and in the others sharing PostgreSQL. Each process counts its own seat
 * sockets and tells the others its list for a session (a message on the feed's connection)
 * when a seat goes from no page to one or back, when a facilitator anywhere asks, and again
 * every PRESENCE_REFRESH_MS while it has any. A process that stops telling (killed without
 * closing its sockets) drops out of the others' lists after PRESENCE_EXPIRY_MS.
 * With the embedded database there is one process and no message goes anywhere.
 */
import { randomUUID } from "node:crypto";
import type { Clock, TimerHandle } from "../clock";

/** How often a process repeats its non-empty lists to the others. */
export const PRESENCE_REFRESH_MS = 10_000;
/** A list not repeated for this long is dropped (its process is gone). */
export const PRESENCE_EXPIRY_MS = 3 * PRESENCE_REFRESH_MS;

export type PresenceSignal =
  | { kind: "presence"; from: string; sessionId: string; seats: number[] }
  | { kind: "presence-ask"; from: string; sessionId: string };

export function isPresenceSignal(message: unknown): message is PresenceSignal {
  const kind = (message as { kind?: unknown } | null)?.kind;
  return kind === "presence" || kind === "presence-ask";
}

export interface PresenceDeps {
  clock: Clock;
  /** sends a message to every process (this one included) */
  publish(signal: PresenceSignal): void;
  /** the list of a session changed: tell its facilitator sockets in this process */
  changed(sessionId: string): void;
}

export function createPresence(deps: PresenceDeps) {
  const { clock, publish, changed } = deps;
  const self = randomUUID();
  /** per session: seat index -> how many seat sockets of that seat this process holds */
  const local = new Map<string, Map<number, number>>();
  /** per session: per other process, its last list and when it was heard */
  const remote = new Map<string, Map<string, { seats: number[]; heard: number }>>();

  const own = (sessionId: string) => [...(local.get(sessionId)?.keys() ?? [])];
  const tell = (sessionId: string) =>
    publish({ kind: "presence", from: self, sessionId, seats: own(sessionId) });

  function seats(sessionId: string): number[] {
    const all = new Set(own(sessionId));
    for (const entry of remote.get(sessionId)?.values() ?? []) {
      for (const seat of entry.seats) all.add(seat);
    }
    return [...all].sort((a, b) => a - b);
  }

  /** Runs `change`; tells the facilitators when the session's list is different after it. */
  function watching(sessionId: string, change: () => void) {
    const before = seats(sessionId).join();
    change();
    if (seats(sessionId).join() !== before) changed(sessionId);
  }

  function count(sessionId: string, seatIndex: number, delta: 1 | -1) {
    let counts = local.get(sessionId);
    if (!counts) local.set(sessionId, (counts = new Map()));
    const before = counts.get(seatIndex) ?? 0;
    const after = Math.max(0, before + delta);
    if (after === 0) counts.delete(seatIndex);
    else counts.set(seatIndex, after);
    if (counts.size === 0) local.delete(sessionId);
    if ((before === 0) === (after === 0)) return;
    tell(sessionId);
    arm();
    const inOthers = [...(remote.get(sessionId)?.values() ?? [])].some((e) =>
      e.seats.includes(seatIndex),
    );
    if (!inOthers) changed(sessionId);
  }

  function heard(signal: PresenceSignal) {
    if (signal.from === self) return;
    if (signal.kind === "presence-ask") {
      if (local.has(signal.sessionId)) tell(signal.sessionId);
      return;
    }
    watching(signal.sessionId, () => {
      let entries = remote.get(signal.sessionId);
      if (!entries) remote.set(signal.sessionId, (entries = new Map()));
      if (signal.seats.length > 0) {
        entries.set(signal.from, { seats: signal.seats, heard: clock.now() });
      } else entries.delete(signal.from);
      if (entries.size === 0) remote.delete(signal.sessionId);
    });
    arm();
  }

  /** The refresh runs while this process counts or remembers any list. */
  let timer: TimerHandle | null = null;
  function arm() {
    if (timer || (local.size === 0 && remote.size === 0)) return;
    timer = clock.setTimer(refresh, PRESENCE_REFRESH_MS, { unref: true });
  }
  function refresh() {
    timer = null;
    for (const sessionId of local.keys()) tell(sessionId);
    const now = clock.now();
    for (const [sessionId, entries] of [...remote]) {
      watching(sessionId, () => {
        for (const [from, entry] of [...entries]) {
          if (now - entry.heard >= PRESENCE_EXPIRY_MS) entries.delete(from);
        }
        if (entries.size === 0) remote.delete(sessionId);
      });
    }
    arm();
  }

  return {
    count,
    seats,
    heard,
    /** a facilitator joined here: the other processes tell their lists for the session */
    ask: (sessionId: string) => publish({ kind: "presence-ask", from: self, sessionId }),
    stop() {
      if (timer) clock.clearTimer(timer);
      timer = null;
    },
  };
}
