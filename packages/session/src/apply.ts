/**
 * apply(state, event): the only way state changes. It trusts the event (decide() produced it)
 * and throws on an event that cannot follow the state: that is a corrupt log, i.e. a bug.
 */
import { frontsRoster, isFrontsSession } from "@contend/protocol";
import type { EventOf, SessionEvent } from "@contend/protocol";
import type { FrontsScenario, Scenario } from "@contend/solver";
import type { LiveState, OpenRound, SeatState, SessionCore, SessionState } from "./state";
import { initialState } from "./state";
import { roundWithMoney } from "./money";

function corrupt(event: SessionEvent, state: SessionState): never {
  throw new Error(`event ${event.seq} (${event.type}) cannot follow status ${state.status}`);
}

function live(state: SessionState, event: SessionEvent): LiveState {
  if (state.status === "empty") corrupt(event, state);
  return state;
}

function core(state: LiveState): SessionCore {
  // Drop the status-specific fields; the caller adds the new status.
  const { status: _s, ...rest } = state as LiveState & { open?: OpenRound; endedReason?: unknown };
  delete rest.open;
  delete rest.endedReason;
  return rest;
}

function created(event: EventOf<"session-created"> & { seq: number; at: number }): SessionState {
  const { scenario } = event;
  // R45: a fronts session reads names, budgets and money totals from its single-contest summary
  const settings = scenario.session;
  let fronts: FrontsScenario | null = null;
  let contest: Scenario;
  if (isFrontsSession(scenario)) {
    const { session: _s, ...f } = scenario;
    fronts = f;
    contest = frontsRoster(f);
  } else {
    const { session: _s, ...c } = scenario;
    contest = c;
  }
  const seats: SeatState[] = event.seats.map((s) => ({
    index: s.index,
    name: s.name,
    policy: s.policy,
    claimed: false,
    displayName: null,
    active: true,
  }));
  return {
    status: "lobby",
    sessionId: event.sessionId,
    seq: event.seq,
    at: event.at,
    seed: event.seed,
    initial: scenario,
    settings,
    scenario: contest,
    fronts,
    seats,
    rounds: [],
    totals: seats.map(() => 0),
    shocks: [],
    paused: false,
    remainingMs: null,
  };
}

function withSeat(seats: SeatState[], index: number, patch: Partial<SeatState>): SeatState[] {
  return seats.map((s) => (s.index === index ? { ...s, ...patch } : s));
}

function applyShock(
  state: LiveState,
  event: EventOf<"shock-applied"> & { seq: number; at: number },
): SessionCore {
  let seats = state.seats;
  let totals = state.totals;
  for (const change of event.changes) {
    if (change.target === "add-rival") {
      const index = seats.length;
      seats = [
        ...seats,
        {
          index,
          name: change.rival.name,
          policy: change.policy ?? null,
          claimed: false,
          displayName: null,
          active: true,
        },
      ];
      totals = [...totals, 0];
    } else if (change.target === "retire-rival") {
      seats = withSeat(seats, change.index, { active: false });
    }
  }
  return {
    ...core(state),
    scenario: event.scenario,
    seats,
    totals,
    shocks: [
      ...state.shocks,
      {
        afterRound: state.rounds.length,
        changes: event.changes,
        before: state.scenario,
        after: event.scenario,
      },
    ],
  };
}

export function apply(state: SessionState, event: SessionEvent): SessionState {
  if (event.type === "session-created") {
    if (state.status !== "empty") corrupt(event, state);
    return created(event);
  }
  const s = live(state, event);
  const stamp = { seq: event.seq, at: event.at };
  switch (event.type) {
    case "seat-claimed":
      return {
        ...s,
        ...stamp,
        seats: withSeat(s.seats, event.seatIndex, {
          claimed: true,
          displayName: event.displayName,
        }),
      };
    case "seat-policy-set":
      return {
        ...s,
        ...stamp,
        seats: withSeat(s.seats, event.seatIndex, { policy: event.policy }),
      };
    case "round-opened": {
      if (s.status !== "lobby" && s.status !== "review") corrupt(event, s);
      const open: OpenRound = {
        round: event.round,
        scenario: event.scenario,
        seatIndices: event.seatIndices,
        deadline: event.deadline,
        moves: s.seats.map(() => null),
      };
      return { ...core(s), ...stamp, status: "open", open };
    }
    case "move-sealed": {
      if (s.status !== "open" || s.open.round !== event.round) corrupt(event, s);
      const prev = s.open.moves[event.seatIndex] ?? null;
      const moves = s.open.moves.slice();
      const k = s.open.seatIndices.indexOf(event.seatIndex);
      const cost = s.open.scenario.rivals[k]?.cost ?? 1;
      moves[event.seatIndex] = {
        effort: event.effort,
        // logs written before spends: the money is cost x effort
        spend: event.spend ?? cost * event.effort,
        clientMoveId: event.clientMoveId,
        by: event.by,
        replacedIds: prev ? [...prev.replacedIds, prev.clientMoveId] : [],
        reason: event.reason ?? null,
        frontSpends: event.frontSpends ?? null,
      };
      return { ...s, ...stamp, open: { ...s.open, moves } };
    }
    case "round-resolved": {
      if (s.status !== "open" || s.open.round !== event.round) corrupt(event, s);
      const { type: _t, ...result } = event;
      const round = roundWithMoney(result, s.open.scenario, s.open.seatIndices);
      return {
        ...core(s),
        ...stamp,
        status: "review",
        rounds: [...s.rounds, round],
        totals: event.totals,
        paused: false,
        remainingMs: null,
      };
    }
    case "shock-applied":
      if (s.status !== "lobby" && s.status !== "review") corrupt(event, s);
      return { ...applyShock(s, event), ...stamp, status: s.status };
    case "paused": {
      const next = { ...s, ...stamp, paused: true, remainingMs: event.remainingMs };
      if (next.status === "open") return { ...next, open: { ...next.open, deadline: null } };
      return next;
    }
    case "resumed": {
      const next = { ...s, ...stamp, paused: false, remainingMs: null };
      if (next.status === "open")
        return { ...next, open: { ...next.open, deadline: event.deadline } };
      return next;
    }
    case "round-noted": {
      if (!s.rounds.some((r) => r.round === event.round)) corrupt(event, s);
      const rounds = s.rounds.map((r) => {
        if (r.round !== event.round) return r;
        const { note: _old, ...rest } = r;
        return event.text ? { ...rest, note: event.text } : rest;
      });
      return { ...s, ...stamp, rounds };
    }
    case "session-ended":
      if (s.status === "ended") corrupt(event, s);
      return {
        ...core(s),
        ...stamp,
        status: "ended",
        endedReason: event.reason,
        robustPlans: event.robustPlans ?? [],
        paused: false,
        remainingMs: null,
      };
    default: {
      const never: never = event;
      throw new Error(`unknown event ${JSON.stringify(never)}`);
    }
  }
}

/** state = events.reduce(apply, initialState()); the replay viewer stops it at any event. */
export function fold(events: readonly SessionEvent[], from: SessionState = initialState()) {
  return events.reduce(apply, from);
}
