/**
 * Private numbers in a live session (docs/protocol.md R40-R44), computed once and stored in the
 * log: the truth drawn at creation, each seat's belief best reply per round, each seat's robust
 * plan at the end. Replays read these numbers; they never recompute them.
 */
import {
  mean,
  mulberry32,
  normalize,
  planDraw,
  quantile,
  robustSpend,
  runUncertain,
} from "@contend/solver";
import type {
  Dist,
  PlanDraw,
  Scenario,
  UncertainRivalSpec,
  UncertainScenario,
} from "@contend/solver";
import { hiddenEntries } from "@contend/protocol";
import type { HiddenEntry, RobustPlanRecord, SessionScenario } from "@contend/protocol";
import { activeContest } from "./state";
import type { SessionCore } from "./state";
import { beliefSeed, planSeed, truthSeed } from "./seeds";

/** Draws behind a belief best reply (R43) and a robust plan (R44). */
export const BELIEF_DRAWS = 256;
export const PLAN_DRAWS = 400;

/** Four significant figures, kept inside the range. */
function tidy(x: number, d: Dist): number {
  const y = Number(x.toPrecision(4));
  return Math.min(d.high, Math.max(d.low, y));
}

/** R40: with `truth: "draw"`, each private number is drawn from its range with the session seed. */
export function drawTruth(scenario: SessionScenario, seed: number): SessionScenario {
  const hidden = scenario.session.hidden;
  if (!hidden || hidden.truth !== "draw") return scenario;
  const rng = mulberry32(truthSeed(seed));
  const rivals = scenario.rivals.map((r) => ({ ...r }));
  for (const e of hiddenEntries(scenario.rivals, hidden)) {
    rivals[e.seatIndex]![e.field] = tidy(quantile(e.range, rng()), e.range);
  }
  return { ...scenario, rivals };
}

export function entriesOf(core: SessionCore): HiddenEntry[] {
  return hiddenEntries(core.scenario.rivals, core.settings.hidden);
}

/** The round's contest with the private numbers of every seat but `own` replaced by `pick`. */
function withOthers(
  scenario: Scenario,
  seatIndices: readonly number[],
  entries: readonly HiddenEntry[],
  own: number,
  pick: (e: HiddenEntry) => number,
): Scenario {
  const rivals = scenario.rivals.map((r) => ({ ...r }));
  for (const e of entries) {
    const k = seatIndices.indexOf(e.seatIndex);
    if (k < 0 || e.seatIndex === own) continue;
    rivals[k]![e.field] = pick(e);
  }
  return { ...scenario, rivals };
}

/** R41/R42: the round's contest as `own` believes it (others' private numbers at their means). */
export function roundBeliefs(
  core: SessionCore,
  scenario: Scenario,
  seatIndices: readonly number[],
  own: number,
): Scenario {
  return withOthers(scenario, seatIndices, entriesOf(core), own, (e) => mean(e.range));
}

/**
 * R43: each playing seat's best reply (money) to the others' actual spends when each private
 * number of another seat is uncertain over its range: the spend maximising the average payoff
 * over BELIEF_DRAWS seeded draws (the solver's robust-plan search). Another seat's effort in a
 * draw is its actual spend over its drawn cost. Indexed by round position.
 */
export function beliefReplies(
  core: SessionCore,
  round: number,
  scenario: Scenario,
  seatIndices: readonly number[],
  spends: readonly number[],
): number[] {
  const entries = entriesOf(core);
  return seatIndices.map((seat, k) => {
    const uncertain = entries.some(
      (e) => e.seatIndex !== seat && seatIndices.includes(e.seatIndex),
    );
    const rng = mulberry32(beliefSeed(core.seed, round, seat));
    const draws: PlanDraw[] = [];
    for (let d = 0; d < (uncertain ? BELIEF_DRAWS : 1); d++) {
      const contest = normalize(
        withOthers(scenario, seatIndices, entries, seat, (e) => quantile(e.range, rng())),
      );
      const efforts = spends.map((s, j) => s / contest.rivals[j]!.cost);
      draws.push(planDraw(contest, k, efforts));
    }
    return robustSpend(draws, k);
  });
}

/**
 * R44: each active seat's robust plan at the end: the solver's `runUncertain` on the final
 * contest with the seat's own numbers exact and every other private number its range.
 */
export function robustPlans(core: SessionCore): RobustPlanRecord[] {
  const entries = entriesOf(core);
  const { scenario, seatIndices } = activeContest(core);
  const out: RobustPlanRecord[] = [];
  seatIndices.forEach((seat, k) => {
    const rivals: UncertainRivalSpec[] = scenario.rivals.map((r) => ({ ...r }));
    for (const e of entries) {
      const j = seatIndices.indexOf(e.seatIndex);
      if (j >= 0 && e.seatIndex !== seat) rivals[j]![e.field] = e.range;
    }
    const uncertain: UncertainScenario = { ...scenario, rivals };
    const seed = planSeed(core.seed, seat);
    const plan = runUncertain(uncertain, { draws: PLAN_DRAWS, seed, planRival: k }).plan;
    if (!plan) return;
    out.push({
      seatIndex: seat,
      spend: plan.spend,
      expectedPayoff: plan.expectedPayoff,
      p10Payoff: plan.p10Payoff,
      meanRegret: plan.meanRegret,
      equilibriumSpendAtMedians: plan.equilibriumSpendAtMedians,
      draws: plan.drawsUsed,
      seed,
    });
  });
  return out;
}
