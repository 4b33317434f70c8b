import { z } from "zod";
import { LIMITS } from "./limits";
import { positiveNumberSchema } from "./numbers";
import { policySpecSchema } from "./policy";
import { HIDDEN_FIELDS, hiddenSettingsSchema } from "./hidden";

/** The `session` object of a session scenario; every field has a default. */
export const sessionSettingsSchema = z.strictObject({
  /** "shares": the prize is split by winning probability; "winner": one winner is drawn */
  outcome: z.enum(["shares", "winner"]).default("shares"),
  /** spends (money) must be multiples of this (within 1e-9); absent: see spendStepOf */
  spendStep: positiveNumberSchema.optional(),
  /**
   * the name spendStep had while seats sealed efforts; still accepted (old files and event logs)
   * and read as the spend step when spendStep is absent
   */
  effortStep: positiveNumberSchema.optional(),
  rounds: z
    .int({ error: "must be an integer" })
    .min(1, { error: "must be >= 1" })
    .max(LIMITS.roundsMax, { error: `must be <= ${LIMITS.roundsMax}` })
    .default(5),
  /** default round clock; null = rounds stay open until the facilitator closes them */
  clockSeconds: z
    .number({ error: "must be null or a number of seconds" })
    .min(LIMITS.clockMinSeconds, { error: `must be >= ${LIMITS.clockMinSeconds}` })
    .max(LIMITS.clockMaxSeconds, { error: `must be <= ${LIMITS.clockMaxSeconds}` })
    .nullable()
    .default(null),
  /** what a seat that did not seal in time plays: zero, or its previous round's spend */
  missingMove: z.enum(["zero", "repeat"]).default("zero"),
  /** rival name -> policy for seats played by the computer */
  computer: z
    .record(z.string().min(1).max(LIMITS.nameMax), policySpecSchema)
    .refine((r) => Object.keys(r).length <= LIMITS.seatsMax, {
      error: `must name at most ${LIMITS.seatsMax} rivals`,
    })
    .default({}),
  /** private costs and values with their public ranges (R40); absent: every number is public */
  hidden: hiddenSettingsSchema.optional(),
});

export type SessionSettings = z.output<typeof sessionSettingsSchema>;
export type SessionSettingsInput = z.input<typeof sessionSettingsSchema>;

/**
 * The money grid of a session's moves: spendStep, else the legacy effortStep (same number, now
 * read as money, so files written with cost 1 keep their meaning), else 1.
 */
export function spendStepOf(settings: Pick<SessionSettings, "spendStep" | "effortStep">): number {
  return settings.spendStep ?? settings.effortStep ?? 1;
}

/** The keys an object at `path` inside `session` may have (for "unknown field" messages). */
function allowedKeys(path: readonly PropertyKey[]): readonly string[] {
  if (path.length === 0) return Object.keys(sessionSettingsSchema.shape);
  if (path[0] === "hidden") return path.length === 1 ? ["truth", "rivals"] : HIDDEN_FIELDS;
  return [];
}

/** The `session` object through zod, its issues re-pathed under `session` (null: refused). */
export function parseSettings(rawSession: unknown, ctx: z.RefinementCtx): SessionSettings | null {
  const settings = sessionSettingsSchema.safeParse(rawSession ?? {});
  if (!settings.success) {
    for (const issue of settings.error.issues) {
      const unknown = issue.code === "unrecognized_keys" ? issue.keys : [];
      ctx.addIssue({
        code: "custom",
        message:
          unknown.length > 0
            ? `unknown field ${JSON.stringify(unknown[0])}; allowed: ${allowedKeys(issue.path).join(", ")}`
            : issue.message,
        path: ["session", ...issue.path, ...unknown.slice(0, 1)],
      });
    }
    return null;
  }
  return settings.data;
}
