/**
 * Ranges the explorer's uncertainty panel adds to the scenario: one toggle per field (prize and
 * each rival's cost, value, weight, budget). The text the user typed is kept; the solver's
 * `validateUncertainScenario` is the only judge, and its error path names the field.
 */
import { validateUncertainScenario } from "@contend/solver";
import type { Scenario, UncertainScenario } from "@contend/solver";

export type RangeKind = "uniform" | "triangular";

export interface RangeText {
  on: boolean;
  dist: RangeKind;
  low: string;
  mode: string;
  high: string;
}

/** Keyed by the field's path: "prize", "rivals.1.cost", ... */
export type RangeForm = Record<string, RangeText>;

export const RANGE_RIVAL_FIELDS = ["cost", "value", "weight", "budget"] as const;
type RivalField = (typeof RANGE_RIVAL_FIELDS)[number];

const FIELD_LABEL: Record<RivalField, string> = {
  cost: "Cost per unit of effort",
  value: "Value of the prize",
  weight: "Weight (head start)",
  budget: "Budget (money)",
};

export interface RangeField {
  path: string;
  label: string;
  /** "money" fields show the currency; weights and costs are plain numbers */
  unit: "money" | "plain";
  /** the point value the scenario has now (null: no budget) */
  point: number | null;
}

export function rangeFields(s: Scenario): RangeField[] {
  const out: RangeField[] = [{ path: "prize", label: "Prize", unit: "money", point: s.prize }];
  s.rivals.forEach((r, i) => {
    for (const f of RANGE_RIVAL_FIELDS) {
      const point =
        f === "cost"
          ? r.cost
          : f === "value"
            ? (r.value ?? s.prize)
            : f === "weight"
              ? (r.weight ?? 1)
              : (r.budget ?? null);
      out.push({
        path: `rivals.${i}.${f}`,
        label: `${FIELD_LABEL[f]}, ${r.name}`,
        unit: f === "value" || f === "budget" ? "money" : "plain",
        point,
      });
    }
  });
  return out;
}

function short(x: number): string {
  return String(Number(x.toPrecision(4)));
}

/** A first range for a field: 20% either side of its value (a budget without one: 25%..100% of the prize). */
export function defaultRange(field: RangeField, prize: number): RangeText {
  const x = field.point;
  if (x === null) {
    return {
      on: true,
      dist: "uniform",
      low: short(prize / 4),
      mode: short(prize / 2),
      high: short(prize),
    };
  }
  return { on: true, dist: "uniform", low: short(x * 0.8), mode: short(x), high: short(x * 1.2) };
}

function numberOrText(t: string): number | string {
  const x = Number(t.trim());
  return t.trim() !== "" && Number.isFinite(x) ? x : t;
}

/** The typed range as the raw object the validators read (text that is no number stays text). */
export function rangeTextToRaw(r: RangeText): Record<string, unknown> {
  return r.dist === "uniform"
    ? { dist: "uniform", low: numberOrText(r.low), high: numberOrText(r.high) }
    : {
        dist: "triangular",
        low: numberOrText(r.low),
        mode: numberOrText(r.mode),
        high: numberOrText(r.high),
      };
}

export type BuiltUncertain =
  | { ok: true; scenario: UncertainScenario; count: number }
  | { ok: false; field: string; message: string };

/** The scenario with every switched-on range in place, checked by the solver's validator. */
export function buildUncertain(s: Scenario, ranges: RangeForm): BuiltUncertain {
  const raw = JSON.parse(JSON.stringify(s)) as Record<string, unknown> & {
    rivals: Record<string, unknown>[];
  };
  let count = 0;
  for (const field of rangeFields(s)) {
    const r = ranges[field.path];
    if (!r?.on) continue;
    count++;
    const dist = rangeTextToRaw(r);
    const parts = field.path.split(".");
    if (parts[0] === "prize") raw.prize = dist;
    else raw.rivals[Number(parts[1])]![parts[2]!] = dist;
  }
  const v = validateUncertainScenario(raw);
  if (v.ok) return { ok: true, scenario: v.value, count };
  const field = v.path
    .split(".")
    .slice(0, v.path.startsWith("rivals.") ? 3 : 1)
    .join(".");
  return { ok: false, field, message: `${v.path}: ${v.message}` };
}

/**
 * Ranges are stored by the rival row's stable key ("row-3.cost") so that removing a rival does
 * not move another's range onto it; the solver reads them by path ("rivals.1.cost").
 */
export function rangeKeyOf(path: string, rowKeys: readonly string[]): string {
  const m = /^rivals\.(\d+)\.(\w+)$/.exec(path);
  return m ? `${rowKeys[Number(m[1])] ?? "?"}.${m[2]}` : path;
}

export function rangesByPath(
  byKey: Record<string, RangeText>,
  rowKeys: readonly string[],
): RangeForm {
  const out: RangeForm = {};
  for (const [k, v] of Object.entries(byKey)) {
    if (k === "prize") {
      out.prize = v;
      continue;
    }
    const dot = k.lastIndexOf(".");
    const i = rowKeys.indexOf(k.slice(0, dot));
    if (i >= 0) out[`rivals.${i}.${k.slice(dot + 1)}`] = v;
  }
  return out;
}

/** A typed whole number from min to max, or null (draw counts and seeds). */
export function whole(text: string, min: number, max: number): number | null {
  const x = Number(text.trim());
  return text.trim() !== "" && Number.isInteger(x) && x >= min && x <= max ? x : null;
}
