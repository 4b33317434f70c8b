/** The first message on every socket: protocol version plus credentials for one role. */
import { z } from "zod";
import { LIMITS } from "./limits";
import { displayNameSchema } from "./commands";
import { PROTOCOL_VERSION } from "./version";
import { parseInput } from "./result";
import type { ParseResult } from "./result";

export { ROLES } from "./roles";
export type { Role } from "./roles";

export const sessionIdSchema = z
  .string({ error: "must be a string" })
  .min(1, { error: "must not be empty" })
  .max(LIMITS.sessionIdMax, { error: `must be at most ${LIMITS.sessionIdMax} characters` });

export const keySchema = z
  .string({ error: "must be a string" })
  .min(1, { error: "must not be empty" })
  .max(LIMITS.keyMax, { error: `must be at most ${LIMITS.keyMax} characters` });

export const joinCodeSchema = z
  .string({ error: "must be a string" })
  .trim()
  .min(LIMITS.joinCodeMin, { error: `must be at least ${LIMITS.joinCodeMin} characters` })
  .max(LIMITS.joinCodeMax, { error: `must be at most ${LIMITS.joinCodeMax} characters` });

export const credentialsSchema = z.discriminatedUnion("role", [
  z.strictObject({ role: z.literal("facilitator"), sessionId: sessionIdSchema, key: keySchema }),
  z.strictObject({
    role: z.literal("seat"),
    sessionId: sessionIdSchema,
    key: keySchema,
    /** used when this hello claims a still unclaimed seat */
    displayName: displayNameSchema.optional(),
  }),
  z.strictObject({ role: z.literal("spectator"), sessionId: sessionIdSchema, key: keySchema }),
  z.strictObject({ role: z.literal("guest"), joinCode: joinCodeSchema }),
]);

export type Credentials = z.output<typeof credentialsSchema>;

export const helloSchema = z.strictObject({
  protocol: z.literal(PROTOCOL_VERSION, { error: `must be ${PROTOCOL_VERSION}` }),
  credentials: credentialsSchema,
  /** last event seq the client has seen (informational; the ack always carries a full view) */
  lastSeq: z.int().min(0).optional(),
});

export type Hello = z.output<typeof helloSchema>;

/** Like every parser here, but a well-formed hello with another version is "version-mismatch". */
export function parseHello(raw: unknown): ParseResult<Hello> {
  if (typeof raw === "object" && raw !== null && "protocol" in raw) {
    const v = (raw as { protocol: unknown }).protocol;
    if (typeof v === "number" && v !== PROTOCOL_VERSION) {
      return {
        ok: false,
        code: "version-mismatch",
        path: "protocol",
        message: `protocol: this server speaks protocol ${PROTOCOL_VERSION}, the client sent ${v}; reload the page`,
      };
    }
  }
  return parseInput(helloSchema, raw);
}

/**
 * The query parameter a client adds to its socket.io connection to say which session it is
 * for (when it knows: a guest with a join code does not). With several processes on one
 * machine (WORKERS=N) the primary sends every connection of a session to the same worker,
 * and a reverse proxy can hash on it; it grants nothing (the hello's key does).
 */
export const SESSION_ROUTE_PARAM = "session";
