import { respond } from "../bestResponse";
import { spendsOf } from "../normalize";
import { responsesRangeProblem } from "../reliability";
import type { Contest, InputError, Parsed, Responses, Scenario } from "../types";
import { parseNumber } from "./args";
import { CAUTIONS, money, table } from "./format";

/**
 * "10,20,30" -> one effort per rival, each finite, >= 0 and within the rival's budget
 * (cost x effort <= budget, money). With unit "spends" the numbers are money and each becomes
 * effort = spend / cost.
 */
export function parseMoves(
  text: string,
  contest: Contest,
  unit: "spends" | "efforts",
): Parsed<number[]> {
  const flag = `--${unit}`;
  const what = unit === "spends" ? "spend" : "effort";
  const fail = (message: string): InputError => ({ ok: false, path: flag, message });
  const parts = text.split(",");
  const n = contest.rivals.length;
  if (parts.length !== n) {
    return fail(
      `expected ${n} comma-separated ${unit} (one per rival, in file order), got ${parts.length}`,
    );
  }
  const out: number[] = [];
  for (let i = 0; i < n; i++) {
    const x = parseNumber(parts[i]!);
    const r = contest.rivals[i]!;
    if (x === null)
      return fail(`${what} ${i + 1} (${r.name}) is not a finite number: "${parts[i]!.trim()}"`);
    if (x < 0) return fail(`${what} ${i + 1} (${r.name}) must be >= 0 (got ${x})`);
    const spend = unit === "spends" ? x : r.cost * x;
    const effort = unit === "spends" ? x / r.cost : x;
    if (effort > r.maxEffort)
      return fail(
        unit === "spends"
          ? `spend ${i + 1} (${r.name}) is more than its budget ${r.maxSpend} (got ${x})`
          : `effort ${i + 1} (${r.name}) costs ${spend}, more than its budget ${r.maxSpend} (cost ${r.cost} x effort ${x})`,
      );
    out.push(effort);
  }
  return { ok: true, value: out };
}

export function runRespond(
  s: Scenario,
  contest: Contest,
  efforts: number[],
  json: boolean,
): { ok: true; value: string } | { ok: false; outOfRange: string } {
  const res = respond(contest, efforts);
  const why = responsesRangeProblem(res);
  if (why !== null) return { ok: false, outOfRange: why };
  return { ok: true, value: respondOutput(s, contest, efforts, res, json) };
}

function respondOutput(
  s: Scenario,
  contest: Contest,
  efforts: number[],
  res: Responses,
  json: boolean,
): string {
  if (json) {
    return `${JSON.stringify({
      efforts,
      spends: spendsOf(contest, efforts),
      bestResponses: res.bestResponses,
      bestResponseSpends: spendsOf(contest, res.bestResponses),
      regrets: res.regrets,
      payoffs: res.payoffs,
      nashGap: res.nashGap,
    })}\n`;
  }
  const cur = s.currency;
  const rows = contest.rivals.map((r, i) => [
    r.name,
    money(r.cost * efforts[i]!, cur),
    money(res.payoffs[i], cur),
    money(r.cost * res.bestResponses[i]!, cur),
    money(res.regrets[i], cur),
  ]);
  const total = efforts.reduce((a, b) => a + b, 0);
  const lines = [
    s.title,
    "Best replies to the given spends (each rival alone re-optimises, the others held fixed)",
    "",
    table(["Rival", "Spend", "Payoff", "Best reply (spend)", "Regret"], rows),
    "",
    `Nash gap (largest regret) ${money(res.nashGap, cur)}${res.nashGap <= 1e-6 * s.prize ? ": this profile is an equilibrium" : ""}`,
  ];
  if (contest.csf.kind === "ratio" && efforts.some((e) => total - e === 0)) {
    lines.push(
      "Note: where all the others spend nothing, any positive spend wins everything; the best reply shown is the smallest step.",
    );
  }
  lines.push("", CAUTIONS);
  return `${lines.join("\n")}\n`;
}
