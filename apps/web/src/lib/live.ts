/** Small pure helpers shared by the live views. */
import type { CommandAckData, IssueLinksAckData, RoleView } from "@contend/protocol";

/**
 * How far the server's clock is ahead of ours (ms), from one request and its answer: the
 * server read its clock at `serverNow`, which we take to be the midpoint of the round trip
 * from `sentAt` to `receivedAt` on our clock (Cristian 1989, "Probabilistic clock
 * synchronization"); the error is at most half the round trip.
 */
export function clockOffsetMs(sentAt: number, receivedAt: number, serverNow: number): number {
  return serverNow - (sentAt + receivedAt) / 2;
}

/**
 * Milliseconds left on the round clock, or null when the round has no clock. `now` is on the
 * server's clock (the deadline is): our clock plus clockOffsetMs.
 */
export function remainingMs(view: RoleView, now: number): number | null {
  if (view.status !== "open") return null;
  if (view.paused) return view.remainingMs;
  if (view.deadline === null) return null;
  return Math.max(0, view.deadline - now);
}

export const STATUS_TEXT: Record<RoleView["status"], string> = {
  lobby: "Waiting to start",
  open: "Round open",
  review: "Round revealed",
  ended: "Session ended",
};

export function seatNames(view: RoleView): string[] {
  return view.seats.map((s) => s.name);
}

/** Nearest multiple of the step (the server refuses efforts off the grid). */
export function snapToStep(value: number, step: number): number {
  if (!(step > 0) || !Number.isFinite(value)) return value;
  const k = Math.round(value / step);
  // Rebuild from the integer count so 0.1-type steps do not leave float dust.
  const decimals = Math.max(0, Math.min(12, -Math.floor(Math.log10(step)) + 2));
  return Number((k * step).toFixed(decimals));
}

export function isOnStep(value: number, step: number): boolean {
  if (!(step > 0)) return true;
  const k = value / step;
  return Math.abs(k - Math.round(k)) <= 1e-9 * Math.max(1, Math.abs(k));
}

/** Invite links of sessions created in this browser (the server never sends keys again). */
const STORE_PREFIX = "contend:created:";

export interface StoredInvites {
  joinCode: string;
  links: { facilitator: string; spectator: string; join: string };
  seats: { index: number; name: string; link: string | null }[];
}

export function rememberInvites(id: string, invites: StoredInvites): void {
  try {
    window.localStorage.setItem(STORE_PREFIX + id, JSON.stringify(invites));
  } catch {
    // storage may be disabled; the links were shown once already
  }
}

export function recallInvites(id: string): StoredInvites | null {
  try {
    const raw = window.localStorage.getItem(STORE_PREFIX + id);
    return raw ? (JSON.parse(raw) as StoredInvites) : null;
  } catch {
    return null;
  }
}

/**
 * The invitations the console shows: what this browser stored (the creating browser has every
 * link), completed from the facilitator's view so any browser has the join code and every seat.
 * An empty link string means this browser has no link for it yet.
 */
export function invitesFor(view: RoleView, stored: StoredInvites | null): StoredInvites {
  const joinCode = view.joinCode ?? stored?.joinCode ?? "";
  const links = {
    facilitator: stored?.links.facilitator ?? "",
    spectator: stored?.links.spectator ?? "",
    join: stored?.links.join ?? (joinCode ? `/join?code=${encodeURIComponent(joinCode)}` : ""),
  };
  const seats = view.seats.map((s) => ({
    index: s.index,
    name: s.name,
    link: stored?.seats.find((k) => k.index === s.index)?.link ?? null,
  }));
  return { joinCode, links, seats };
}

/** The invitations with a freshly issued link in place of the old one for that seat or screen. */
export function withIssuedLink(invites: StoredInvites, issued: IssueLinksAckData): StoredInvites {
  if (issued.seatIndex === null) {
    return { ...invites, links: { ...invites.links, spectator: issued.link } };
  }
  const seatIndex = issued.seatIndex;
  const known = invites.seats.some((s) => s.index === seatIndex);
  const seats = known
    ? invites.seats.map((s) => (s.index === seatIndex ? { ...s, link: issued.link } : s))
    : [...invites.seats, { index: seatIndex, name: `Seat ${seatIndex + 1}`, link: issued.link }];
  return { ...invites, seats };
}

/** The issueLinks data of an ack, or null for another command's ack. */
export function issuedLinkOf(data: CommandAckData): IssueLinksAckData | null {
  return "link" in data && "key" in data ? data : null;
}

/** A random id for sealMove's idempotency key. */
export function newClientMoveId(): string {
  const c = globalThis.crypto;
  if (c && "randomUUID" in c) return c.randomUUID();
  return `m-${Date.now().toString(36)}-${Math.random().toString(36).slice(2, 10)}`;
}
