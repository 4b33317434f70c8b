/**
 * Moves of computer-played seats, made when a round opens. Each uses the solver's policy,
 * seeded from (session seed, round, seat), and sees the efforts of earlier rounds mapped onto
 * this round's rivals (a seat that did not play a round counts as zero effort in it). In a
 * session with private numbers (R41) a computer seat knows what a human seat would: it plays
 * `beliefsOf(seat)`, the contest with the others' private numbers at their belief summary, and
 * reads earlier rounds as the others' spends over those believed costs.
 */
import { clampEffort, createPolicy, normalize } from "@contend/solver";
import type { Scenario } from "@contend/solver";
import { LIMITS } from "@contend/protocol";
import type { EventOf, RoundResult } from "@contend/protocol";
import type { SeatState } from "./state";
import { computerSeed } from "./seeds";

export function computerMoveId(round: number, seatIndex: number): string {
  return `computer-r${round}-s${seatIndex}`;
}

export function computerMoves(input: {
  seed: number;
  round: number;
  scenario: Scenario;
  seatIndices: number[];
  seats: readonly SeatState[];
  history: readonly RoundResult[];
  /** the money grid (spendStepOf(settings)) */
  step: number;
  /** sessions with private numbers: the round's contest as this seat believes it */
  beliefsOf?: (seatIndex: number) => Scenario;
}): EventOf<"move-sealed">[] {
  const truth = normalize(input.scenario);
  const out: EventOf<"move-sealed">[] = [];
  input.seatIndices.forEach((seatIndex, self) => {
    const spec = input.seats[seatIndex]?.policy;
    if (!spec) return;
    const contest = input.beliefsOf ? normalize(input.beliefsOf(seatIndex)) : truth;
    const history = input.history.map((r) => ({
      efforts: input.seatIndices.map((i, k) =>
        input.beliefsOf ? (r.spends[i] ?? 0) / contest.rivals[k]!.cost : (r.efforts[i] ?? 0),
      ),
    }));
    const policy = createPolicy(spec, computerSeed(input.seed, input.round, seatIndex));
    // The policy thinks in effort; the move is money on the session's money grid (R12, R19).
    const raw = policy.decide({ contest, self, history });
    const rival = contest.rivals[self]!;
    const spend = clampEffort(
      rival.cost * raw,
      Math.min(rival.maxSpend, LIMITS.effortMax),
      input.step,
    );
    out.push({
      type: "move-sealed",
      round: input.round,
      seatIndex,
      effort: spend / rival.cost,
      spend,
      clientMoveId: computerMoveId(input.round, seatIndex),
      by: "computer",
    });
  });
  return out;
}
