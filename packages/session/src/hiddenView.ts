/**
 * R41: how a view keeps private numbers from everyone but the facilitator until the session
 * ends. The withheld view's contest holds the mean of each range (the belief summary, R42) in
 * place of another seat's private number; its full round results, totals and shock records
 * (which carry payoffs, efforts, best replies and equilibria computed from the truth) give way
 * to `hidden.rounds`: every seat's spend and share, and the viewer's own result.
 */
import { beliefContest } from "@contend/protocol";
import type {
  HiddenEntry,
  HiddenRoundView,
  HiddenView,
  RoleView,
  RoundResult,
  ShockRecord,
} from "@contend/protocol";
import { entriesOf } from "./hidden";
import type { LiveState } from "./state";

/** True while a session's private numbers are secret: it has some and has not ended (R41). */
export function truthSealed(state: LiveState): boolean {
  return state.settings.hidden !== undefined && state.status !== "ended";
}

/** True while the truth is kept from this role: every role but the facilitator (R41). */
export function truthWithheld(state: LiveState, role: RoleView["role"]): boolean {
  return truthSealed(state) && role !== "facilitator";
}

function hiddenRound(r: RoundResult, own: number | null): HiddenRoundView {
  const played = r.spends.map((_, i) => r.seatIndices.includes(i));
  const mine = own !== null && played[own] === true;
  return {
    round: r.round,
    spends: r.spends,
    shares: r.shares,
    played,
    winner: r.winner,
    you: mine
      ? {
          spend: r.spends[own]!,
          share: r.shares[own]!,
          payoff: r.payoffs[own]!,
          truthReplySpend: r.bestResponseSpends[own]!,
          beliefReplySpend: r.beliefReplySpends?.[own] ?? null,
        }
      : null,
  };
}

function maskShock(s: ShockRecord, entries: HiddenEntry[], own: number | null): ShockRecord {
  const secret = (i: number, field: string) =>
    i !== own && entries.some((e) => e.seatIndex === i && e.field === field);
  return {
    afterRound: s.afterRound,
    changes: s.changes.filter((c) => c.target !== "rival" || !secret(c.index, c.field)),
    before: beliefContest(s.before, entries, own),
    after: beliefContest(s.after, entries, own),
  };
}

/** Adds `hidden` to a view of a session with private numbers, withholding the truth (R41). */
export function withHidden(
  state: LiveState,
  view: RoleView,
  own: number | null,
  revealed = false,
): RoleView {
  const hidden = state.settings.hidden;
  if (!hidden) return view;
  const entries = entriesOf(state);
  const withheld = !revealed && truthWithheld(state, view.role);
  const info: HiddenView = {
    truth: hidden.truth,
    entries,
    withheld,
    rounds: withheld ? state.rounds.map((r) => hiddenRound(r, own)) : [],
    robustPlans: state.status === "ended" ? state.robustPlans : [],
  };
  if (!withheld) return { ...view, hidden: info };
  return {
    ...view,
    hidden: info,
    scenario: beliefContest(state.scenario, entries, own),
    rounds: [],
    totals: [],
    shocks: state.shocks.map((s) => maskShock(s, entries, own)),
  };
}
