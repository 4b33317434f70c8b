/**
 * The saved-scenario library: a scenario kept under a name, with numbered versions (last
 * quarter's numbers, this quarter's numbers), each a complete POST /api/sessions body so any
 * version starts a new session. A saved scenario may hold private numbers: it opens only with
 * its own library key (made at the first save, shown once) or the operator key.
 */
import { z } from "zod";
import { keySchema, sessionIdSchema } from "./hello";
import { libraryNameSchema } from "./library";
import { LIMITS } from "./limits";
import { parseInput } from "./result";
import type { ParseResult } from "./result";
import { parseSessionScenario } from "./rest";
import type { AnySessionScenario } from "./sessionScenario";
import { lineProblem } from "./text";

const noteSchema = z
  .string({ error: "must be a string" })
  .trim()
  .max(LIMITS.versionNoteMax, { error: `must be at most ${LIMITS.versionNoteMax} characters` })
  .superRefine((s, ctx) => {
    const problem = lineProblem(s);
    if (problem) ctx.addIssue({ code: "custom", message: problem });
  });

/** POST /api/scenarios (first save) body; `scenario` is a session scenario. */
export const saveScenarioBodySchema = z.strictObject({
  name: libraryNameSchema,
  note: noteSchema.default(""),
  scenario: z.unknown(),
});
/** PATCH /api/scenarios/:id body: a new name, under the first save's name rule. */
export const renameScenarioBodySchema = saveScenarioBodySchema.pick({ name: true });
/** POST /api/scenarios/:id/versions body. */
export const saveVersionBodySchema = z.strictObject({
  note: noteSchema.default(""),
  scenario: z.unknown(),
});

export interface SaveScenarioInput {
  name: string;
  note: string;
  /** the body as sent; it passed the session scenario rules */
  scenario: unknown;
  parsed: AnySessionScenario;
}

/**
 * Parses a save (first save with `withName`, a new version without): the envelope, then the
 * scenario with the session scenario rules, its errors naming `scenario.<field>`.
 */
export function parseScenarioSave(
  raw: unknown,
  withName: boolean,
): ParseResult<Omit<SaveScenarioInput, "name"> & { name?: string }> {
  const envelope = withName
    ? parseInput(saveScenarioBodySchema, raw)
    : parseInput(saveVersionBodySchema, raw);
  if (!envelope.ok) return envelope;
  if (envelope.value.scenario === undefined) {
    return {
      ok: false,
      code: "bad-request",
      path: "scenario",
      message: "scenario: is required (a session scenario)",
    };
  }
  const parsed = parseSessionScenario(envelope.value.scenario);
  if (!parsed.ok) {
    const path = parsed.path === "" ? "scenario" : `scenario.${parsed.path}`;
    const message = parsed.message.startsWith(`${parsed.path}: `)
      ? parsed.message.slice(parsed.path.length + 2)
      : parsed.message;
    return { ok: false, code: parsed.code, path, message: `${path}: ${message}` };
  }
  return { ok: true, value: { ...envelope.value, parsed: parsed.value } };
}

/** POST /api/scenarios 201. `key` is shown once: keep it; only its hash is stored. */
export const savedScenarioCreatedSchema = z.object({
  id: z.string(),
  key: z.string(),
  version: z.int().min(1),
});
export type SavedScenarioCreated = z.output<typeof savedScenarioCreatedSchema>;

export const savedVersionInfoSchema = z.object({
  version: z.int().min(1),
  note: z.string(),
  createdAt: z.string(),
});
export type SavedVersionInfo = z.output<typeof savedVersionInfoSchema>;

/** GET /api/scenarios (operator) and POST /api/scenarios/mine item; GET /api/scenarios/:id. */
export const savedScenarioSchema = z.object({
  id: z.string(),
  name: z.string(),
  createdAt: z.string(),
  /** newest first */
  versions: z.array(savedVersionInfoSchema),
});
export type SavedScenario = z.output<typeof savedScenarioSchema>;
export const savedScenarioListSchema = z.array(savedScenarioSchema);

/** GET /api/scenarios/:id/versions/:n: one version with its body. */
export const savedVersionSchema = savedVersionInfoSchema.extend({ scenario: z.unknown() });
export type SavedVersion = z.output<typeof savedVersionSchema>;

/** Saved scenarios a browser asks about at once (POST /api/scenarios/mine). */
export const MINE_SCENARIOS_MAX = 200;
export const mineScenariosBodySchema = z.strictObject({
  scenarios: z
    .array(z.strictObject({ id: sessionIdSchema, key: keySchema }))
    .max(MINE_SCENARIOS_MAX, { error: `must list at most ${MINE_SCENARIOS_MAX} scenarios` }),
});
