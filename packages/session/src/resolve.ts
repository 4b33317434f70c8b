/**
 * Resolution of a round: every number the review screen shows is computed here, once, with
 * the solver, and stored in the round-resolved event.
 * - payoff u_i = v_i p_i - m_i e_i (risk neutral; shares mode, and the expected payoff in
 *   winner mode); winner mode realises v_i [i won] - m_i e_i with the winner drawn with
 *   probability p_i from a recorded seed.
 * - best responses, regrets and the Nash gap of the played profile: solver `respond`.
 * - the round's equilibrium: solver `solve`; dissipation of play: sum m_i e_i / prize.
 */
import {
  clampEffort,
  dissipation,
  drawWinner,
  mulberry32,
  normalize,
  payoffs,
  respond,
  shares,
  solve,
} from "@contend/solver";
import { spendStepOf } from "@contend/protocol";
import type { CloseReason, EventOf } from "@contend/protocol";
import type { OpenRound, SessionCore } from "./state";
import { drawSeedFor } from "./seeds";
import { beliefReplies } from "./hidden";
import { resolveFrontsRound } from "./frontsResolve";

/**
 * Spends and efforts of the round's seats in round order, and which were filled in by the
 * missing-move rule (R20: zero, or the previous round's spend, cut to a budget lowered since).
 */
export function playedEfforts(core: SessionCore, open: OpenRound) {
  const contest = normalize(open.scenario);
  const last = core.rounds.at(-1);
  const efforts: number[] = [];
  const spends: number[] = [];
  const defaulted: boolean[] = [];
  open.seatIndices.forEach((seatIndex, k) => {
    const move = open.moves[seatIndex];
    const rival = contest.rivals[k]!;
    if (move) {
      efforts.push(move.effort);
      spends.push(move.spend);
      defaulted.push(false);
      return;
    }
    defaulted.push(true);
    const before =
      core.settings.missingMove === "repeat" && last?.seatIndices.includes(seatIndex)
        ? (last.spends[seatIndex] ?? 0)
        : 0;
    const spend = clampEffort(before, rival.maxSpend, spendStepOf(core.settings));
    spends.push(spend);
    efforts.push(spend / rival.cost);
  });
  return { contest, efforts, spends, defaulted };
}

function perSeat(n: number, seatIndices: number[], values: readonly number[]): number[] {
  const out = new Array<number>(n).fill(0);
  seatIndices.forEach((seat, k) => {
    out[seat] = values[k] ?? 0;
  });
  return out;
}

export function resolveRound(
  core: SessionCore,
  open: OpenRound,
  reason: CloseReason,
): EventOf<"round-resolved"> {
  if (core.fronts) return resolveFrontsRound({ ...core, fronts: core.fronts }, open, reason);
  const { contest, efforts, spends, defaulted } = playedEfforts(core, open);
  const n = core.seats.length;
  const seats = open.seatIndices;
  const p = shares(contest, efforts);
  const expected = payoffs(contest, efforts);
  const responses = respond(contest, efforts);
  const solved = solve(contest).equilibrium;
  // JSON has no NaN: an unmeasurable gap is stored as null.
  const equilibrium = {
    ...solved,
    nashGap: Number.isFinite(solved.nashGap) ? solved.nashGap : null,
  };

  let winner: number | null = null;
  let drawSeed: number | null = null;
  let realised = expected;
  if (core.settings.outcome === "winner") {
    drawSeed = drawSeedFor(core.seed, open.round);
    const k = drawWinner(p, mulberry32(drawSeed));
    winner = seats[k]!;
    realised = contest.rivals.map((r, i) => (i === k ? r.value : 0) - r.cost * efforts[i]!);
  }

  const payoffsBySeat = perSeat(n, seats, realised);
  const totals = payoffsBySeat.map((u, i) => (core.totals[i] ?? 0) + u);
  const defaultedBySeat = new Array<boolean>(n).fill(false);
  seats.forEach((seat, k) => {
    defaultedBySeat[seat] = defaulted[k]!;
  });

  // Reasons are revealed with the round (R26); logs without any keep their old shape.
  const reasons = open.moves.map((m) => m?.reason ?? null);
  while (reasons.length < n) reasons.push(null);
  const moveReasons = reasons.some((r) => r !== null) ? { moveReasons: reasons } : {};

  const event: EventOf<"round-resolved"> = {
    type: "round-resolved",
    round: open.round,
    reason,
    efforts: perSeat(n, seats, efforts),
    spends: perSeat(n, seats, spends),
    defaulted: defaultedBySeat,
    shares: perSeat(n, seats, p),
    winner,
    drawSeed,
    payoffs: payoffsBySeat,
    expectedPayoffs: perSeat(n, seats, expected),
    totals,
    bestResponses: perSeat(n, seats, responses.bestResponses),
    regrets: perSeat(n, seats, responses.regrets),
    equilibrium,
    nashGap: responses.nashGap,
    dissipation: dissipation(contest, efforts),
    ...moveReasons,
  };
  if (core.settings.hidden) {
    const beliefs = beliefReplies(core, open.round, open.scenario, seats, spends);
    event.beliefReplySpends = perSeat(n, seats, beliefs);
  }
  return event;
}
