/**
 * decide(state, command, ctx): the rules of a live session. Returns the events the command
 * causes (the caller stamps and commits them, then applies them) or a rejection; it never
 * changes anything itself and never reads the clock (ctx.now). Rule numbers (R1...) match the
 * protocol document and the tests.
 */
import { validateScenario } from "@contend/solver";
import { FRONTS_POLICIES, roleMaySend, spendStepOf } from "@contend/protocol";
import type {
  CloseReason,
  Command,
  CommandOf,
  EndReason,
  EventBody,
  Role,
} from "@contend/protocol";
import { computerMoves } from "./computer";
import { frontsComputerMoves } from "./frontsPlay";
import { sealMove } from "./seal";
import { resolveRound } from "./resolve";
import { robustPlans, roundBeliefs } from "./hidden";
import type { Decision } from "./result";
import { accept, notPaused, reject } from "./result";
import { applyChanges } from "./shocks";
import type { LiveState, SessionState } from "./state";
import { activeContest } from "./state";

/** Who sends a command. "system" is the server itself (round clock, all-sealed close). */
export interface Actor {
  role: Role | "system";
  /** the seat a seat actor holds */
  seatIndex?: number;
}

export interface DecideContext {
  /** epoch ms, supplied by the caller */
  now: number;
  actor: Actor;
}

/** Only the server closes a round for the clock or because every seat has sealed. */
export type SystemCommand = { type: "closeRound"; reason: Exclude<CloseReason, "facilitator"> };

export type EngineCommand = Command | SystemCommand;

function isSystem(command: EngineCommand): command is SystemCommand {
  return command.type === "closeRound" && "reason" in command;
}

/** The rule a refused sender breaks, for the message (docs/protocol.md section 8). */
function roleRule(type: Command["type"]): string {
  if (type === "sealMove") return "R7: only a seat may seal a move, and only for itself";
  if (type === "claimSeat") {
    return "R3: a seat is claimed by a guest with the join code, or by its own key";
  }
  return `R1: only the facilitator may ${type}`;
}

/** R1-R3, R7: who may send what, from the protocol's COMMAND_ROLES table. */
function checkRole(command: EngineCommand, actor: Actor): Decision | null {
  if (isSystem(command)) {
    return actor.role === "system"
      ? null
      : reject("forbidden", "R1: only the server closes a round for the clock or all-sealed");
  }
  if (actor.role === "spectator") {
    return reject("forbidden", "R2: spectators watch; they cannot send commands");
  }
  if (actor.role === "system" || !roleMaySend(actor.role, command.type)) {
    return reject("forbidden", roleRule(command.type));
  }
  if (actor.role !== "seat") return null;
  // A seat acts only for itself: sealMove names no seat; claimSeat must name its own.
  if (actor.seatIndex === undefined) return reject("forbidden", roleRule(command.type));
  if (command.type === "claimSeat" && command.seatIndex !== actor.seatIndex) {
    return reject("forbidden", roleRule(command.type));
  }
  return null;
}

export function decide(state: SessionState, command: EngineCommand, ctx: DecideContext): Decision {
  if (state.status === "empty") return reject("not-found", "no such session");
  const denied = checkRole(command, ctx.actor);
  if (denied) return denied;
  // R27: notes on played rounds are for the debrief, so they are taken after the end too.
  if (command.type === "noteRound") return noteRound(state, command);
  if (state.status === "ended") {
    return reject("wrong-state", "R4: the session has ended; nothing more can change");
  }
  if (isSystem(command)) return closeRound(state, command.reason);
  switch (command.type) {
    case "claimSeat":
      return claimSeat(state, command, ctx.actor);
    case "setSeatPolicy":
      return setSeatPolicy(state, command);
    case "pause":
      return pause(state, ctx.now);
    case "resume":
      return resume(state, ctx.now);
    case "endSession":
      return endSession(state);
    case "openRound":
      return openRound(state, command, ctx.now);
    case "closeRound":
      return closeRound(state, "facilitator");
    case "sealMove":
      return sealMove(state, command, ctx.actor.seatIndex as number);
    case "applyShock":
      return applyShock(state, command);
    case "issueLinks":
      return issueLinks(state, command);
    default: {
      const never: never = command;
      throw new Error(`unknown command ${JSON.stringify(never)}`);
    }
  }
}

function noteRound(state: LiveState, command: CommandOf<"noteRound">): Decision {
  if (!state.rounds.some((r) => r.round === command.round)) {
    return reject("not-found", `round: R27: round ${command.round} has not been played`, "round");
  }
  return accept([{ type: "round-noted", round: command.round, text: command.text }]);
}

function claimSeat(state: LiveState, command: CommandOf<"claimSeat">, actor: Actor): Decision {
  const seat = state.seats[command.seatIndex];
  if (!seat)
    return reject("not-found", `seatIndex: there is no seat ${command.seatIndex}`, "seatIndex");
  if (seat.claimed) {
    if (actor.role === "seat") return accept([], { kind: "claimSeat", seatIndex: seat.index });
    return reject("conflict", `R6: seat ${seat.index} (${seat.name}) is already taken`);
  }
  if (seat.policy) {
    return reject("conflict", `R6: seat ${seat.index} (${seat.name}) is played by the computer`);
  }
  if (!seat.active) return reject("conflict", `R6: seat ${seat.index} (${seat.name}) is retired`);
  return accept(
    [{ type: "seat-claimed", seatIndex: seat.index, displayName: command.displayName }],
    {
      kind: "claimSeat",
      seatIndex: seat.index,
    },
  );
}

/**
 * R25: a fresh invite link writes no event; the server stores the new key. A seat played by the
 * computer may get one too, for when a person takes it over.
 */
