/** Small pure helpers shared by the live views. */
import type { CommandAckData, IssueLinksAckData, RoleView } from "@contend/protocol";
import { checkSpend } from "@contend/session";
import { formatMoney } from "./format";

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

/** What the seat's amount box holds: nothing yet, or a spend checked by the engine's own rule. */
export type SpendEntry =
  | { typed: false }
  | { typed: true; ok: true; spend: number; effort: number }
  | { typed: true; ok: false; problem: string; nearest: number | null };

/**
 * Reads the amount a seat typed (money) and checks it with the engine's rule (R12, `checkSpend`
 * in @contend/session), so the form refuses exactly what the server refuses. Problems are
 * plain words with units; `nearest` is a valid amount to offer instead.
 */
export function readSpend(
  text: string,
  rival: { cost: number; budget?: number | null },
  step: number,
  currency: string | null,
): SpendEntry {
  if (text.trim() === "") return { typed: false };
  const money = (v: number) => formatMoney(v, currency);
  const value = Number(text.replace(/[,\s]/g, ""));
  const check = checkSpend(value, rival, step);
  if (check.ok) return { typed: true, ok: true, spend: check.spend, effort: check.effort };
  switch (check.reason) {
    case "not-a-number":
    case "negative":
      return { typed: true, ok: false, problem: "Enter an amount of zero or more.", nearest: null };
    case "too-large":
      return { typed: true, ok: false, problem: "That amount is too large.", nearest: null };
    case "off-step":
      return {
        typed: true,
        ok: false,
        problem: `Amounts go in steps of ${money(check.step)}; the nearest is ${money(check.nearest)}.`,
        nearest: check.nearest,
      };
    case "over-budget":
      return {
        typed: true,
        ok: false,
        problem: `Your budget is ${money(check.budget)}; the most you can spend is ${money(check.largest)}.`,
        nearest: check.largest,
      };
  }
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
