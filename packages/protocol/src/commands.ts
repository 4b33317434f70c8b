/** Every command a client may send, one union discriminated by `type`. */
import { z } from "zod";
import { LIMITS } from "./limits";
import { effortSchema, roundNumberSchema, seatIndexSchema } from "./numbers";
import { policySpecSchema } from "./policy";
import { shockListSchema } from "./shock";
import { lineProblem } from "./text";
import { parseInput } from "./result";
import type { ParseResult } from "./result";
import type { Role } from "./roles";

export const displayNameSchema = z
  .string({ error: "must be a string" })
  .trim()
  .min(1, { error: "must not be empty" })
  .max(LIMITS.displayNameMax, { error: `must be at most ${LIMITS.displayNameMax} characters` });

/** A seat's one-line reason for its move; empty means none. Revealed with the round. */
export const moveReasonSchema = z
  .string({ error: "must be a string" })
  .trim()
  .max(LIMITS.reasonMax, { error: `must be at most ${LIMITS.reasonMax} characters` })
  .refine((s) => lineProblem(s) === null, {
    error: (issue) => lineProblem(String(issue.input)) ?? "must be one line",
  });

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
/**
 * A seat's move is money: `spend` (cost x effort; the engine derives effort = spend / cost).
 * `effort` is the older form, still accepted: it is read as the spend cost x effort. In a
 * session with fronts the move is `frontSpends`, the money on each front in file order (R46).
 * Exactly one of the three.
 */
export const sealMoveSchema = z
  .strictObject({
    type: z.literal("sealMove"),
    clientMoveId: clientMoveIdSchema,
    spend: effortSchema.optional(),
    effort: effortSchema.optional(),
    frontSpends: z
      .array(effortSchema)
      .min(1, { error: "must give one amount per front" })
      .max(LIMITS.frontsMax, { error: `must have at most ${LIMITS.frontsMax} entries` })
      .optional(),
    /** optional guard: refused with wrong-state unless this round is the open one */
    round: roundNumberSchema.optional(),
    /** optional one-line reason, private to the seat until the round resolves */
    reason: moveReasonSchema.optional(),
  })
  .refine((c) => [c.spend, c.effort, c.frontSpends].filter((x) => x !== undefined).length === 1, {
    error: "give spend (money), frontSpends (money per front) or the older effort: exactly one",
    path: ["spend"],
  });
export const claimSeatSchema = z.strictObject({
  type: z.literal("claimSeat"),
  seatIndex: seatIndexSchema,
  displayName: displayNameSchema,
});

/** Fresh invite link: a new key for a seat, or for the big screen; older keys keep working. */
/** R27: the facilitator's note on a resolved round (empty text removes it). */
export const noteRoundSchema = z.strictObject({
  type: z.literal("noteRound"),
  round: roundNumberSchema,
  text: z
    .string({ error: "must be a string" })
    .trim()
    .max(LIMITS.noteMax, { error: `must be at most ${LIMITS.noteMax} characters` }),
});

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
  noteRoundSchema,
]);

export type Command = z.output<typeof commandSchema>;
export type CommandType = Command["type"];
export type CommandOf<T extends CommandType> = Extract<Command, { type: T }>;

/**
 * Who may send each command: the one table both the session engine's role check and the
 * socket layer's check derive from. A seat sends claimSeat only for its own seat (R3: the
 * engine checks the index; the ack carries back the seat's own key and no new key is made).
 * Spectators send nothing (R2). Only the server itself closes a round for the clock.
 */
export const COMMAND_ROLES = {
  openRound: ["facilitator"],
  closeRound: ["facilitator"],
  applyShock: ["facilitator"],
  pause: ["facilitator"],
  resume: ["facilitator"],
  endSession: ["facilitator"],
  setSeatPolicy: ["facilitator"],
  issueLinks: ["facilitator"],
  noteRound: ["facilitator"],
  sealMove: ["seat"],
  claimSeat: ["guest", "seat"],
} as const satisfies Record<CommandType, readonly Role[]>;

/** True when a connection of this role may send this command at all (finer rules: the engine). */
export function roleMaySend(role: Role, type: CommandType): boolean {
  return (COMMAND_ROLES[type] as readonly Role[]).includes(role);
}

export function parseCommand(raw: unknown): ParseResult<Command> {
  return parseInput(commandSchema, raw);
}
