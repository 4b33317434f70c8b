/**
 * sealMove (R10-R13, R26, R46): a seat's sealed move, a spend in a single contest or an
 * allocation over the fronts in a session with fronts. Checked with the one rule of each
 * (checkMove, checkAllocation); a repeated clientMoveId is the same move.
 */
import { LIMITS, spendStepOf } from "@contend/protocol";
import type { CommandOf } from "@contend/protocol";
import { checkMove, spendProblemText } from "./effort";
import { allocationProblemText, checkAllocation } from "./allocation";
import { roundFronts } from "./frontsPlay";
import type { Decision } from "./result";
import { accept, notPaused, reject } from "./result";
import type { LiveState } from "./state";

type SealedMoveData = {
  effort: number;
  spend: number;
  clientMoveId: string;
  frontSpends?: number[] | null;
};

export function sealMove(
  state: LiveState,
  command: CommandOf<"sealMove">,
  seatIndex: number,
): Decision {
  if (state.status !== "open") return reject("wrong-state", "R10: no round is open");
  const open = state.open;
  if (command.round !== undefined && command.round !== open.round) {
    return reject(
      "wrong-state",
      `round: the move is for round ${command.round} but round ${open.round} is open`,
      "round",
    );
  }
  const paused = notPaused(state, "sealing a move");
  if (paused) return paused;
  const seat = state.seats[seatIndex];
  const k = open.seatIndices.indexOf(seatIndex);
  if (!seat || k < 0) return reject("forbidden", `R11: seat ${seatIndex} does not play this round`);
  if (seat.policy) return reject("forbidden", `R11: seat ${seatIndex} is played by the computer`);

  const current = open.moves[seatIndex] ?? null;
  const data = ({ effort, spend, clientMoveId, frontSpends }: SealedMoveData) =>
    ({
      kind: "sealMove",
      round: open.round,
      seatIndex,
      clientMoveId,
      effort,
      spend,
      ...(frontSpends ? { frontSpends } : {}),
    }) as const;
  if (current && current.clientMoveId === command.clientMoveId) {
    // R13: a repeated clientMoveId is the same move: same ack, nothing new in the log.
    return accept([], data(current));
  }
  if (current?.replacedIds.includes(command.clientMoveId)) {
    return reject(
      "conflict",
      `clientMoveId: ${JSON.stringify(command.clientMoveId)} was used for a move that has since been replaced`,
      "clientMoveId",
    );
  }
  if (current && current.replacedIds.length + 1 >= LIMITS.movesPerSeatPerRound) {
    return reject(
      "rate-limited",
      `R13: at most ${LIMITS.movesPerSeatPerRound} moves per seat in a round; the last one stands`,
    );
  }
  // R26: an optional one-line reason travels with the move, private until the round resolves.
  const reason = command.reason ? { reason: command.reason } : {};
  if (state.fronts) {
    // R46: in a session with fronts the move is an allocation, money per front
    if (command.frontSpends === undefined) {
      return reject(
        "bad-request",
        "frontSpends: R46: this session has fronts; seal frontSpends, the money on each front",
        "frontSpends",
      );
    }
    const fc = roundFronts(state.fronts, open.seatIndices);
    const check = checkAllocation(command.frontSpends, fc.rivals[k]!);
    if (!check.ok) {
      const names = fc.fronts.map((f) => f.name);
      return reject(
        "bad-request",
        `frontSpends: R46: ${allocationProblemText(check, names)}`,
        "frontSpends",
      );
    }
    const move = {
      effort: check.total,
      spend: check.total,
      frontSpends: check.spends,
      clientMoveId: command.clientMoveId,
    };
    return accept(
      [{ type: "move-sealed", round: open.round, seatIndex, ...move, by: "seat", ...reason }],
      data(move),
    );
  }
  if (command.frontSpends !== undefined) {
    return reject(
      "bad-request",
      "frontSpends: R46: this session is one contest; seal spend",
      "frontSpends",
    );
  }
  const rival = open.scenario.rivals[k]!;
  // R12: the move is money; the older form (effort) costs cost x effort.
  const field = command.spend !== undefined ? "spend" : "effort";
  const check = checkMove(
    command.spend !== undefined ? { spend: command.spend } : { effort: command.effort! },
    rival,
    spendStepOf(state.settings),
  );
  if (!check.ok) {
    return reject(
      "bad-request",
      `${field}: R12: ${spendProblemText(check)} (got ${check.spend})`,
      field,
    );
  }
  const move = { effort: check.effort, spend: check.spend, clientMoveId: command.clientMoveId };
  return accept(
    [{ type: "move-sealed", round: open.round, seatIndex, ...move, by: "seat", ...reason }],
    data(move),
  );
}
