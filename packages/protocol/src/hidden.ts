/**
 * Hidden information in a live session (docs/protocol.md R40-R44): the facilitator marks some
 * rivals' cost and value private and gives each a range. Seats see their own numbers exactly
 * and the others only as these ranges; the truth is drawn from the ranges at session start
 * (`truth: "draw"`, seeded) or is the scenario's own numbers (`truth: "scenario"`).
 * A range is checked by the solver's `validateDist`, the one rule for ranges.
 */
import { z } from "zod";
import { isDist, mean, POSITIVE, validateDist } from "@contend/solver";
import type { Dist, Scenario } from "@contend/solver";
import { LIMITS } from "./limits";

export const HIDDEN_FIELDS = ["cost", "value"] as const;
export type HiddenField = (typeof HIDDEN_FIELDS)[number];

const rangeSchema = z.custom<Dist>(
  (x) => typeof x === "object" && x !== null && !Array.isArray(x) && isDist(x),
  { error: 'must be a range: {"dist":"uniform","low":a,"high":b} or triangular with a mode' },
);

export const hiddenSettingsSchema = z.strictObject({
  /** "draw": the truth is drawn from the ranges when the session is created; "scenario": the
   * scenario's own numbers are the truth (each must lie in its range) */
  truth: z.enum(["draw", "scenario"]).default("draw"),
  /** rival name -> the private fields of that rival and their public ranges */
  rivals: z
    .record(
      z.string().min(1).max(LIMITS.nameMax),
      z.strictObject({ cost: rangeSchema.optional(), value: rangeSchema.optional() }),
    )
    .refine((r) => Object.keys(r).length >= 1, { error: "must name at least one rival" }),
});

export type HiddenSettings = z.output<typeof hiddenSettingsSchema>;

/** One private number: which seat, which field, and the range everyone else sees. */
export interface HiddenEntry {
  seatIndex: number;
  field: HiddenField;
  range: Dist;
}

/** The private numbers of a scenario, in seat order (rivals matched by name). */
export function hiddenEntries(
  rivals: readonly { name: string }[],
  hidden: HiddenSettings | undefined,
): HiddenEntry[] {
  if (!hidden) return [];
  const out: HiddenEntry[] = [];
  rivals.forEach((r, seatIndex) => {
    const spec = Object.hasOwn(hidden.rivals, r.name) ? hidden.rivals[r.name] : undefined;
    for (const field of HIDDEN_FIELDS) {
      const range = spec?.[field];
      if (range) out.push({ seatIndex, field, range });
    }
  });
  return out;
}

/** The number a rival's field holds in a scenario (a null value is the prize). */
export function fieldOf(scenario: Scenario, seatIndex: number, field: HiddenField): number {
  const r = scenario.rivals[seatIndex]!;
  return field === "cost" ? r.cost : (r.value ?? scenario.prize);
}

/**
 * The belief summary of a private number: the mean of its range (R42). The contest a seat sees
 * holds its own numbers exactly and this mean in place of every other private number.
 */
export function beliefContest(
  scenario: Scenario,
  entries: readonly HiddenEntry[],
  ownSeat: number | null,
): Scenario {
  const rivals = scenario.rivals.map((r) => ({ ...r }));
  for (const e of entries) {
    if (e.seatIndex === ownSeat || !rivals[e.seatIndex]) continue;
    rivals[e.seatIndex]![e.field] = mean(e.range);
  }
  return { ...scenario, rivals };
}

export interface HiddenIssue {
  path: (string | number)[];
  message: string;
}

/**
 * Every problem of `session.hidden` that needs only the rivals' names: a name that is no rival,
 * a range the solver's `validateDist` refuses (one problem per private field). For a form that
 * shows each field's own message.
 */
export function hiddenRangeIssues(
  rivalNames: readonly string[],
  hidden: HiddenSettings,
): HiddenIssue[] {
  const names = new Set(rivalNames);
  const out: HiddenIssue[] = [];
  for (const [name, spec] of Object.entries(hidden.rivals)) {
    const base = ["session", "hidden", "rivals", name];
    if (!names.has(name)) {
      out.push({
        path: base,
        message: `names no rival of this scenario (${JSON.stringify(name)})`,
      });
      continue;
    }
    for (const field of HIDDEN_FIELDS) {
      const raw = spec[field];
      if (!raw) continue;
      const checked = validateDist(raw as unknown as Record<string, unknown>, field, POSITIVE);
      if (!checked.ok) {
        out.push({ path: [...base, ...checked.path.split(".")], message: checked.message });
      }
    }
  }
  return out;
}

/** With `truth: "scenario"`, each true number must lie in its range (reported at the number). */
export function hiddenTruthIssues(scenario: Scenario, hidden: HiddenSettings): HiddenIssue[] {
  if (hidden.truth !== "scenario") return [];
  const out: HiddenIssue[] = [];
  for (const e of hiddenEntries(scenario.rivals, hidden)) {
    const x = fieldOf(scenario, e.seatIndex, e.field);
    if (x < e.range.low || x > e.range.high) {
      out.push({
        path: ["rivals", e.seatIndex, e.field],
        message: `the true ${e.field} ${x} lies outside its private range [${e.range.low}, ${e.range.high}] (session.hidden.truth is "scenario")`,
      });
    }
  }
  return out;
}

/** Cross-field rules of `session.hidden`; the first problem with its path, or null. */
export function hiddenIssue(scenario: Scenario, hidden: HiddenSettings): HiddenIssue | null {
  const names = scenario.rivals.map((r) => r.name);
  return hiddenRangeIssues(names, hidden)[0] ?? hiddenTruthIssues(scenario, hidden)[0] ?? null;
}
