/**
 * `contend solve` and `contend respond` for scenarios with fronts (several contests, one budget
 * per rival). JSON shapes: solve -> {equilibrium: {kind, allocations, spends, shares, payoffs,
 * budgetUsed, frontTotals, shadowPrices, nashGap, note?}, alternatives}; respond ->
 * {bestAllocations, regrets, payoffs, nashGap}. Rows are rivals, columns fronts, in file order.
 */
import { respondFronts } from "../fronts/bestAllocation";
import { solveFronts } from "../fronts/frontsEquilibrium";
import { readAllocation } from "../fronts/frontsReading";
import { normalizeFronts } from "../fronts/normalizeFronts";
import type { FrontsContest, FrontsEquilibrium, FrontsScenario } from "../fronts/types";
import { validateFrontsScenario } from "../fronts/validateFronts";
import type { InputError, Parsed } from "../types";
import { parseNumber, type ParsedArgs } from "./args";
import { CAUTIONS, fmt, money, pct, table } from "./format";

export function runFronts(command: string, input: unknown, args: ParsedArgs): Parsed<string> {
  const v = validateFrontsScenario(input);
  if (!v.ok) return v;
  const fc = normalizeFronts(v.value);
  const json = args.booleans.has("json");
  if (command === "solve") {
    const eq = solveFronts(fc).equilibrium;
    return {
      ok: true,
      value: json ? `${JSON.stringify(frontsSolveJson(eq))}\n` : solveText(v.value, fc, eq),
    };
  }
  if (command === "respond") {
    const eff = args.flags.get("allocations");
    const spends = args.flags.get("spends");
    if (args.flags.has("efforts")) {
      return fail(
        "--efforts",
        "this scenario has fronts: give --allocations (efforts) or --spends (money), one row per rival",
      );
    }
    if ((eff === undefined) === (spends === undefined)) {
      return fail(
        eff === undefined ? "--allocations" : "--spends",
        eff === undefined
          ? "is required for respond with fronts (or --spends)"
          : "give --allocations or --spends, not both",
      );
    }
    const alloc = parseAllocations(
      eff ?? spends!,
      fc,
      eff !== undefined ? "allocations" : "spends",
    );
    if (!alloc.ok) return alloc;
    const res = respondFronts(fc, alloc.value);
    if (json) {
      const { bestAllocations, regrets, payoffs, nashGap } = res;
      return {
        ok: true,
        value: `${JSON.stringify({ bestAllocations, regrets, payoffs, nashGap })}\n`,
      };
    }
    return { ok: true, value: respondText(v.value, fc, alloc.value, res) };
  }
  return fail(
    "fronts",
    `"${command}" is not available for scenarios with fronts yet (use solve or respond)`,
  );
}

function fail(path: string, message: string): InputError {
  return { ok: false, path, message };
}

/** The solve JSON of the fronts model, keys in a fixed order. */
export function frontsSolveJson(eq: FrontsEquilibrium): Record<string, unknown> {
  const e: Record<string, unknown> = {
    kind: eq.kind,
    allocations: eq.allocations,
    spends: eq.spends,
    shares: eq.shares,
    payoffs: eq.payoffs,
    budgetUsed: eq.budgetUsed,
    frontTotals: eq.frontTotals,
    shadowPrices: eq.shadowPrices,
    nashGap: Number.isFinite(eq.nashGap) ? eq.nashGap : null,
  };
  if (eq.note !== undefined) e.note = eq.note;
  return { equilibrium: e, alternatives: [] };
}

/**
 * "a1,a2;b1,b2" -> one row per rival (in file order), one number per front; "allocations" are
 * efforts, "spends" money (effort = spend / cost). Each >= 0, and each row within its budget.
 */
export function parseAllocations(
  text: string,
  fc: FrontsContest,
  unit: "allocations" | "spends",
): Parsed<number[][]> {
  const flag = `--${unit}`;
  const what = unit === "spends" ? "spends (money)" : "efforts";
  const rows = text.split(";");
  const n = fc.rivals.length;
  const K = fc.fronts.length;
  if (rows.length !== n) {
    return fail(
      flag,
      `expected ${n} rows separated by ";" (one per rival, in file order), got ${rows.length}`,
    );
  }
  const out: number[][] = [];
  for (let i = 0; i < n; i++) {
    const rv = fc.rivals[i]!;
    const parts = rows[i]!.split(",");
    if (parts.length !== K) {
      return fail(
        flag,
        `row ${i + 1} (${rv.name}) needs ${K} comma-separated ${what}, one per front, got ${parts.length}`,
      );
    }
    const row: number[] = [];
    let spend = 0;
    for (let k = 0; k < K; k++) {
      const x = parseNumber(parts[k]!);
      if (x === null)
        return fail(
          flag,
          `row ${i + 1} (${rv.name}), front ${k + 1}: not a finite number: "${parts[k]!.trim()}"`,
        );
      if (x < 0)
        return fail(flag, `row ${i + 1} (${rv.name}), front ${k + 1}: must be >= 0 (got ${x})`);
      const effort = unit === "spends" ? x / rv.cost[k]! : x;
      spend += effort * rv.cost[k]!;
      row.push(effort);
    }
    if (spend > rv.budget * (1 + 1e-12)) {
      return fail(
        flag,
        `row ${i + 1} (${rv.name}) spends ${spend} in total, more than its budget ${rv.budget}`,
      );
    }
    out.push(row);
  }
  return { ok: true, value: out };
}

