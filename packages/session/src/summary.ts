/**
 * A session's play as the numbers a planner compares across sessions (the body of
 * GET /api/sessions/:id/summary). Pure: the event log in, the summary out. Only resolved rounds
 * count; money is spend = cost x effort as the rounds store it.
 */
import type {
  RoundResult,
  SessionEvent,
  SessionSummaryBody,
  SummaryRound,
  SummarySeat,
  SummaryShock,
} from "@contend/protocol";
import { fold } from "./apply";
import { shockText } from "./shockText";
import type { LiveState } from "./state";

/** A seat spent "near its best reply" when within this fraction of the best reply's spend. */
export const NEAR_BEST_REPLY = 0.1;

export interface SummaryOptions {
  tags?: readonly string[];
}

/** Null for an empty log (no session-created event). */
export function summarizeSession(
  events: readonly SessionEvent[],
  options: SummaryOptions = {},
): SessionSummaryBody | null {
  const state = fold(events);
  if (state.status === "empty") return null;
  const created = events.find((e) => e.type === "session-created");
  const ended = events.findLast((e) => e.type === "session-ended");
  return {
    session: {
      id: state.sessionId,
      title: state.initial.title,
      currency: state.scenario.currency ?? null,
      createdAt: new Date(created?.at ?? state.at).toISOString(),
      endedAt: ended ? new Date(ended.at).toISOString() : null,
      tags: [...(options.tags ?? [])],
    },
    rounds: state.rounds.map((r) => roundSummary(r, state)),
    seats: state.seats.map((s) => seatSummary(s.index, state)),
  };
}

/** Money at the round's equilibrium, summed over its seats; null when any is unknown. */
function equilibriumTotal(r: RoundResult): number | null {
  if (r.equilibrium.kind === "none-pure") return null;
  let total = 0;
  for (const seat of r.seatIndices) {
    const e = r.equilibriumSpends[seat];
    if (e === null || e === undefined) return null;
    total += e;
  }
  return total;
}

const ratio = (a: number, b: number | null): number | null => (b === null || b <= 0 ? null : a / b);

function roundSummary(r: RoundResult, state: LiveState): SummaryRound {
  const totalSpend = r.seatIndices.reduce((sum, seat) => sum + (r.spends[seat] ?? 0), 0);
  const eqTotal = equilibriumTotal(r);
  return {
    round: r.round,
    totalSpend,
    equilibriumTotalSpend: eqTotal,
    overspend: ratio(totalSpend, eqTotal),
    prize: r.scenario.prize,
    nashGap: r.nashGap,
    nashGapShare: ratio(r.nashGap, r.scenario.prize),
    dissipation: r.dissipation,
    shock: shockBefore(r.round, state),
    note: r.note !== undefined && r.note.trim() !== "" ? r.note : null,
  };
}

function shockBefore(round: number, state: LiveState): SummaryShock | null {
  const shocks = state.shocks.filter((s) => s.afterRound === round - 1);
  if (shocks.length === 0) return null;
  return {
    changes: shocks.flatMap((s) => s.changes),
    text: shocks.map(shockText).join("; "),
  };
}

function seatSummary(seat: number, state: LiveState): SummarySeat {
  let rounds = 0;
  let spend = 0;
  let eqRounds = 0;
  let spendAtEq = 0;
  let eqSpend = 0;
  let regret = 0;
  let payoff = 0;
  let near = 0;
  for (const r of state.rounds) {
    if (!r.seatIndices.includes(seat)) continue;
    const s = r.spends[seat] ?? 0;
    rounds += 1;
    spend += s;
    regret += r.regrets[seat] ?? 0;
    payoff += r.payoffs[seat] ?? 0;
    const best = r.bestResponseSpends[seat] ?? 0;
    if (Math.abs(s - best) <= NEAR_BEST_REPLY * best) near += 1;
    const eq = equilibriumTotal(r) === null ? null : (r.equilibriumSpends[seat] ?? null);
    if (eq !== null) {
      eqRounds += 1;
      eqSpend += eq;
      spendAtEq += s;
    }
  }
  return {
    seat,
    rival: state.scenario.rivals[seat]?.name ?? `seat ${seat}`,
    kind: state.seats[seat]?.policy ? "computer" : "person",
    rounds,
    meanSpend: rounds === 0 ? null : spend / rounds,
    meanEquilibriumSpend: eqRounds === 0 ? null : eqSpend / eqRounds,
    overspend: eqRounds === 0 ? null : ratio(spendAtEq, eqSpend),
    totalRegret: regret,
    totalPayoff: payoff,
    nearBestReply: rounds === 0 ? null : near / rounds,
  };
}
