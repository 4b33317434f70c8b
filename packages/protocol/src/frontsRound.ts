/**
 * What a resolved round of a fronts session stores beside its money totals (R48): every number
 * per seat and per front, computed once by the engine with the solver's fronts functions.
 * Rows are seats (a seat not playing the round holds a row of zeros), columns fronts in file
 * order. Money throughout; effort on front k is spend / the rival's cost there.
 */
import { z } from "zod";
import { validateFrontsScenario } from "@contend/solver";
import type { FrontsScenario } from "@contend/solver";
import { toPath } from "./contest";
import { finiteSchema } from "./numbers";

/** Any value -> a validated fronts scenario (the solver's validator, wrapped). */
export const frontsScenarioSchema = z.unknown().transform((raw, ctx): FrontsScenario => {
  const r = validateFrontsScenario(raw);
  if (r.ok) return r.value;
  ctx.addIssue({ code: "custom", message: r.message, path: toPath(r.path) });
  return z.NEVER;
});

const grid = z.array(z.array(finiteSchema));

export const frontsRoundSchema = z.object({
  /** money each seat put on each front (as sealed, or filled in by R20) */
  spends: grid,
  /** each seat's share of each front */
  shares: grid,
  /** value won on each front: the seat's value of the front x its share (money) */
  won: grid,
  /** each seat's best allocation (money per front) against the others' actual spends */
  bestSpends: grid,
  /** payoff of that best allocation (its regret is bestPayoffs - payoffs) */
  bestPayoffs: z.array(finiteSchema),
  /** money spent on each front by all seats */
  frontTotals: z.array(finiteSchema),
  /** the equilibrium of the fronts (solver solveFronts), rows by seat */
  equilibrium: z.object({
    kind: z.enum(["pure", "none-pure"]),
    /** null when none-pure */
    spends: grid.nullable(),
    shares: grid.nullable(),
    payoffs: z.array(finiteSchema).nullable(),
    /** what one more unit of budget is worth to each seat at the equilibrium (null: no budget) */
    shadowPrices: z.array(finiteSchema.nullable()).nullable(),
    nashGap: finiteSchema.nullable(),
    method: z.string(),
    note: z.string().optional(),
  }),
});
export type FrontsRound = z.output<typeof frontsRoundSchema>;
