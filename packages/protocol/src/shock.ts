/**
 * A shock changes the contest between rounds. Field values are checked here for type and
 * size only; the engine re-validates the whole scenario after applying them, so range rules
 * (cost > 0, decisiveness <= 20, ...) live in one place.
 */
import { z } from "zod";
import { csfSpecSchema, rivalSpecSchema } from "./contest";
import { LIMITS } from "./limits";
import { positiveNumberSchema, seatIndexSchema } from "./numbers";
import { policySpecSchema } from "./policy";

export const RIVAL_SHOCK_FIELDS = ["cost", "value", "weight", "budget", "decisiveness"] as const;
export type RivalShockField = (typeof RIVAL_SHOCK_FIELDS)[number];

export const shockSchema = z.discriminatedUnion("target", [
  z.strictObject({
    target: z.literal("rival"),
    index: seatIndexSchema,
    field: z.enum(RIVAL_SHOCK_FIELDS),
    /** null resets an optional field to its default (not allowed for cost) */
    value: z
      .number({ error: "must be a finite number or null" })
      .min(0, { error: "must be >= 0" })
      .max(LIMITS.numberMax, { error: `must be <= ${LIMITS.numberMax}` })
      .nullable(),
  }),
  z.strictObject({ target: z.literal("prize"), value: positiveNumberSchema }),
  z.strictObject({ target: z.literal("csf"), csf: csfSpecSchema }),
  z.strictObject({
    target: z.literal("add-rival"),
    rival: rivalSpecSchema,
    /** a policy makes the new seat computer-played; null or absent: a human seat */
    policy: policySpecSchema.nullable().optional(),
  }),
  z.strictObject({ target: z.literal("retire-rival"), index: seatIndexSchema }),
]);

export type Shock = z.output<typeof shockSchema>;

export const shockListSchema = z
  .array(shockSchema)
  .min(1, { error: "must contain at least one change" })
  .max(LIMITS.changesMax, { error: `must contain at most ${LIMITS.changesMax} changes` });
