/**
 * Where a played spend falls in the round's mixed equilibrium: the chance that the seat's
 * equilibrium strategy spends less, the same, or more, in money. The one place every screen
 * (seat, console, big screen) gets it from. A mixed strategy is either finite points (ratio and
 * logit forms) or an atom at zero plus a continuous part on [low, high] whose conditional CDF
 * is ((x - low) / (high - low))^cdfExponent (the all-pay auction). Spend = cost x effort, so the
 * comparison is made in effort units and reported in money.
 */
import type { RoundResult } from "@contend/protocol";
import { EFFORT_TOLERANCE } from "./effort";

export interface SpendPlacement {
  /** what the seat spent (money) */
  spend: number;
  /** expected spend of its equilibrium strategy (money) */
  expectedSpend: number;
  /** least and largest spend the strategy plays (money) */
  lowSpend: number;
  highSpend: number;
  /** chance that the equilibrium strategy spends less than the seat did */
  probabilityLess: number;
  /** chance that it spends the same (an atom at the played spend, within the effort tolerance) */
  probabilitySame: number;
  /** chance that it spends more */
  probabilityMore: number;
}

type Strategy = NonNullable<RoundResult["equilibrium"]["strategies"]>[number];

/** P(effort < x), P(effort within tol of x) for one mixed strategy. */
function split(s: Strategy, x: number, tol: number): { less: number; same: number } {
  if (s.points && s.points.length > 0) {
    let less = 0;
    let same = 0;
    for (const p of s.points) {
      if (Math.abs(p.effort - x) <= tol) same += p.probability;
      else if (p.effort < x) less += p.probability;
    }
    return { less, same };
  }
  // P(effort <= e): the atom at zero, then the continuous part
  const cdf = (e: number): number => {
    if (e < 0) return 0;
    if (e < s.low) return s.atomAtZero;
    if (e >= s.high) return 1;
    const frac = (e - s.low) / (s.high - s.low);
    return s.atomAtZero + (1 - s.atomAtZero) * Math.pow(frac, s.cdfExponent ?? 1);
  };
  // the only atom is at zero; the continuous part gives any single spend chance 0
  return Math.abs(x) <= tol ? { less: 0, same: s.atomAtZero } : { less: cdf(x), same: 0 };
}

/** The seat's placement in a round whose equilibrium is mixed; null otherwise. */
export function spendPlacement(round: RoundResult, seat: number): SpendPlacement | null {
  if (round.equilibrium.kind !== "mixed") return null;
  const k = round.seatIndices.indexOf(seat);
  const s = k < 0 ? undefined : round.equilibrium.strategies?.[k];
  const cost = k < 0 ? undefined : round.scenario.rivals[k]?.cost;
  const effort = round.efforts[seat];
  if (!s || cost === undefined || effort === undefined) return null;
  const tol = EFFORT_TOLERANCE * Math.max(1, effort);
  const { less, same } = split(s, effort, tol);
  const clamp = (p: number) => Math.min(1, Math.max(0, p));
  const lowEffort = s.points?.length ? s.points[0]!.effort : s.atomAtZero > 0 ? 0 : s.low;
  return {
    spend: round.spends[seat] ?? cost * effort,
    expectedSpend: cost * s.mean,
    lowSpend: cost * lowEffort,
    highSpend: cost * (s.points?.length ? s.points[s.points.length - 1]!.effort : s.high),
    probabilityLess: clamp(less),
    probabilitySame: clamp(same),
    probabilityMore: clamp(1 - less - same),
  };
}

/**
 * One sentence for a person: "Spent $40; at equilibrium this rival spends $0 to $80 (expected
 * $31): less than $40 with chance 62%, more with chance 38%." Formatting of money and
 * percentages is the caller's (each screen has its own).
 */
export function placementText(
  p: SpendPlacement,
  money: (v: number) => string,
  percent: (v: number) => string,
  who = "this rival",
): string {
  const range =
    p.highSpend > p.lowSpend
      ? `${money(p.lowSpend)} to ${money(p.highSpend)}`
      : `exactly ${money(p.lowSpend)}`;
  const same = p.probabilitySame > 0 ? `, the same with chance ${percent(p.probabilitySame)}` : "";
  return `At equilibrium ${who} draws a spend from ${range} (expected ${money(p.expectedSpend)}): less than ${money(p.spend)} with chance ${percent(p.probabilityLess)}${same}, more with chance ${percent(p.probabilityMore)}.`;
}
