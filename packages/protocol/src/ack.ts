/** Acknowledgements: every hello and command gets exactly one, after its events are committed. */
import { z } from "zod";
import { ERROR_CODES } from "./result";
import type { ErrorCode } from "./result";
import { ROLES } from "./hello";
import { roleViewSchema } from "./view";

export const ackErrorSchema = z.object({
  ok: z.literal(false),
  code: z.enum(ERROR_CODES),
  /** human-readable, names the offending field or rule; never internal error text */
  message: z.string(),
  /** dotted path of the offending field, for bad-request */
  path: z.string().optional(),
});
export type AckError = z.output<typeof ackErrorSchema>;

/** `{ok:true, data}` with the given data schema, or an AckError. */
export function ackSchema<T extends z.ZodType>(data: T) {
  return z.union([z.object({ ok: z.literal(true), data }), ackErrorSchema]);
}

export type Ack<T> = { ok: true; data: T } | AckError;

export const helloAckDataSchema = z.object({
  protocol: z.int(),
  role: z.enum(ROLES),
  /** null for guests (they learn the session id from the claimSeat ack) */
  sessionId: z.string().nullable(),
  seatIndex: z.int().min(0).optional(),
  /** seq of the last committed event the view reflects */
  seq: z.int().min(0),
  view: roleViewSchema,
  /**
   * The server's clock (ms since the epoch) as it sent this ack: round deadlines are on this
   * clock, so a client whose own clock is off can still count down correctly.
   */
  serverNow: z.number(),
});
export type HelloAckData = z.output<typeof helloAckDataSchema>;

/** Data of a sealMove ack; a repeated clientMoveId gets the original data again. */
export const sealMoveAckDataSchema = z.object({
  seq: z.int().min(0),
  round: z.int().min(1),
  seatIndex: z.int().min(0),
  clientMoveId: z.string(),
  effort: z.number(),
  /** the money sealed; effort = spend / cost */
  spend: z.number(),
  /** sessions with fronts: the money on each front (spend is their total) */
  frontSpends: z.array(z.number()).optional(),
});
export type SealMoveAckData = z.output<typeof sealMoveAckDataSchema>;

/** Data of a claimSeat ack: say hello again as this seat with seatKey. */
export const claimSeatAckDataSchema = z.object({
  seq: z.int().min(0),
  sessionId: z.string(),
  seatIndex: z.int().min(0),
  seatKey: z.string(),
});
export type ClaimSeatAckData = z.output<typeof claimSeatAckDataSchema>;

/**
 * Data of an issueLinks ack: the new key in plain text (the database keeps only its hash, so
 * this is the one time it is sent) and the page link built with it.
 */
export const issueLinksAckDataSchema = z.object({
  seq: z.int().min(0),
  role: z.enum(["seat", "spectator"]),
  /** the seat the key opens; null for a spectator key */
  seatIndex: z.int().min(0).nullable(),
  key: z.string(),
  link: z.string(),
});
export type IssueLinksAckData = z.output<typeof issueLinksAckDataSchema>;

export const basicAckDataSchema = z.object({ seq: z.int().min(0) });
export type BasicAckData = z.output<typeof basicAckDataSchema>;

export type CommandAckData = SealMoveAckData | ClaimSeatAckData | IssueLinksAckData | BasicAckData;

export function ackError(code: ErrorCode, message: string, path?: string): AckError {
  return path === undefined ? { ok: false, code, message } : { ok: false, code, message, path };
}
