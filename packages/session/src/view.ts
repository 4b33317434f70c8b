/**
 * viewFor(state, viewer): what one connection may see (R23). Sealed efforts of the open round
 * appear only in their owner's `you`; everyone sees which seats have sealed. Computer
 * policies are shown to the facilitator only. Resolved rounds are public to every role.
 */
import type { RoleView, Role, SeatView } from "@contend/protocol";
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
    if (viewer.role === "facilitator") seat.policy = s.policy;
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
    settings: state.settings,
    round: open ? open.round : state.rounds.length,
    roundsTotal: state.settings.rounds,
    deadline: open ? open.deadline : null,
    scenario: state.scenario,
    roundSeats: open ? open.seatIndices : null,
    seats,
    rounds: state.rounds,
    totals: state.totals,
    shocks: state.shocks,
  };
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
  }
  // R41: private numbers stay with their owner (and the facilitator) until the end.
  const own = viewer.role === "seat" ? (viewer.seatIndex ?? null) : null;
  return withHidden(state, view, own, viewer.revealed === true);
}