function grid(
  fc: FrontsContest,
  cells: (i: number, k: number) => string,
  extra: { head: string[]; cells: (i: number) => string[] },
) {
  return table(
    ["Rival", ...fc.fronts.map((f) => f.name), ...extra.head],
    fc.rivals.map((rv, i) => [rv.name, ...fc.fronts.map((_, k) => cells(i, k)), ...extra.cells(i)]),
  );
}

function solveText(s: FrontsScenario, fc: FrontsContest, eq: FrontsEquilibrium): string {
  const cur = s.currency;
  const out = [
    s.title,
    `${fc.fronts.length} fronts fought at once (${fc.fronts.map((f) => `${f.name}: prize ${money(f.prize, cur)}`).join("; ")}); ${fc.rivals.length} rivals`,
    "",
  ];
  if (eq.kind === "none-pure") {
    out.push(
      "Equilibrium: no pure-strategy equilibrium found",
      `Note: ${eq.note ?? ""}`,
      "",
      CAUTIONS,
    );
    return `${out.join("\n")}\n`;
  }
  const sp = eq.spends!;
  const budgetText = (i: number) =>
    Number.isFinite(fc.rivals[i]!.budget) ? money(fc.rivals[i]!.budget, cur) : "none";
  const shadow = (i: number) => {
    const x = eq.shadowPrices![i];
    return x === null || x === undefined ? "-" : fmt(x);
  };
  out.push(
    `Equilibrium: pure (Nash gap ${money(eq.nashGap, cur)}; method: ${eq.method})`,
    "",
    `Spend by front (money${cur ? `, ${cur}` : ""})`,
    grid(fc, (i, k) => fmt(sp[i]![k]), {
      head: ["Total", "Budget", `Shadow price per ${cur ?? "unit"}`, "Payoff"],
      cells: (i) => [fmt(eq.budgetUsed![i]), budgetText(i), shadow(i), money(eq.payoffs![i], cur)],
    }),
    `Front totals: ${fc.fronts.map((f, k) => `${f.name} ${money(eq.frontTotals![k], cur)}`).join("; ")}`,
    "",
    "Share won on each front",
    grid(fc, (i, k) => pct(eq.shares![i]![k]), { head: [], cells: () => [] }),
    "",
    "Reading (against a split in proportion to what each front is worth to the rival)",
  );
  readAllocation(fc, sp).forEach((r, i) => {
    const names = (ks: number[]) => ks.map((k) => fc.fronts[k]!.name).join(", ") || "none";
    out.push(
      `  ${fc.rivals[i]!.name}: concentrates on ${names(r.concentrates)}; concedes ${names(r.concedes)}`,
    );
  });
  out.push(
    "",
    "Shadow price: what one more unit of budget would add to the rival's payoff (0 when the budget",
    "does not bind, - without a budget). Efforts are spend / cost on each front.",
  );
  if (eq.note) out.push(`Note: ${eq.note}`);
  out.push("", CAUTIONS);
  return `${out.join("\n")}\n`;
}

function respondText(
  s: FrontsScenario,
  fc: FrontsContest,
  alloc: number[][],
  res: ReturnType<typeof respondFronts>,
): string {
  const cur = s.currency;
  const spend = (i: number, k: number, x: number) => fmt(x * fc.rivals[i]!.cost[k]!);
  const out = [
    s.title,
    "Best replies to the given allocations (each rival alone re-splits its budget, the others held fixed)",
    "",
    "Given spend by front (money)",
    grid(fc, (i, k) => spend(i, k, alloc[i]![k]!), {
      head: ["Payoff"],
      cells: (i) => [money(res.payoffs[i], cur)],
    }),
    "",
    "Best reply: spend by front (money)",
    grid(fc, (i, k) => spend(i, k, res.bestAllocations[i]![k]!), {
      head: ["Regret"],
      cells: (i) => [money(res.regrets[i], cur)],
    }),
    "",
    `Nash gap (largest regret) ${money(res.nashGap, cur)}`,
    "",
    CAUTIONS,
  ];
  return `${out.join("\n")}\n`;
}
