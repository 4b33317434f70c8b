/** Bodies and responses of the HTTP endpoints served next to the socket. */
import { z } from "zod";
import { ERROR_CODES } from "./result";
import { seatKindSchema, sessionEventSchema } from "./events";
import { roundResultSchema, SESSION_STATUSES, shockRecordSchema } from "./view";
import { sessionScenarioSchema } from "./sessionScenario";
import { parseInput } from "./result";
import type { ParseResult } from "./result";
import type { AnySessionScenario } from "./sessionScenario";

/** A single-contest or a fronts session scenario (R45). */
export function parseSessionScenario(raw: unknown): ParseResult<AnySessionScenario> {
  return parseInput(sessionScenarioSchema, raw);
}

/** POST /api/sessions 201 response. */
export const createSessionResponseSchema = z.object({
  id: z.string(),
  joinCode: z.string(),
  facilitatorKey: z.string(),
  spectatorKey: z.string(),
  seats: z.array(
    z.object({
      index: z.int().min(0),
      name: z.string(),
      kind: seatKindSchema,
      /** seat key for a human seat's link; null for computer seats */
      key: z.string().nullable(),
      link: z.string().nullable(),
    }),
  ),
  links: z.object({ facilitator: z.string(), spectator: z.string(), join: z.string() }),
});
export type CreateSessionResponse = z.output<typeof createSessionResponseSchema>;

/** Every 4xx/5xx body. */
export const errorBodySchema = z.object({
  error: z.object({ code: z.enum(ERROR_CODES), path: z.string(), message: z.string() }),
});
export type ErrorBody = z.output<typeof errorBodySchema>;

/** GET /api/sessions item. Dates are ISO 8601 strings. */
export const sessionListItemSchema = z.object({
  id: z.string(),
  title: z.string(),
  status: z.enum(SESSION_STATUSES),
  createdAt: z.string(),
  updatedAt: z.string(),
  /** rounds resolved so far */
  rounds: z.int().min(0),
  /** library labels (the tag rule: packages/protocol/src/library.ts); defaults keep exports
   * written before the library readable */
  tags: z.array(z.string()).default([]),
  /** when the session was archived; null when it is not */
  archivedAt: z.string().nullable().default(null),
  /** when the session ended (its session-ended event); null while it runs */
  endedAt: z.string().nullable().default(null),
});
export type SessionListItem = z.output<typeof sessionListItemSchema>;
export const sessionListSchema = z.array(sessionListItemSchema);

/** GET /api/sessions/:id/export (JSON form). */
export const sessionExportSchema = z.object({
  session: sessionListItemSchema,
  events: z.array(sessionEventSchema),
  rounds: z.array(roundResultSchema),
  /** every shock of the exported log: when, what, and the contest before and after */
  shocks: z.array(shockRecordSchema),
  /** before the session ends: what the export leaves out (computer policies, seeds) */
  withheld: z.array(z.string()).optional(),
});
export type SessionExport = z.output<typeof sessionExportSchema>;

/** GET /api/health. */
export const healthSchema = z.object({
  ok: z.literal(true),
  version: z.string(),
  db: z.enum(["pglite", "postgres"]),
  /** which worker process answered, with WORKERS above 1 (0 to N-1) */
  worker: z.int().min(0).optional(),
});
export type Health = z.output<typeof healthSchema>;

/**
 * GET /api/ready: 200 with ok true when this process can take players (database answers,
 * every migration applied, not shutting down); 503 with the reason otherwise. Like health,
 * it says nothing about sessions.
 */
export const readySchema = z.object({
  ok: z.boolean(),
  db: z.enum(["pglite", "postgres"]),
  reason: z.enum(["draining", "unreachable", "migrations-pending"]).optional(),
});
export type Ready = z.output<typeof readySchema>;
