/**
 * What a view says about private numbers (R41). While the truth is withheld from a viewer, its
 * `scenario` holds the mean of each range in place of every private number of another seat,
 * `rounds`, `totals` and `shocks` are empty, and `hidden.rounds` carries what that viewer may
 * read of each resolved round: every seat's spend (money) and share, and its own result.
 */
import { z } from "zod";
import { robustPlanRecordSchema } from "./events";
import { finiteSchema, seatIndexSchema } from "./numbers";
import { HIDDEN_FIELDS } from "./hidden";

const rangeViewSchema = z.union([
  z.object({ dist: z.literal("uniform"), low: z.number(), high: z.number() }),
  z.object({ dist: z.literal("triangular"), low: z.number(), mode: z.number(), high: z.number() }),
]);

export const hiddenRoundViewSchema = z.object({
  round: z.int().min(1),
  /** per seat: money spent (0 where not playing) */
  spends: z.array(finiteSchema),
  /** per seat: share of the prize (winning probability in winner mode) */
  shares: z.array(finiteSchema),
  /** per seat: false where the seat did not play this round */
  played: z.array(z.boolean()),
  winner: seatIndexSchema.nullable(),
  /** seat role only: its own result */
  you: z
    .object({
      spend: finiteSchema,
      share: finiteSchema,
      /** money: realised payoff */
      payoff: finiteSchema,
      /** money: best reply to the others' actual spends under the true numbers */
      truthReplySpend: finiteSchema,
      /** money: best reply to the same spends under the seat's beliefs (R43) */
      beliefReplySpend: finiteSchema.nullable(),
    })
    .nullable(),
});

export const hiddenViewSchema = z.object({
  truth: z.enum(["draw", "scenario"]),
  /** every private number's public range */
  entries: z.array(
    z.object({ seatIndex: seatIndexSchema, field: z.enum(HIDDEN_FIELDS), range: rangeViewSchema }),
  ),
  /** true while the truth is kept from this viewer (every role but the facilitator, until the end) */
  withheld: z.boolean(),
  rounds: z.array(hiddenRoundViewSchema),
  /** ended sessions: the robust plan of each seat */
  robustPlans: z.array(robustPlanRecordSchema),
});

export type HiddenView = z.output<typeof hiddenViewSchema>;
export type HiddenRoundView = z.output<typeof hiddenRoundViewSchema>;
