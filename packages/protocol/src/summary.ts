/**
 * GET /api/sessions/:id/summary: a session's play reduced to the numbers a planner compares
 * across sessions. Money is in the session's currency (spend = cost x effort). Ratios are null
 * where there is nothing to divide by (no equilibrium, or an equilibrium that spends nothing),
 * never a made-up number.
 */
import { z } from "zod";
import { shockSchema } from "./shock";

export const summaryShockSchema = z.object({
  /** the changes applied since the previous round, in order */
  changes: z.array(shockSchema),
  /** the same in words, with from and to values: "prize 1000 -> 1500" */
  text: z.string(),
});

export const summaryRoundSchema = z.object({
  round: z.int().min(1),
  /** money spent by the seats that played the round */
  totalSpend: z.number(),
  /** the same at the round's equilibrium (expected spend when mixed); null: none known */
  equilibriumTotalSpend: z.number().nullable(),
  /** totalSpend / equilibriumTotalSpend */
  overspend: z.number().nullable(),
  /** the round's prize, in money (a shock may change it between rounds) */
  prize: z.number(),
  /** largest regret of the played profile, in money */
  nashGap: z.number(),
  /** nashGap / prize: comparable across scenarios of different size; null for a prize of 0 */
  nashGapShare: z.number().nullable(),
  /** money spent / prize */
  dissipation: z.number(),
  /** what changed before this round; null when nothing did */
  shock: summaryShockSchema.nullable(),
  /** the facilitator's note on the round; null when none */
  note: z.string().nullable(),
});

export const summarySeatSchema = z.object({
  seat: z.int().min(0),
  rival: z.string(),
  kind: z.enum(["person", "computer"]),
  /** rounds the seat played */
  rounds: z.int().min(0),
  meanSpend: z.number().nullable(),
  /** over the rounds that had an equilibrium */
  meanEquilibriumSpend: z.number().nullable(),
  /** spend / equilibrium spend, both summed over the rounds that had an equilibrium */
  overspend: z.number().nullable(),
  totalRegret: z.number(),
  totalPayoff: z.number(),
  /** share of its rounds the seat spent within 10% of its best reply's spend */
  nearBestReply: z.number().nullable(),
});

export const sessionSummarySchema = z.object({
  session: z.object({
    id: z.string(),
    title: z.string(),
    currency: z.string().nullable(),
    createdAt: z.string(),
    endedAt: z.string().nullable(),
    tags: z.array(z.string()),
  }),
  rounds: z.array(summaryRoundSchema),
  seats: z.array(summarySeatSchema),
});

export type SummaryShock = z.output<typeof summaryShockSchema>;
export type SummaryRound = z.output<typeof summaryRoundSchema>;
export type SummarySeat = z.output<typeof summarySeatSchema>;
export type SessionSummaryBody = z.output<typeof sessionSummarySchema>;
