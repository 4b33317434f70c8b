/**
 * Resolution of a round in a session with fronts (R48): every number is computed here, once,
 * with the solver's fronts functions, and stored in the round-resolved event.
 * - per front k: shares p_ik (the front's contest success function), value won V_ik p_ik;
 * - payoff u_i = sum_k V_ik p_ik - sum_k spend_ik (sum_k V_ik p_ik for a sunk budget);
 * - best allocation and regret of each seat against the others' actual allocations
 *   (respondFronts: the whole-allocation best reply under the budget), Nash gap = largest regret;
 * - the fronts equilibrium (solveFronts) for comparison.
 * The single-contest fields hold totals over fronts (money), so summaries, exports and charts
 * of totals read a fronts round like any other: spend = total money, share = the share of all
 * prizes won, equilibrium efforts = each seat's money at the equilibrium.
 */
import { respondFronts, shares as frontShares, solveFronts } from "@contend/solver";
import type { CloseReason, EventOf, FrontsRound } from "@contend/protocol";
import type { OpenRound, SessionCore } from "./state";
import { missingAllocation, roundFronts } from "./frontsPlay";

const sum = (xs: readonly number[]) => xs.reduce((a, b) => a + b, 0);

export function resolveFrontsRound(
  core: SessionCore & { fronts: NonNullable<SessionCore["fronts"]> },
  open: OpenRound,
  reason: CloseReason,
): EventOf<"round-resolved"> {
  const fc = roundFronts(core.fronts, open.seatIndices);
  const K = fc.fronts.length;
  const n = core.seats.length;
  const seats = open.seatIndices;
  const last = core.rounds.at(-1);
  const defaulted: boolean[] = [];
  // money per front in round order, sealed or filled in (R20)
  const spends = seats.map((seat, i) => {
    const move = open.moves[seat];
    defaulted.push(!move?.frontSpends);
    if (move?.frontSpends) return move.frontSpends.slice();
    return missingAllocation(core.settings.missingMove, last, seat, K, fc.rivals[i]!.budget);
  });
  const efforts = spends.map((row, i) => row.map((s, k) => s / fc.rivals[i]!.cost[k]!));
  // each front's own contest success function (solver `shares`), read back by seat
  const perFront = fc.contests.map((c, k) =>
    frontShares(
      c,
      efforts.map((row) => row[k]!),
    ),
  );
  const shares = seats.map((_, i) => perFront.map((p) => p[i]!));
  const won = shares.map((row, i) => row.map((p, k) => fc.rivals[i]!.value[k]! * p));
  const res = respondFronts(fc, efforts);
  const bestSpends = res.bestAllocations.map((row, i) =>
    row.map((x, k) => x * fc.rivals[i]!.cost[k]!),
  );
  const eq = solveFronts(fc).equilibrium;
  const totalPrize = sum(fc.fronts.map((f) => f.prize));
  const prizeShare = (row: readonly number[]) =>
    sum(row.map((p, k) => p * fc.fronts[k]!.prize)) / totalPrize;

  const zeros = () => new Array<number>(K).fill(0);
  const bySeat = <T>(values: readonly T[], empty: () => T): T[] => {
    const out = Array.from({ length: n }, empty);
    seats.forEach((seat, i) => (out[seat] = values[i]!));
    return out;
  };
  const eqPure = eq.kind === "pure" && eq.spends && eq.shares && eq.payoffs;
  const fronts: FrontsRound = {
    spends: bySeat(spends, zeros),
    shares: bySeat(shares, zeros),
    won: bySeat(won, zeros),
    bestSpends: bySeat(bestSpends, zeros),
    bestPayoffs: bySeat(
      res.payoffs.map((u, i) => u + res.regrets[i]!),
      () => 0,
    ),
    frontTotals: fc.fronts.map((_, k) => sum(spends.map((row) => row[k]!))),
    equilibrium: {
      kind: eq.kind,
      spends: eqPure ? bySeat(eq.spends!, zeros) : null,
      shares: eqPure ? bySeat(eq.shares!, zeros) : null,
      payoffs: eqPure ? bySeat(eq.payoffs!, () => 0) : null,
      shadowPrices: eqPure ? bySeat(eq.shadowPrices ?? [], () => null) : null,
      nashGap: Number.isFinite(eq.nashGap) ? eq.nashGap : null,
      method: eq.method,
      ...(eq.note ? { note: eq.note } : {}),
    },
  };

  const totals = spends.map(sum);
  const payoffsBySeat = bySeat(res.payoffs, () => 0);
  const eqTotals = eqPure ? eq.spends!.map(sum) : null;
  const reasons = open.moves.map((m) => m?.reason ?? null);
  while (reasons.length < n) reasons.push(null);
  return {
    type: "round-resolved",
    round: open.round,
    reason,
    efforts: bySeat(totals, () => 0),
    spends: bySeat(totals, () => 0),
    defaulted: bySeat(defaulted, () => false),
    shares: bySeat(shares.map(prizeShare), () => 0),
    winner: null,
    drawSeed: null,
    payoffs: payoffsBySeat,
    expectedPayoffs: payoffsBySeat,
    totals: payoffsBySeat.map((u, i) => (core.totals[i] ?? 0) + u),
    bestResponses: bySeat(bestSpends.map(sum), () => 0),
    regrets: bySeat(res.regrets, () => 0),
    equilibrium: {
      kind: eq.kind,
      efforts: eqTotals,
      shares: eqPure ? eq.shares!.map(prizeShare) : null,
      payoffs: eqPure ? eq.payoffs!.slice() : null,
      totalEffort: eqTotals ? sum(eqTotals) : 0,
      dissipation: eqTotals ? sum(eqTotals) / totalPrize : 0,
      active: eqTotals ? eqTotals.map((x) => x > 0) : seats.map(() => false),
      nashGap: Number.isFinite(eq.nashGap) ? eq.nashGap : null,
      method: eq.method,
      ...(eq.note ? { note: eq.note } : {}),
    },
    nashGap: res.nashGap,
    dissipation: sum(totals) / totalPrize,
    ...(reasons.some((r) => r !== null) ? { moveReasons: reasons } : {}),
    fronts,
  };
}
