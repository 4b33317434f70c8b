import { spendsOf } from "../normalize";
import { solve } from "../solve";
import type { Contest, Equilibrium, MixedStrategy, Scenario, SolveResult } from "../types";
import { CAUTIONS, fmt, money, pct, table } from "./format";

/**
 * Fixed key order so the JSON reads the same for every scenario. `spends` (money, cost x
 * effort) sit beside `efforts` (the model's units); `expectedSpends` beside `expectedEfforts`.
 */
export function equilibriumJson(contest: Contest, eq: Equilibrium): Record<string, unknown> {
  const spendOf = (e: number[]) => spendsOf(contest, e);
  const expected = eq.expectedEfforts
    ? { expectedEfforts: eq.expectedEfforts, expectedSpends: spendOf(eq.expectedEfforts) }
    : {};
  const known = eq.efforts ?? eq.expectedEfforts ?? null;
  const out: Record<string, unknown> = {
    kind: eq.kind,
    efforts: eq.efforts,
    spends: eq.efforts ? spendOf(eq.efforts) : null,
    ...expected,
    shares: eq.shares,
    payoffs: eq.payoffs,
    totalEffort: eq.totalEffort,
    totalSpend: known ? spendOf(known).reduce((a, b) => a + b, 0) : null,
    dissipation: eq.dissipation,
    active: eq.active,
    nashGap: eq.nashGap,
    method: eq.method,
  };
  if (eq.note !== undefined) out.note = eq.note;
  if (eq.strategies) out.strategies = eq.strategies;
  if (eq.approximate !== undefined) out.approximate = eq.approximate;
  if (eq.equivalents !== undefined) out.equivalents = eq.equivalents;
  return out;
}

export function solveJson(contest: Contest, result: SolveResult): string {
  return `${JSON.stringify({
    equilibrium: equilibriumJson(contest, result.equilibrium),
    alternatives: result.alternatives.map((eq) => equilibriumJson(contest, eq)),
  })}\n`;
}

export function describeCsf(s: Scenario): string {
  switch (s.csf.kind) {
    case "ratio":
      return `ratio form (Tullock), decisiveness r = ${fmt(s.csf.decisiveness)}`;
    case "logit":
      return `logit form (Hirshleifer), scale k = ${fmt(s.csf.scale)}`;
    case "allpay":
      return "all-pay auction (highest effort wins)";
  }
}

/** A mixed strategy in money: the effort range times the rival's cost. */
function strategyText(m: MixedStrategy | undefined, cost: number, cur?: string | null): string {
  if (!m) return "-";
  if (m.points) {
    // a finite mix: its heaviest points, in spend, with their probabilities
    const top = m.points
      .filter((p) => p.probability >= 0.005)
      .sort((a, b) => b.probability - a.probability)
      .slice(0, 4)
      .sort((a, b) => a.effort - b.effort);
    const shown = top.reduce((acc, p) => acc + p.probability, 0);
    const rest = shown < 0.995 ? `; others ${pct(1 - shown)}` : "";
    return `${top.map((p) => `${money(cost * p.effort, cur)} (${pct(p.probability)})`).join(", ")}${rest}`;
  }
  const range = `spend uniform on [${money(cost * m.low, cur)}, ${money(cost * m.high, cur)}]`;
  return m.atomAtZero > 0 ? `0 with prob. ${fmt(m.atomAtZero)}, else ${range}` : range;
}

function status(contest: Contest, eq: Equilibrium, i: number, efforts: number[] | null): string {
  const r = contest.rivals[i]!;
  const e = efforts?.[i];
  const parts: string[] = [];
  if (contest.leader === i) parts.push("leader");
  if (eq.kind === "none-pure") return parts.join(", ") || "-";
  if (e !== undefined && Number.isFinite(r.maxEffort) && e > 0 && e >= r.maxEffort * (1 - 1e-9)) {
    parts.push("at budget");
  } else parts.push(eq.active[i] ? "active" : "dropped out");
  return parts.join(", ");
}

function equilibriumBlock(s: Scenario, contest: Contest, eq: Equilibrium): string {
  const cur = s.currency;
  const mixed = eq.kind === "mixed";
  const efforts = eq.efforts ?? eq.expectedEfforts ?? null;
  const spends = efforts ? spendsOf(contest, efforts) : null;
  const header = [
    "Rival",
    mixed ? "Expected spend" : "Spend",
    mixed ? "Expected effort" : "Effort",
    mixed ? "Win prob." : "Share",
    mixed ? "Expected payoff" : "Payoff",
    "Status",
    ...(mixed ? ["Strategy"] : []),
  ];
  const rows = contest.rivals.map((r, i) => [
    r.name,
    money(spends?.[i], cur),
    fmt(efforts?.[i]),
    pct(eq.shares?.[i]),
    money(eq.payoffs?.[i], cur),
    status(contest, eq, i, efforts),
    ...(mixed ? [strategyText(eq.strategies?.[i], r.cost, cur)] : []),
  ]);
  const lines = [
    `Equilibrium: ${eq.kind === "none-pure" ? "no pure-strategy equilibrium" : eq.kind} (method: ${eq.method})`,
  ];
  if (efforts) {
    lines.push(
      table(header, rows),
      `Total spend ${money(
        spends!.reduce((a, b) => a + b, 0),
        cur,
      )}; dissipation ${pct(eq.dissipation)} of the prize; Nash gap ${fmt(eq.nashGap)}`,
    );
  }
  if (eq.note) lines.push(`Note: ${eq.note}`);
  return lines.join("\n");
}

export function solveText(s: Scenario, contest: Contest, result: SolveResult): string {
  const out: string[] = [
    s.title,
    `${describeCsf(s)}; prize ${money(s.prize, s.currency)}; ${contest.rivals.length} rival${contest.rivals.length === 1 ? "" : "s"}`,
  ];
  if (contest.leader !== null) {
    out.push(
      `Leader-follower game: ${contest.rivals[contest.leader]!.name} commits first, the others then best-respond.`,
    );
  }
  out.push(
    "Spend is money (cost x effort); effort = spend / cost is the model's unit; budgets cap spend.",
    "",
    equilibriumBlock(s, contest, result.equilibrium),
  );
  if (contest.leader !== null) {
    // Dixit 1987: commitment changes what a favourite spends; show the simultaneous game beside it.
    const sim = solve({ ...contest, leader: null }).equilibrium;
    const e = sim.efforts ?? sim.expectedEfforts;
    const list = e
      ? contest.rivals
          .map((r, i) => `${r.name} spends ${money(r.cost * e[i]!, s.currency)}`)
          .join(", ")
      : "no pure-strategy equilibrium";
    out.push(`Without commitment (simultaneous game): ${list}.`);
  }
  result.alternatives.forEach((alt, k) => {
    out.push(
      "",
      `Alternative ${k + 1} of ${result.alternatives.length}`,
      equilibriumBlock(s, contest, alt),
    );
  });
  out.push("", CAUTIONS);
  return `${out.join("\n")}\n`;
}

/** The output, or why the contest's numbers are beyond what the solver computes reliably. */
export function runSolve(
  s: Scenario,
  contest: Contest,
  json: boolean,
): { ok: true; value: string } | { ok: false; outOfRange: string } {
  const result = solve(contest);
  const why = result.equilibrium.outOfRange;
  if (why !== undefined) return { ok: false, outOfRange: why };
  return { ok: true, value: json ? solveJson(contest, result) : solveText(s, contest, result) };
}
