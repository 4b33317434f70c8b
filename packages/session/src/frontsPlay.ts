/**
 * Moves in a session with fronts (R49, R20): the contest of a round's seats over the fronts,
 * computer allocations when a round opens, and the allocation filled in for a seat that did
 * not seal. Every allocation is money per front and passes checkAllocation (R46).
 */
import {
  bestAllocationAgainst,
  frontOppositions,
  normalizeFronts,
  solveFronts,
} from "@contend/solver";
import type { FrontsContest, FrontsEquilibrium, FrontsScenario } from "@contend/solver";
import type { EventOf, RoundResult } from "@contend/protocol";
import { computerMoveId } from "./computer";
import type { SeatState } from "./state";

/** The fronts contest of the seats playing a round, in round order (rival k is seatIndices[k]). */
export function roundFronts(fronts: FrontsScenario, seatIndices: readonly number[]): FrontsContest {
  return normalizeFronts({ ...fronts, rivals: seatIndices.map((i) => fronts.rivals[i]!) });
}

/** An allocation cut to the rival's budget: negatives to 0, a total a few ulps over scaled down. */
export function fitAllocation(row: readonly number[], budget: number): number[] {
  const clean = row.map((x) => (Number.isFinite(x) && x > 0 ? x : 0));
  const total = clean.reduce((a, b) => a + b, 0);
  return total > budget && total > 0 ? clean.map((x) => (x * budget) / total) : clean;
}

/** Money on each front of a seat in a resolved round (zeros where it did not play). */
function spendsIn(r: RoundResult | undefined, seat: number, k: number): number[] | null {
  const row = r?.fronts?.spends[seat];
  return row && row.length === k && r?.seatIndices.includes(seat) ? row : null;
}

/**
 * R49: "equilibrium" plays its row of the fronts equilibrium (solveFronts); "best-reply" plays
 * its best allocation (bestAllocationAgainst) to the others' allocations of the last round, and
 * the equilibrium row in the first round. With no pure equilibrium, "equilibrium" plays the
 * best reply too, and a best reply to nothing is the best allocation against zero spends.
 */
export function frontsComputerMoves(input: {
  fronts: FrontsScenario;
  round: number;
  seatIndices: number[];
  seats: readonly SeatState[];
  history: readonly RoundResult[];
}): EventOf<"move-sealed">[] {
  const fc = roundFronts(input.fronts, input.seatIndices);
  const K = fc.fronts.length;
  let eq: FrontsEquilibrium | null = null;
  const equilibrium = () => (eq ??= solveFronts(fc).equilibrium);
  const last = input.history.at(-1);
  const out: EventOf<"move-sealed">[] = [];
  input.seatIndices.forEach((seatIndex, self) => {
    const spec = input.seats[seatIndex]?.policy;
    if (!spec) return;
    const rival = fc.rivals[self]!;
    const eqRow = equilibrium().spends?.[self] ?? null;
    let row: number[];
    if (spec.kind === "equilibrium" && eqRow) row = eqRow;
    else if (spec.kind === "best-reply" && !last && eqRow) row = eqRow;
    else {
      // the others' efforts of the last round (zero where unknown); mine does not matter
      const efforts = input.seatIndices.map((seat, i) =>
        (spendsIn(last, seat, K) ?? new Array<number>(K).fill(0)).map(
          (s, k) => s / fc.rivals[i]!.cost[k]!,
        ),
      );
      const opp = frontOppositions(fc, efforts).map((o) => o[self]!);
      const best = bestAllocationAgainst(fc, self, opp).allocation;
      row = best.map((x, k) => x * rival.cost[k]!);
    }
    const frontSpends = fitAllocation(row, rival.budget);
    const total = frontSpends.reduce((a, b) => a + b, 0);
    out.push({
      type: "move-sealed",
      round: input.round,
      seatIndex,
      effort: total,
      spend: total,
      frontSpends,
      clientMoveId: computerMoveId(input.round, seatIndex),
      by: "computer",
    });
  });
  return out;
}

/**
 * R20 with fronts: a seat that did not seal plays zero on every front, or (missingMove
 * "repeat") its allocation of the previous round.
 */
export function missingAllocation(
  missingMove: "zero" | "repeat",
  last: RoundResult | undefined,
  seat: number,
  fronts: number,
  budget: number,
): number[] {
  const before = missingMove === "repeat" ? spendsIn(last, seat, fronts) : null;
  return fitAllocation(before ?? new Array<number>(fronts).fill(0), budget);
}
