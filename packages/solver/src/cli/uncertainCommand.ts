/** `contend uncertain FILE --draws N --seed S [--plan RIVAL] [--json]`: Monte Carlo under ranges. */
import type { Parsed } from "../types";
import {
  MAX_DRAWS,
  runUncertain,
  type Band,
  type RobustPlan,
  type UncertainResult,
  type UncertainScenario,
} from "../uncertain";
import { parseNumber, type ParsedArgs } from "./args";
import { CAUTIONS, fmt, money, pct, table } from "./format";

export const UNCERTAIN_DEFAULTS = { draws: 10_000, seed: 1 } as const;

function wholeFlag(args: ParsedArgs, flag: string, min: number, max: number, dflt: number) {
  const raw = args.flags.get(flag);
  if (raw === undefined) return { ok: true as const, value: dflt };
  const x = parseNumber(raw);
  if (x === null || !Number.isInteger(x) || x < min || x > max) {
    return {
      ok: false as const,
      path: `--${flag}`,
      message: `must be a whole number from ${min} to ${max} (got "${raw}")`,
    };
  }
  return { ok: true as const, value: x };
}

function planRival(s: UncertainScenario, raw: string | undefined): Parsed<number | null> {
  if (raw === undefined) return { ok: true, value: null };
  const i = s.rivals.findIndex((r) => r.name === raw);
  if (i >= 0) return { ok: true, value: i };
  const names = s.rivals.map((r) => JSON.stringify(r.name)).join(", ");
  return { ok: false, path: "--plan", message: `no rival named "${raw}" (rivals: ${names})` };
}

function bandJson(b: Band) {
  return { mean: b.mean, p10: b.p10, p50: b.p50, p90: b.p90 };
}

function planJson(p: RobustPlan) {
  return {
    rival: p.rival,
    spend: p.spend,
    expectedPayoff: p.expectedPayoff,
    p10Payoff: p.p10Payoff,
    meanRegret: p.meanRegret,
    equilibriumSpendAtMedians: p.equilibriumSpendAtMedians,
    p50Payoff: p.p50Payoff,
    p90Payoff: p.p90Payoff,
    p90Regret: p.p90Regret,
    drawsUsed: p.drawsUsed,
    atMedianEquilibrium: p.atMedianEquilibrium,
  };
}

/** Fixed key order: the fields first, extras after. */
export function uncertainJson(r: UncertainResult): string {
  return `${JSON.stringify({
    draws: r.draws,
    seed: r.seed,
    noPureEquilibrium: r.noPureEquilibrium,
    efforts: bandJson(r.efforts),
    spends: bandJson(r.spends),
    shares: bandJson(r.shares),
    payoffs: bandJson(r.payoffs),
    activeProbability: r.activeProbability,
    sensitivity: r.sensitivity,
    plan: r.plan && planJson(r.plan),
    pureDraws: r.pureDraws,
    parameters: r.parameters,
  })}\n`;
}

function range3(b: Band, i: number, f: (x: number | null) => string): string {
  return `${f(b.p10[i] ?? null)} / ${f(b.p50[i] ?? null)} / ${f(b.p90[i] ?? null)}`;
}

export function uncertainText(s: UncertainScenario, r: UncertainResult): string {
  const cur = s.currency;
  const m = (x: number | null) => money(x, cur);
  const lines: string[] = [
    `${s.title}: ${fmt(r.draws)} draws (seed ${r.seed}) over ${r.parameters.length} uncertain parameter${r.parameters.length === 1 ? "" : "s"}`,
    `Draws without a pure-strategy equilibrium: ${pct(r.noPureEquilibrium)} (left out of the bands below; ${fmt(r.pureDraws)} draws used).`,
    "",
    "Per rival, P10 / P50 / P90 (spend and payoff in money):",
    table(
      ["Rival", "Spend", "Share", "Payoff", "Active"],
      s.rivals.map((rv, i) => [
        rv.name,
        range3(r.spends, i, m),
        range3(r.shares, i, pct),
        range3(r.payoffs, i, m),
        pct(r.activeProbability[i]),
      ]),
    ),
  ];
  if (r.sensitivity.length > 0) {
    lines.push(
      "",
      "Tornado: equilibrium payoff at the parameter's P90 minus at its P10, others at medians:",
      table(
        ["Parameter (P10 .. P90)", ...s.rivals.map((rv) => rv.name)],
        r.sensitivity.map((t) => [
          `${t.parameter} (${fmt(t.low)} .. ${fmt(t.high)})`,
          ...t.payoffSwing.map((x) => (x === null ? "no pure eq." : m(x))),
        ]),
      ),
    );
  }
  const p = r.plan;
  if (p) {
    lines.push("", `Robust plan for ${p.rival} (over ${fmt(p.drawsUsed)} draws):`);
    lines.push(
      `  spend ${m(p.spend)}: expected payoff ${m(p.expectedPayoff)}, P10 ${m(p.p10Payoff)}, mean regret ${m(p.meanRegret)}`,
    );
    const a = p.atMedianEquilibrium;
    if (a && p.equilibriumSpendAtMedians !== null) {
      lines.push(
        `  equilibrium spend of the median scenario ${m(p.equilibriumSpendAtMedians)}: expected payoff ${m(a.expectedPayoff)}, P10 ${m(a.p10Payoff)}, mean regret ${m(a.meanRegret)}`,
        `  the plan spends ${m(Math.abs(p.spend - p.equilibriumSpendAtMedians))} ${p.spend >= p.equilibriumSpendAtMedians ? "more" : "less"} and earns ${m(p.expectedPayoff - a.expectedPayoff)} more on average`,
      );
    } else lines.push("  the median scenario has no pure-strategy equilibrium to compare with");
  }
  lines.push("", CAUTIONS);
  return `${lines.join("\n")}\n`;
}

export function runUncertainCommand(
  s: UncertainScenario,
  args: ParsedArgs,
  json: boolean,
): Parsed<string> {
  const draws = wholeFlag(args, "draws", 1, MAX_DRAWS, UNCERTAIN_DEFAULTS.draws);
  if (!draws.ok) return draws;
  const seed = wholeFlag(args, "seed", 0, 2 ** 32 - 1, UNCERTAIN_DEFAULTS.seed);
  if (!seed.ok) return seed;
  const plan = planRival(s, args.flags.get("plan"));
  if (!plan.ok) return plan;
  const res = runUncertain(s, { draws: draws.value, seed: seed.value, planRival: plan.value });
  return { ok: true, value: json ? uncertainJson(res) : uncertainText(s, res) };
}