function issueLinks(state: LiveState, command: CommandOf<"issueLinks">): Decision {
  const seatIndex = command.seatIndex ?? null;
  if (seatIndex === null) return accept([], { kind: "issueLinks", seatIndex: null });
  const seat = state.seats[seatIndex];
  if (!seat) return reject("not-found", `seatIndex: there is no seat ${seatIndex}`, "seatIndex");
  if (!seat.active)
    return reject("wrong-state", `R25: seat ${seat.index} (${seat.name}) is retired`);
  if (state.status === "open" && (state.open.moves[seat.index] ?? null) !== null) {
    return reject(
      "wrong-state",
      `R25: seat ${seat.index} (${seat.name}) has sealed its move for round ${state.open.round}; ` +
        "its new link can be issued once the round is resolved (the move stays its holder's)",
    );
  }
  return accept([], { kind: "issueLinks", seatIndex: seat.index });
}

function setSeatPolicy(state: LiveState, command: CommandOf<"setSeatPolicy">): Decision {
  const seat = state.seats[command.seatIndex];
  if (!seat)
    return reject("not-found", `seatIndex: there is no seat ${command.seatIndex}`, "seatIndex");
  if (state.status === "open") {
    return reject("wrong-state", "R15: change who plays a seat between rounds, not during one");
  }
  if (!seat.active)
    return reject("wrong-state", `R15: seat ${seat.index} (${seat.name}) is retired`);
  if (state.fronts && command.policy && !FRONTS_POLICIES.includes(command.policy.kind)) {
    return reject(
      "bad-request",
      `policy: R49: with fronts the computer plays ${FRONTS_POLICIES.join(" or ")}`,
      "policy",
    );
  }
  return accept([{ type: "seat-policy-set", seatIndex: seat.index, policy: command.policy }]);
}

function pause(state: LiveState, now: number): Decision {
  if (state.paused) return reject("wrong-state", "R16: the session is already paused");
  const deadline = state.status === "open" ? state.open.deadline : null;
  const remainingMs = deadline === null ? null : Math.max(0, deadline - now);
  return accept([{ type: "paused", remainingMs }]);
}

function resume(state: LiveState, now: number): Decision {
  if (!state.paused) return reject("wrong-state", "R16: the session is not paused");
  const deadline =
    state.status === "open" && state.remainingMs !== null ? now + state.remainingMs : null;
  return accept([{ type: "resumed", deadline }]);
}

function endSession(state: LiveState): Decision {
  const events: EventBody[] = [];
  // R17: ending during a round resolves it with the moves sealed so far.
  if (state.status === "open") events.push(resolveRound(state, state.open, "facilitator"));
  events.push(sessionEnded(state, "facilitator"));
  return accept(events);
}

/** R18/R44: the end of a session; with private numbers it carries each seat's robust plan. */
function sessionEnded(state: LiveState, reason: EndReason): EventBody {
  if (!state.settings.hidden) return { type: "session-ended", reason };
  return { type: "session-ended", reason, robustPlans: robustPlans(state) };
}

function openRound(state: LiveState, command: CommandOf<"openRound">, now: number): Decision {
  if (state.status === "open")
    return reject("wrong-state", `R8: round ${state.open.round} is still open`);
  const paused = notPaused(state, "opening a round");
  if (paused) return paused;
  const round = state.rounds.length + 1;
  if (round > state.settings.rounds) {
    return reject("wrong-state", `R8: all ${state.settings.rounds} rounds have been played`);
  }
  const { scenario, seatIndices } = activeContest(state);
  const valid = validateScenario(scenario);
  if (!valid.ok) throw new Error(`active contest is invalid: ${valid.path}: ${valid.message}`);
  const seconds =
    command.durationSeconds === undefined ? state.settings.clockSeconds : command.durationSeconds;
  const deadline = seconds === null ? null : now + Math.round(seconds * 1000);
  const moves = state.fronts
    ? frontsComputerMoves({
        fronts: state.fronts,
        round,
        seatIndices,
        seats: state.seats,
        history: state.rounds,
      })
    : computerMoves({
        seed: state.seed,
        round,
        scenario: valid.value,
        seatIndices,
        seats: state.seats,
        history: state.rounds,
        step: spendStepOf(state.settings),
        beliefsOf: state.settings.hidden
          ? (seat) => roundBeliefs(state, valid.value, seatIndices, seat)
          : undefined,
      });
  return accept([
    { type: "round-opened", round, scenario: valid.value, seatIndices, deadline },
    ...moves,
  ]);
}

function closeRound(state: LiveState, reason: CloseReason): Decision {
  if (state.status !== "open") return reject("wrong-state", "R9: no round is open");
  const paused = notPaused(state, "closing the round");
  if (paused) return paused;
  const events: EventBody[] = [resolveRound(state, state.open, reason)];
  // R18: the last round's resolution ends the session.
  if (state.open.round >= state.settings.rounds) {
    events.push(sessionEnded(state, "rounds-complete"));
  }
  return accept(events);
}

function applyShock(state: LiveState, command: CommandOf<"applyShock">): Decision {
  if (state.status === "open") {
    return reject(
      "wrong-state",
      `R14: shocks apply between rounds; close round ${state.open.round} first`,
    );
  }
  if (state.fronts) {
    return reject("wrong-state", "R50: shocks are not available in a session with fronts");
  }
  const paused = notPaused(state, "applying a shock");
  if (paused) return paused;
  const next = applyChanges(state, command.changes);
  if (!next.ok) return next;
  return accept([{ type: "shock-applied", changes: command.changes, scenario: next.scenario }]);
}
