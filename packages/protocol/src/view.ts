/**
 * What each role sees, pushed after every commit. Privacy rule: a sealed effort appears in no
 * view but its owner's (`you`) until its round is resolved; everyone else sees `sealed: true`.
 */
import { z } from "zod";
import { contestScenarioSchema } from "./contest";
import { roundResolvedSchema, END_REASONS, seatKindSchema } from "./events";
import { ROLES } from "./hello";
import { effortSchema, epochMsSchema, seatIndexSchema } from "./numbers";
import { policySpecSchema } from "./policy";
import { sessionSettingsSchema } from "./settings";
import { shockSchema } from "./shock";
import { hiddenViewSchema } from "./hiddenView";
import { frontsScenarioSchema } from "./frontsRound";

export const SESSION_STATUSES = ["lobby", "open", "review", "ended"] as const;
export type SessionStatus = (typeof SESSION_STATUSES)[number];

export const seatViewSchema = z.object({
  index: seatIndexSchema,
  name: z.string(),
  kind: seatKindSchema,
  claimed: z.boolean(),
  displayName: z.string().nullable(),
  /** true once this seat has a move in the open round (never the amount) */
  sealed: z.boolean(),
  /** false once the rival is retired */
  active: z.boolean(),
  /** facilitator only: the computer policy; omitted for other roles */
  policy: policySpecSchema.nullable().optional(),
});

/**
 * A resolved round as every role reads it. Money (cost x effort) sits beside every effort:
 * spends, bestResponseSpends (per seat, 0 where not playing) and equilibriumSpends (per seat,
 * null where not playing or no equilibrium is known; expected spends when mixed).
 */
export const roundResultSchema = roundResolvedSchema.omit({ type: true }).extend({
  scenario: contestScenarioSchema,
  seatIndices: z.array(seatIndexSchema),
  spends: z.array(z.number()),
  bestResponseSpends: z.array(z.number()),
  equilibriumSpends: z.array(z.number().nullable()),
  /** the facilitator's note on the round (R27); absent when none */
  note: z.string().optional(),
});

export const shockRecordSchema = z.object({
  /** rounds resolved before the shock (0: before the first round) */
  afterRound: z.int().min(0),
  changes: z.array(shockSchema),
  /** the session's contest just before and just after the shock (what changed, from what to what) */
  before: contestScenarioSchema,
  after: contestScenarioSchema,
});

export const roleViewSchema = z.object({
  role: z.enum(ROLES),
  sessionId: z.string(),
  title: z.string(),
  status: z.enum(SESSION_STATUSES),
  paused: z.boolean(),
  /** while paused with a clock running: what is left of it */
  remainingMs: z.number().min(0).nullable(),
  endedReason: z.enum(END_REASONS).nullable(),
  settings: sessionSettingsSchema,
  /** open: the open round; review/ended: the last resolved one; lobby: 0 */
  round: z.int().min(0),
  roundsTotal: z.int().min(1),
  deadline: epochMsSchema.nullable(),
  /** the session's current contest: rival k belongs to seat k (retired ones included) */
  scenario: contestScenarioSchema,
  /** open round only: the seats playing it */
  roundSeats: z.array(seatIndexSchema).nullable(),
  seats: z.array(seatViewSchema),
  rounds: z.array(roundResultSchema),
  totals: z.array(z.number()),
  shocks: z.array(shockRecordSchema),
  /** facilitator only: the session's join code (it lives in the database, not in the log) */
  joinCode: z.string().optional(),
  /**
   * sessions with fronts only (R45): the fronts scenario (public like the scenario, which is
   * then its single-contest summary, frontsRoster)
   */
  fronts: frontsScenarioSchema.optional(),
  /** sessions with private numbers only (R41) */
  hidden: hiddenViewSchema.optional(),
  /** seat role only */
  you: z
    .object({
      seatIndex: seatIndexSchema,
      sealedEffort: effortSchema.nullable(),
      /** the money sealed this round (null: nothing sealed) */
      sealedSpend: effortSchema.nullable(),
      /** sessions with fronts: the money sealed on each front this round (absent: none) */
      sealedFrontSpends: z.array(effortSchema).optional(),
      clientMoveId: z.string().nullable(),
      /** the reason sealed with this round's move; absent when none */
      sealedReason: z.string().optional(),
    })
    .optional(),
});

export type SeatView = z.output<typeof seatViewSchema>;
export type RoundResult = z.output<typeof roundResultSchema>;
export type ShockRecord = z.output<typeof shockRecordSchema>;
export type RoleView = z.output<typeof roleViewSchema>;

export const viewMessageSchema = z.object({ seq: z.int().min(0), view: roleViewSchema });
export type ViewMessage = z.output<typeof viewMessageSchema>;
