/**
 * What the room is doing, in words: the big screen's headline, the console's next action and
 * the announcements screen readers hear. Pure functions of the role view, so every screen says
 * the same thing and a test can check each state.
 */
import type { RoleView, RoundResult } from "@contend/protocol";
import { roundOfShock, shockLines, shockLineText } from "./shockText";

/** Seats that play the open round (or would play the next one) and how many of them sealed. */
export function sealProgress(view: RoleView): { sealed: number; playing: number } {
  const playing = view.roundSeats ?? view.seats.filter((s) => s.active).map((s) => s.index);
  const sealed = playing.filter((i) => view.seats[i]?.sealed === true).length;
  return { sealed, playing: playing.length };
}

export type Tone = "waiting" | "open" | "paused" | "revealed" | "ended";

export interface Headline {
  tone: Tone;
  /** large, one line: "Round 2 open", "Paused", "Final standings" */
  title: string;
  /** one short line under it */
  detail: string;
}

export function headline(view: RoleView): Headline {
  const of = `of ${view.roundsTotal}`;
  if (view.status === "ended") {
    const n = view.rounds.length;
    return {
      tone: "ended",
      title: "Final standings",
      detail: `Session ended after ${n} round${n === 1 ? "" : "s"}`,
    };
  }
  if (view.paused) {
    return {
      tone: "paused",
      title: "Paused",
      detail:
        view.status === "open"
          ? `Round ${view.round} ${of} is on hold; the clock has stopped`
          : "The facilitator has paused the session",
    };
  }
  if (view.status === "open") {
    const { sealed, playing } = sealProgress(view);
    return {
      tone: "open",
      title: `Round ${view.round} open`,
      detail: `${sealed} of ${playing} sealed`,
    };
  }
  if (view.status === "review") {
    return {
      tone: "revealed",
      title: `Round ${view.round} revealed`,
      detail:
        view.round < view.roundsTotal
          ? `Round ${view.round + 1} ${of} comes next`
          : "That was the last round",
    };
  }
  const humans = view.seats.filter((s) => s.active && s.kind === "human");
  const taken = humans.filter((s) => s.claimed).length;
  return {
    tone: "waiting",
    title: "Waiting to start",
    detail: `${taken} of ${humans.length} seats taken · ${view.roundsTotal} rounds`,
  };
}

export type NextAction =
  | { kind: "open"; round: number; label: string }
  | { kind: "close"; label: string }
  | { kind: "resume"; label: string }
  | { kind: "end"; label: string }
  | { kind: "none"; label: string };

/** The one thing the facilitator does next; the console's main button says exactly this. */
export function nextAction(view: RoleView): NextAction {
  if (view.status === "ended") return { kind: "none", label: "Session ended" };
  if (view.paused) return { kind: "resume", label: "Resume" };
  if (view.status === "open")
    return { kind: "close", label: `Close round ${view.round} and reveal` };
  if (view.round >= view.roundsTotal) return { kind: "end", label: "End session" };
  const round = view.round + 1;
  return { kind: "open", round, label: `Open round ${round} of ${view.roundsTotal}` };
}

/**
 * What changed between two views, said once (for a live region): rounds opening and being
 * revealed, pauses, the end. Null when nothing worth saying happened.
 */
export function announcement(before: RoleView | null, after: RoleView): string | null {
  if (!before) return null;
  const said: string[] = [];
  if (after.status === "ended" && before.status !== "ended") said.push("The session has ended.");
  if (after.paused && !before.paused) said.push("Paused.");
  if (!after.paused && before.paused) said.push("Resumed.");
  const shocks = after.shocks.slice(before.shocks.length);
  if (shocks.length > 0) {
    const cur = after.scenario.currency ?? null;
    const lines = shocks.flatMap((s) => shockLines(s, cur)).map(shockLineText);
    const round = roundOfShock(shocks[0]!);
    said.push(
      `The contest changes from round ${round}${lines.length > 0 ? `: ${lines.join("; ")}` : ""}.`,
    );
  }
  if (after.status === "open" && (before.status !== "open" || before.round !== after.round)) {
    said.push(`Round ${after.round} is open.`);
  }
  if (after.status === "review" && before.status === "open") {
    said.push(`Round ${after.round} revealed.`);
  }
  return said.length > 0 ? said.join(" ") : null;
}

export interface Standing {
  seat: number;
  name: string;
  total: number;
  rank: number;
  retired: boolean;
}

/** Seats by total payoff, best first; equal totals share a rank (1, 2, 2, 4). */
export function standings(view: RoleView): Standing[] {
  const rows = view.seats
    .map((s) => ({
      seat: s.index,
      name: s.name,
      total: view.totals[s.index] ?? 0,
      retired: !s.active,
    }))
    .sort((a, b) => b.total - a.total || a.seat - b.seat);
  return rows.map((r) => ({
    ...r,
    rank: 1 + rows.filter((o) => o.total > r.total).length,
  }));
}

export interface SessionSummary {
  rounds: number;
  /** mean over rounds of the share of the prize spent, played and at equilibrium */
  meanDissipation: number | null;
  meanEquilibriumDissipation: number | null;
  /** the round where the room was furthest from equilibrium (largest regret) */
  widestGap: { round: number; gap: number } | null;
}

export function sessionSummary(rounds: readonly RoundResult[]): SessionSummary {
  if (rounds.length === 0) {
    return { rounds: 0, meanDissipation: null, meanEquilibriumDissipation: null, widestGap: null };
  }
  const mean = (xs: number[]) => xs.reduce((a, b) => a + b, 0) / xs.length;
  const widest = rounds.reduce((w, r) => (r.nashGap > w.nashGap ? r : w));
  return {
    rounds: rounds.length,
    meanDissipation: mean(rounds.map((r) => r.dissipation)),
    meanEquilibriumDissipation: mean(rounds.map((r) => r.equilibrium.dissipation)),
    widestGap: { round: widest.round, gap: widest.nashGap },
  };
}

/** A refused command in words a facilitator can act on (the server's message names the field). */
export function plainAckError(ack: { code: string; message: string; path?: string }): string {
  const field = ack.path ? `${ack.path}: ` : "";
  switch (ack.code) {
    case "wrong-state":
      return `Not possible right now: ${ack.message}.`;
    case "rate-limited":
      return "Too many clicks in a row; wait a second and try again.";
    case "unavailable":
      return "The server is restarting; this page reconnects by itself. Try again in a moment.";
    case "internal":
      return ack.message.charAt(0).toUpperCase() + ack.message.slice(1) + ".";
    default:
      return `Refused: ${field}${ack.message}.`;
  }
}
