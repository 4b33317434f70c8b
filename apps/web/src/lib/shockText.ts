/**
 * Shocks in plain words for every role: what changed, from what to what, with units (money for
 * prize, worth, cost and budget). One wording for the banner, the debrief list and exports
 * shown on screen.
 */
import type { RoleView, RoundResult, ShockRecord } from "@contend/protocol";
import type { CsfSpec, RivalSpec, Scenario } from "@contend/solver";
import { formatMoney, formatPlain } from "./format";

export interface ShockLine {
  what: string;
  from: string;
  to: string;
}

const DASH = "\u2013";

function csfText(csf: CsfSpec): string {
  if (csf.kind === "ratio") return `ratio form, r = ${formatPlain(csf.decisiveness)}`;
  if (csf.kind === "logit") return `logit form, k = ${formatPlain(csf.scale)}`;
  return "all-pay";
}

type Field = "cost" | "value" | "weight" | "budget" | "decisiveness";

function fieldLabel(field: Field): string {
  switch (field) {
    case "cost":
      return "cost per unit of effort";
    case "value":
      return "worth of the prize";
    case "weight":
      return "head start";
    case "budget":
      return "budget";
    case "decisiveness":
      return "own decisiveness r";
  }
}

function fieldValue(s: Scenario, r: RivalSpec | undefined, field: Field, cur: string | null) {
  if (!r) return DASH;
  const money = (v: number) => formatMoney(v, cur);
  switch (field) {
    case "cost":
      return money(r.cost);
    case "value":
      return money(r.value ?? s.prize);
    case "weight":
      return `× ${formatPlain(r.weight ?? 1)}`;
    case "budget":
      return r.budget === null || r.budget === undefined ? "no cap" : money(r.budget);
    case "decisiveness":
      return formatPlain(
        r.decisiveness ?? (s.csf.kind === "ratio" ? s.csf.decisiveness : Number.NaN),
      );
  }
}

/** Rival fields that differ between two versions of the same rival. */
const FIELDS: Field[] = ["cost", "value", "weight", "budget", "decisiveness"];

/** Every difference between two contests whose rivals are matched by name. */
export function contestChanges(before: Scenario, after: Scenario, cur: string | null): ShockLine[] {
  const money = (v: number) => formatMoney(v, cur);
  const out: ShockLine[] = [];
  if (before.prize !== after.prize) {
    out.push({ what: "Prize", from: money(before.prize), to: money(after.prize) });
  }
  if (JSON.stringify(before.csf) !== JSON.stringify(after.csf)) {
    out.push({ what: "Contest form", from: csfText(before.csf), to: csfText(after.csf) });
  }
  const names = new Set([...before.rivals, ...after.rivals].map((r) => r.name));
  for (const name of names) {
    const b = before.rivals.find((r) => r.name === name);
    const a = after.rivals.find((r) => r.name === name);
    if (!b) {
      out.push({ what: name, from: "not in the contest", to: "joins the contest" });
      continue;
    }
    if (!a) {
      out.push({ what: name, from: "in the contest", to: "retired" });
      continue;
    }
    for (const f of FIELDS) {
      // a worth that follows the prize changes with it: the prize line says so already
      if (f === "value" && (b.value ?? null) === null && (a.value ?? null) === null) continue;
      const from = fieldValue(before, b, f, cur);
      const to = fieldValue(after, a, f, cur);
      if (from !== to) out.push({ what: `${name}: ${fieldLabel(f)}`, from, to });
    }
  }
  return out;
}

/** One recorded shock, line by line. A retired rival stays in `after`, so retirements come from the changes. */
export function shockLines(record: ShockRecord, cur: string | null): ShockLine[] {
  const lines = contestChanges(record.before, record.after, cur);
  for (const c of record.changes) {
    if (c.target !== "retire-rival") continue;
    const name = record.before.rivals[c.index]?.name ?? `Seat ${c.index + 1}`;
    lines.push({ what: name, from: "in the contest", to: "retired" });
  }
  return lines;
}

/** Shocks applied since the last reveal: they apply to the coming (or open) round. */
export function currentShocks(view: RoleView): ShockRecord[] {
  return view.shocks.filter((s) => s.afterRound === view.rounds.length);
}

/** The round a shock first applies to. */
export function roundOfShock(record: ShockRecord): number {
  return record.afterRound + 1;
}

/**
 * Changes between consecutive played rounds, read from the rounds' own contests (so a replay,
 * the big screen or a printed debrief can list them from the rounds alone).
 */
export function changesBetweenRounds(
  rounds: readonly RoundResult[],
  cur: string | null,
): { round: number; lines: ShockLine[] }[] {
  const out: { round: number; lines: ShockLine[] }[] = [];
  for (let k = 1; k < rounds.length; k++) {
    const lines = contestChanges(rounds[k - 1]!.scenario, rounds[k]!.scenario, cur);
    if (lines.length > 0) out.push({ round: rounds[k]!.round, lines });
  }
  return out;
}

/** "Prize: €k1,000 → €k1,500" */
export function shockLineText(l: ShockLine): string {
  return `${l.what}: ${l.from} \u2192 ${l.to}`;
}
