/**
 * viewFor(state, viewer): what one connection may see (R23). Sealed efforts of the open round
 * appear only in their owner's `you`; everyone sees which seats have sealed. Computer
 * policies (in the seats and in the settings) are shown to the facilitator only until the
 * session ends. Resolved
 * rounds are public to every role, except the winner draws' seeds: from one of them the
 * session's 32-bit seed can be searched out, and with it every later computer move and draw,
 * so they stay with the facilitator until the session ends.
 */
import type {
  RoleView,
  Role,
  RoundResult,
  SeatView,
  SessionSettings,
  Shock,
} from "@contend/protocol";
import type { SessionState } from "./state";
import { withHidden } from "./hiddenView";

export interface Viewer {
  role: Role;
  /** for role "seat" */
  seatIndex?: number;
  /**
   * true when reading the log of a session that has ended (a replay): a step before the end
   * shows its private numbers too (R41)
   */
  revealed?: boolean;
  /** the session's join code (kept in the database, not the log); shown to the facilitator only */
  joinCode?: string;
}

export function viewFor(state: SessionState, viewer: Viewer): RoleView {
  if (state.status === "empty") throw new Error("viewFor: the session has no events yet");
  const open = state.status === "open" ? state.open : null;
  // Computer policies and draw seeds: the facilitator's until the session ends, then everyone's.
  const revealed = viewer.role === "facilitator" || state.status === "ended";
  const seats: SeatView[] = state.seats.map((s) => {
    const seat: SeatView = {
      index: s.index,
      name: s.name,
      kind: s.policy ? "computer" : "human",
      claimed: s.claimed,
      displayName: s.displayName,
      sealed: (open?.moves[s.index] ?? null) !== null,
      active: s.active,
    };
    if (revealed) seat.policy = s.policy;
    return seat;
  });
  const view: RoleView = {
    role: viewer.role,
    sessionId: state.sessionId,
    title: state.scenario.title,
    status: state.status,
    paused: state.paused,
    remainingMs: state.remainingMs,
    endedReason: state.status === "ended" ? state.endedReason : null,
    settings: revealed ? state.settings : withoutComputer(state.settings),
    round: open ? open.round : state.rounds.length,
    roundsTotal: state.settings.rounds,
    deadline: open ? open.deadline : null,
    scenario: state.scenario,
    roundSeats: open ? open.seatIndices : null,
    seats,
    rounds: revealed ? state.rounds : withoutDrawSeeds(state.rounds),
    totals: state.totals,
    shocks: revealed ? state.shocks : state.shocks.map(withoutShockPolicy),
  };
  if (state.fronts) view.fronts = state.fronts;
  if (viewer.role === "facilitator" && viewer.joinCode !== undefined) {
    view.joinCode = viewer.joinCode;
  }
  if (viewer.role === "seat" && viewer.seatIndex !== undefined) {
    const mine = open?.moves[viewer.seatIndex] ?? null;
    view.you = {
      seatIndex: viewer.seatIndex,
      sealedEffort: mine ? mine.effort : null,
      sealedSpend: mine ? mine.spend : null,
      clientMoveId: mine ? mine.clientMoveId : null,
    };
    if (mine?.reason) view.you.sealedReason = mine.reason;
    // R47: an allocation is private to its seat until the round resolves, like a single move
    if (mine?.frontSpends) view.you.sealedFrontSpends = mine.frontSpends;
  }
  // R41: private numbers stay with their owner (and the facilitator) until the end.
  const own = viewer.role === "seat" ? (viewer.seatIndex ?? null) : null;
  return withHidden(state, view, own, viewer.revealed === true);
}

/** The settings with no computer policy in them (who plays is in `seats[].kind`). */
export function withoutComputer(settings: SessionSettings): SessionSettings {
  return Object.keys(settings.computer).length === 0 ? settings : { ...settings, computer: {} };
}

/** The rounds with their winner draws' seeds left out (null). */
export function withoutDrawSeeds(rounds: readonly RoundResult[]): RoundResult[] {
  return rounds.map((r) => (r.drawSeed === null ? r : { ...r, drawSeed: null }));
}

/** A shock record without the policy of a rival it adds (absent: not shown, not "human"). */
export function withoutShockPolicy<T extends { changes: Shock[] }>(record: T): T {
  if (!record.changes.some((c) => c.target === "add-rival" && c.policy)) return record;
  return {
    ...record,
    changes: record.changes.map((c) => {
      if (c.target !== "add-rival" || !c.policy) return c;
      const { policy: _hidden, ...rest } = c;
      return rest;
    }),
  };
}
