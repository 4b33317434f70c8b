/**
 * Solving in scaled units. Dividing every value, budget and the prize by P divides every
 * equilibrium effort by P and every payoff by P, and leaves shares and dissipation unchanged,
 * provided the success function is homogeneous in efforts: the ratio form with one common r
 * (w (e/P)^r ratios equal w e^r ratios) and the logit form with its scale multiplied by P
 * (k e = (k P)(e / P)). Products such as w e^r that overflow or underflow at extreme prizes
 * then stay near 1. Common practice, no source.
 */
import type { Contest, Equilibrium, SolveResult } from "./types";

/** Prizes outside [1 / LIMIT, LIMIT] are solved in units of the prize. */
const LIMIT = 1e50;

/** The contest in units of its prize, or null when not needed or not homogeneous. */
export function scaledContest(contest: Contest): Contest | null {
  const P = contest.prize;
  if (!(P > 0) || (P >= 1 / LIMIT && P <= LIMIT)) return null;
  const csf = contest.csf;
  if (csf.kind === "ratio" && contest.rivals.some((x) => x.r !== contest.rivals[0]!.r)) return null;
  const scaled: Contest = {
    ...contest,
    prize: 1,
    csf: csf.kind === "logit" ? { kind: "logit", scale: csf.scale * P } : csf,
    rivals: contest.rivals.map((x) => ({
      ...x,
      value: x.value / P,
      maxSpend: x.maxSpend / P,
      maxEffort: x.maxEffort / P,
    })),
  };
  const ok =
    Number.isFinite(scaled.csf.kind === "logit" ? scaled.csf.scale : 1) &&
    scaled.rivals.every((x) => x.value > 0 && Number.isFinite(x.value));
  return ok ? scaled : null;
}

function unscaleEquilibrium(eq: Equilibrium, P: number): Equilibrium {
  const times = (xs: number[] | null) => (xs ? xs.map((x) => x * P) : xs);
  const out: Equilibrium = {
    ...eq,
    efforts: times(eq.efforts),
    payoffs: times(eq.payoffs),
    totalEffort: eq.totalEffort * P,
    nashGap: eq.nashGap * P,
  };
  if (eq.expectedEfforts) out.expectedEfforts = eq.expectedEfforts.map((x) => x * P);
  if (eq.strategies) {
    out.strategies = eq.strategies.map((s) => ({
      ...s,
      low: s.low * P,
      high: s.high * P,
      mean: s.mean * P,
      ...(s.points ? { points: s.points.map((p) => ({ ...p, effort: p.effort * P })) } : {}),
    }));
  }
  return out;
}

/** A result computed on scaledContest(contest), back in the contest's own units. */
export function unscaleResult(result: SolveResult, prize: number): SolveResult {
  return {
    equilibrium: unscaleEquilibrium(result.equilibrium, prize),
    alternatives: result.alternatives.map((eq) => unscaleEquilibrium(eq, prize)),
  };
}
