/** The solver's Equilibrium shape, as stored inside round-resolved events. */
import { z } from "zod";
import { finiteSchema } from "./numbers";

const mixedStrategySchema = z.object({
  atomAtZero: finiteSchema,
  low: finiteSchema,
  high: finiteSchema,
  mean: finiteSchema,
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
  nashGap: finiteSchema,
  method: z.string(),
  strategies: z.array(mixedStrategySchema).optional(),
  note: z.string().optional(),
});
