/**
 * The solver's Equilibrium shape, as stored inside round-resolved events. Stored events are
 * JSON, so the one number the solver may leave undefined (the Nash gap of "none-pure") is null.
 */
import { z } from "zod";
import { finiteSchema } from "./numbers";

const mixedStrategySchema = z.object({
  atomAtZero: finiteSchema,
  low: finiteSchema,
  high: finiteSchema,
  mean: finiteSchema,
  cdfExponent: finiteSchema.optional(),
  /** finite mixed strategies (ratio and logit forms): each effort with its probability */
  points: z.array(z.object({ effort: finiteSchema, probability: finiteSchema })).optional(),
});

export const equilibriumSchema = z.object({
  kind: z.enum(["pure", "mixed", "none-pure"]),
  efforts: z.array(finiteSchema).nullable(),
  expectedEfforts: z.array(finiteSchema).optional(),
  shares: z.array(finiteSchema).nullable(),
  payoffs: z.array(finiteSchema).nullable(),
  totalEffort: finiteSchema,
  dissipation: finiteSchema,
  active: z.array(z.boolean()),
  /** null when there is no profile to measure (kind "none-pure"; the solver reports NaN) */
  nashGap: finiteSchema.nullable(),
  method: z.string(),
  strategies: z.array(mixedStrategySchema).optional(),
  note: z.string().optional(),
  approximate: z.boolean().optional(),
  equivalents: finiteSchema.optional(),
  outOfRange: z.string().optional(),
});
