import { z } from "zod";
import { LIMITS } from "./limits";
import { positiveNumberSchema } from "./numbers";
import { policySpecSchema } from "./policy";

/** The `session` object of a session scenario; every field has a default. */
export const sessionSettingsSchema = z.strictObject({
  /** "shares": the prize is split by winning probability; "winner": one winner is drawn */
  outcome: z.enum(["shares", "winner"]).default("shares"),
  /** efforts must be multiples of this (within 1e-9) */
  effortStep: positiveNumberSchema.default(1),
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
  /** what a seat that did not seal in time plays: zero, or its previous round's effort */
  missingMove: z.enum(["zero", "repeat"]).default("zero"),
  /** rival name -> policy for seats played by the computer */
  computer: z
    .record(z.string().min(1).max(LIMITS.nameMax), policySpecSchema)
    .refine((r) => Object.keys(r).length <= LIMITS.seatsMax, {
      error: `must name at most ${LIMITS.seatsMax} rivals`,
    })
    .default({}),
});

export type SessionSettings = z.output<typeof sessionSettingsSchema>;
export type SessionSettingsInput = z.input<typeof sessionSettingsSchema>;
