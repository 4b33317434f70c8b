/** Every command a client may send, one union discriminated by `type`. */
import { z } from "zod";
import { LIMITS } from "./limits";
import { effortSchema, roundNumberSchema, seatIndexSchema } from "./numbers";
import { policySpecSchema } from "./policy";
import { shockListSchema } from "./shock";
import { parseWith } from "./result";
import type { ParseResult } from "./result";

export const displayNameSchema = z
  .string({ error: "must be a string" })
  .trim()
  .min(1, { error: "must not be empty" })
  .max(LIMITS.displayNameMax, { error: `must be at most ${LIMITS.displayNameMax} characters` });

export const clientMoveIdSchema = z
  .string({ error: "must be a string" })
  .min(1, { error: "must not be empty" })
  .max(LIMITS.clientMoveIdMax, { error: `must be at most ${LIMITS.clientMoveIdMax} characters` });

export const openRoundSchema = z.strictObject({
  type: z.literal("openRound"),
  /** absent: the session's clockSeconds; null: no clock */
  durationSeconds: z
    .number({ error: "must be null or a number of seconds" })
    .min(LIMITS.clockMinSeconds, { error: `must be >= ${LIMITS.clockMinSeconds}` })
    .max(LIMITS.clockMaxSeconds, { error: `must be <= ${LIMITS.clockMaxSeconds}` })
    .nullable()
    .optional(),
});
export const closeRoundSchema = z.strictObject({ type: z.literal("closeRound") });
export const applyShockSchema = z.strictObject({
  type: z.literal("applyShock"),
  changes: shockListSchema,
});
export const pauseSchema = z.strictObject({ type: z.literal("pause") });
export const resumeSchema = z.strictObject({ type: z.literal("resume") });
export const endSessionSchema = z.strictObject({ type: z.literal("endSession") });
export const setSeatPolicySchema = z.strictObject({
  type: z.literal("setSeatPolicy"),
  seatIndex: seatIndexSchema,
  /** null hands the seat back to a human */
  policy: policySpecSchema.nullable(),
});
export const sealMoveSchema = z.strictObject({
  type: z.literal("sealMove"),
  clientMoveId: clientMoveIdSchema,
  effort: effortSchema,
  /** optional guard: refused with wrong-state unless this round is the open one */
  round: roundNumberSchema.optional(),
});
export const claimSeatSchema = z.strictObject({
  type: z.literal("claimSeat"),
  seatIndex: seatIndexSchema,
  displayName: displayNameSchema,
});

/** Fresh invite link: a new key for a seat, or for the big screen; older keys keep working. */
export const issueLinksSchema = z.strictObject({
  type: z.literal("issueLinks"),
  /** a seat index: a new seat key; null or absent: a new spectator (big-screen) key */
  seatIndex: seatIndexSchema.nullable().optional(),
});

export const commandSchema = z.discriminatedUnion("type", [
  openRoundSchema,
  closeRoundSchema,
  applyShockSchema,
  pauseSchema,
  resumeSchema,
  endSessionSchema,
  setSeatPolicySchema,
  sealMoveSchema,
  claimSeatSchema,
  issueLinksSchema,
]);

export type Command = z.output<typeof commandSchema>;
export type CommandType = Command["type"];
export type CommandOf<T extends CommandType> = Extract<Command, { type: T }>;

/** Which role may send each command (the engine enforces it again). */
export const COMMAND_ROLES: Record<CommandType, "facilitator" | "seat" | "guest"> = {
  openRound: "facilitator",
  closeRound: "facilitator",
  applyShock: "facilitator",
  pause: "facilitator",
  resume: "facilitator",
  endSession: "facilitator",
  setSeatPolicy: "facilitator",
  sealMove: "seat",
  claimSeat: "guest",
  issueLinks: "facilitator",
};

export function parseCommand(raw: unknown): ParseResult<Command> {
  return parseWith(commandSchema, raw);
}
