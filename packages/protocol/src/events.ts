/**
 * The append-only session log. The engine returns event bodies; the server stamps each with
 * `seq` (1, 2, ... per session) and `at` (epoch ms) when it commits them. Results of a round are
 * computed once, stored in its round-resolved event, and never recomputed on replay.
 */
import { z } from "zod";
import { contestScenarioSchema } from "./contest";
import { equilibriumSchema } from "./equilibrium";
import {
  effortSchema,
  epochMsSchema,
  finiteSchema,
  roundNumberSchema,
  seatIndexSchema,
} from "./numbers";
import { policySpecSchema } from "./policy";
import { sessionScenarioSchema } from "./sessionScenario";
import { shockSchema } from "./shock";
import { clientMoveIdSchema, displayNameSchema } from "./commands";
import { frontsRoundSchema } from "./frontsRound";
import { sessionIdSchema } from "./hello";
import { parseWith } from "./result";
import type { ParseResult } from "./result";

export const seatKindSchema = z.enum(["human", "computer"]);
export type SeatKind = z.output<typeof seatKindSchema>;

export const initialSeatSchema = z.object({
  index: seatIndexSchema,
  name: z.string(),
  kind: seatKindSchema,
  policy: policySpecSchema.nullable(),
});

export const CLOSE_REASONS = ["facilitator", "clock", "all-sealed"] as const;
export type CloseReason = (typeof CLOSE_REASONS)[number];

export const END_REASONS = ["facilitator", "rounds-complete"] as const;
export type EndReason = (typeof END_REASONS)[number];

const seeds = z.int().min(0).max(0xffffffff);

export const sessionCreatedSchema = z.object({
  type: z.literal("session-created"),
  sessionId: sessionIdSchema,
  scenario: sessionScenarioSchema,
  seats: z.array(initialSeatSchema),
  seed: seeds,
});
export const seatClaimedSchema = z.object({
  type: z.literal("seat-claimed"),
  seatIndex: seatIndexSchema,
  displayName: displayNameSchema,
});
export const seatPolicySetSchema = z.object({
  type: z.literal("seat-policy-set"),
  seatIndex: seatIndexSchema,
  policy: policySpecSchema.nullable(),
});
export const roundOpenedSchema = z.object({
  type: z.literal("round-opened"),
  round: roundNumberSchema,
  /** the contest this round is played under: active rivals only, in seat order */
  scenario: contestScenarioSchema,
  /** seatIndices[k] is the seat playing scenario.rivals[k] */
  seatIndices: z.array(seatIndexSchema),
  deadline: epochMsSchema.nullable(),
});
export const moveSealedSchema = z.object({
  type: z.literal("move-sealed"),
  round: roundNumberSchema,
  seatIndex: seatIndexSchema,
  effort: effortSchema,
  /** the money sealed (effort = spend / cost); absent in logs written before spends */
  spend: effortSchema.optional(),
  /** sessions with fronts (R46): money on each front; `spend` and `effort` are its total */
  frontSpends: z.array(effortSchema).optional(),
  clientMoveId: clientMoveIdSchema,
  by: z.enum(["seat", "computer"]),
  /** the seat's one-line reason; absent when none was given */
  reason: z.string().optional(),
});

const perSeat = z.array(finiteSchema);

