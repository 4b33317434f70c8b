/**
 * Private numbers in the session editor (docs/protocol.md R40): per rival, its cost and its
 * value may be private, each with the range the other seats see. The truth is drawn from the
 * ranges when the session starts (seeded by the session) or is the number typed in the table.
 * Ranges are kept by the rival row's stable key, so renaming or removing a rival never moves a
 * range onto another. The rules are the protocol's `hiddenRangeIssues` and `hiddenTruthIssues`
 * (which use the solver's range validator); this module only collects their messages per field.
 */
import {
  HIDDEN_FIELDS,
  hiddenRangeIssues,
  hiddenSettingsSchema,
  hiddenTruthIssues,
} from "@contend/protocol";
import type { HiddenField, HiddenSettings } from "@contend/protocol";
import type { Scenario } from "@contend/solver";
import { rangeTextToRaw } from "./rangeForm";
import type { RangeForm, RangeText } from "./rangeForm";

/** Keyed by "<row key>.<field>": "row-3.cost". */
export type PrivateRanges = Record<string, RangeText>;
export type TruthChoice = HiddenSettings["truth"];

export const PRIVATE_FIELDS = HIDDEN_FIELDS;

interface Row {
  key: string;
  name: string;
}

export function privateKey(rowKey: string, field: HiddenField): string {
  return `${rowKey}.${field}`;
}

/** The switched-on private fields, in row order. */
export function privateOn(
  rows: readonly Row[],
  ranges: PrivateRanges,
): { index: number; row: Row; field: HiddenField; range: RangeText }[] {
  const out: { index: number; row: Row; field: HiddenField; range: RangeText }[] = [];
  rows.forEach((row, index) => {
    for (const field of PRIVATE_FIELDS) {
      const range = ranges[privateKey(row.key, field)];
      if (range?.on) out.push({ index, row, field, range });
    }
  });
  return out;
}

/**
 * The switched-on private ranges keyed by field path ("rivals.1.cost"), the form the explorer's
 * uncertainty panel reads from its link (`rg`): the facilitator can see the bands they imply.
 */
export function privateRangesByPath(rows: readonly Row[], ranges: PrivateRanges): RangeForm {
  return Object.fromEntries(
    privateOn(rows, ranges).map((e) => [`rivals.${e.index}.${e.field}`, e.range]),
  );
}

/** The raw `session.hidden` the form describes, or null when every number is public. */
export function hiddenRaw(
  rows: readonly Row[],
  ranges: PrivateRanges,
  truth: TruthChoice,
): Record<string, unknown> | null {
  const on = privateOn(rows, ranges);
  if (on.length === 0) return null;
  const rivals: Record<string, Record<string, unknown>> = {};
  for (const { row, field, range } of on) {
    const name = row.name.trim();
    rivals[name] = { ...rivals[name], [field]: rangeTextToRaw(range) };
  }
  return { truth, rivals };
}

/** A loaded file's `session.hidden` -> ranges keyed by the rows (matched by rival name). */
export function privateRangesOf(
  rows: readonly Row[],
  hidden: HiddenSettings | null | undefined,
): PrivateRanges {
  const out: PrivateRanges = {};
  if (!hidden) return out;
  for (const row of rows) {
    const spec = Object.hasOwn(hidden.rivals, row.name) ? hidden.rivals[row.name] : undefined;
    for (const field of PRIVATE_FIELDS) {
      const d = spec?.[field];
      if (!d) continue;
      out[privateKey(row.key, field)] = {
        on: true,
        dist: d.dist,
        low: String(d.low),
        mode: String(d.dist === "triangular" ? d.mode : (d.low + d.high) / 2),
        high: String(d.high),
      };
    }
  }
  return out;
}

/** The number a private range starts around: the field's own, else the prize (value) or 1. */
export function privatePoint(text: string, field: HiddenField, prize: number): number {
  const x = Number(text.trim());
  if (text.trim() !== "" && Number.isFinite(x) && x > 0) return x;
  return field === "value" && Number.isFinite(prize) && prize > 0 ? prize : 1;
}

/** Path prefix of a private field's problems, as the protocol reports them. */
export function privatePath(name: string, field: HiddenField): string {
  return `session.hidden.rivals.${name.trim()}.${field}`;
}

/**
 * Every problem of the private numbers, keyed by the validators' paths
 * ("session.hidden.rivals.Corner Ovens.cost.high", or "rivals.1.cost" for a true number outside
 * its range). `contest` is the validated contest, when it is valid.
 */
export function privateErrors(
  hidden: Record<string, unknown> | null,
  names: readonly string[],
  contest: Scenario | null,
): Record<string, string> {
  const errors: Record<string, string> = {};
  if (hidden === null) return errors;
  const parsed = hiddenSettingsSchema.safeParse(hidden);
  // Shape problems (an empty name) are reported by the settings schema at their own paths.
  if (!parsed.success) return errors;
  for (const issue of hiddenRangeIssues(names, parsed.data)) {
    errors[issue.path.join(".")] ??= issue.message;
  }
  if (contest !== null && Object.keys(errors).length === 0) {
    for (const issue of hiddenTruthIssues(contest, parsed.data)) {
      errors[issue.path.join(".")] ??= issue.message;
    }
  }
  return errors;
}

/** The first problem of one private field, for showing under its toggle. */
export function privateFieldError(
  errors: Record<string, string>,
  name: string,
  field: HiddenField,
): string | undefined {
  const prefix = privatePath(name, field);
  const hit = Object.keys(errors).find((k) => k === prefix || k.startsWith(`${prefix}.`));
  return hit === undefined ? undefined : errors[hit];
}