export const roundResolvedSchema = z.object({
  type: z.literal("round-resolved"),
  round: roundNumberSchema,
  reason: z.enum(CLOSE_REASONS),
  /** the arrays below are indexed by seat; seats not playing this round hold 0 / false */
  efforts: perSeat,
  /** money, cost x effort as sealed; absent in logs written before spends (then derived) */
  spends: perSeat.optional(),
  defaulted: z.array(z.boolean()),
  shares: perSeat,
  /** winner mode: the seat that won; shares mode: null */
  winner: seatIndexSchema.nullable(),
  /** winner mode: seed of the generator that drew the winner; shares mode: null */
  drawSeed: seeds.nullable(),
  /** realised payoffs (shares mode: equal to expectedPayoffs) */
  payoffs: perSeat,
  expectedPayoffs: perSeat,
  /** running totals of realised payoffs after this round */
  totals: perSeat,
  bestResponses: perSeat,
  regrets: perSeat,
  /** equilibrium of the round's scenario; its arrays follow round-opened.seatIndices */
  equilibrium: equilibriumSchema,
  nashGap: finiteSchema,
  dissipation: finiteSchema,
  /**
   * sessions with private numbers (R43): each seat's best reply (money) to the others' actual
   * spends when every private number of another seat is uncertain over its range (the spend
   * maximising expected payoff); 0 where not playing. Absent without private numbers.
   */
  beliefReplySpends: perSeat.optional(),
  /** per seat: the reason sealed with the move (null: none); absent when no seat gave one */
  moveReasons: z.array(z.string().nullable()).optional(),
  /**
   * sessions with fronts (R48): every number per front; the fields above then hold the totals
   * over fronts (money; shares: the share of all prizes won)
   */
  fronts: frontsRoundSchema.optional(),
});
export const shockAppliedSchema = z.object({
  type: z.literal("shock-applied"),
  changes: z.array(shockSchema),
  /** the session's contest after the changes (every seat's rival, retired ones included) */
  scenario: contestScenarioSchema,
});
export const pausedSchema = z.object({
  type: z.literal("paused"),
  remainingMs: z.number().min(0).nullable(),
});
export const resumedSchema = z.object({
  type: z.literal("resumed"),
  deadline: epochMsSchema.nullable(),
});
/** The robust plan of one seat under what it did not know (R44; solver `runUncertain`). */
export const robustPlanRecordSchema = z.object({
  seatIndex: seatIndexSchema,
  /** money: the spend maximising the seat's expected payoff over the others' ranges */
  spend: finiteSchema,
  expectedPayoff: finiteSchema,
  p10Payoff: finiteSchema,
  meanRegret: finiteSchema,
  /** money: the seat's equilibrium spend when every private number sits at its median */
  equilibriumSpendAtMedians: finiteSchema.nullable(),
  draws: z.int().min(0),
  seed: seeds,
});
export type RobustPlanRecord = z.output<typeof robustPlanRecordSchema>;

export const sessionEndedSchema = z.object({
  type: z.literal("session-ended"),
  reason: z.enum(END_REASONS),
  /** sessions with private numbers: each human or computer seat's robust plan, computed once */
  robustPlans: z.array(robustPlanRecordSchema).optional(),
});

export const roundNotedSchema = z.object({
  type: z.literal("round-noted"),
  round: roundNumberSchema,
  /** the note; empty removes it */
  text: z.string(),
});

const bodies = [
  sessionCreatedSchema,
  seatClaimedSchema,
  seatPolicySetSchema,
  roundOpenedSchema,
  moveSealedSchema,
  roundResolvedSchema,
  shockAppliedSchema,
  pausedSchema,
  resumedSchema,
  sessionEndedSchema,
  roundNotedSchema,
] as const;

export const eventBodySchema = z.discriminatedUnion("type", bodies);

const stamp = { seq: z.int().min(1), at: epochMsSchema };

export const sessionEventSchema = z.discriminatedUnion("type", [
  sessionCreatedSchema.extend(stamp),
  seatClaimedSchema.extend(stamp),
  seatPolicySetSchema.extend(stamp),
  roundOpenedSchema.extend(stamp),
  moveSealedSchema.extend(stamp),
  roundResolvedSchema.extend(stamp),
  shockAppliedSchema.extend(stamp),
  pausedSchema.extend(stamp),
  resumedSchema.extend(stamp),
  sessionEndedSchema.extend(stamp),
  roundNotedSchema.extend(stamp),
]);

export type EventBody = z.output<typeof eventBodySchema>;
export type EventType = EventBody["type"];
export type EventOf<T extends EventType> = Extract<EventBody, { type: T }>;
export type SessionEvent = EventBody & { seq: number; at: number };
export type RoundResolved = EventOf<"round-resolved">;
export type InitialSeat = z.output<typeof initialSeatSchema>;

/** Checks a stored or imported log entry (e.g. a replay file). */
export function parseEvent(raw: unknown): ParseResult<SessionEvent> {
  return parseWith(sessionEventSchema, raw);
}

export const eventLogSchema = z.array(sessionEventSchema);
