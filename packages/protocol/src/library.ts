/**
 * The library of past sessions: the tag rule, the search filter and the changes a facilitator
 * (or the operator) may make to a session's library entry (title, tags, archived). The one
 * place these rules live; the server, the database layer and the web page import them.
 */
import { z } from "zod";
import { LIMITS } from "./limits";
import { nameProblem } from "./text";

/** A tag as stored: trimmed, inner runs of white space made one space, lower case. */
export function normaliseTag(raw: string): string {
  return raw.trim().replace(/\s+/g, " ").toLowerCase();
}

/**
 * What is wrong with a tag (before or after normalising), or null. A tag is one line of 1 to
 * `LIMITS.tagMax` characters without commas (the web page splits typed text on commas).
 */
export function tagProblem(raw: string): string | null {
  const tag = normaliseTag(raw);
  if (tag === "") return "must not be empty";
  if (tag.length > LIMITS.tagMax) return `must be at most ${LIMITS.tagMax} characters`;
  if (tag.includes(",")) return "must not contain a comma (one tag at a time)";
  return nameProblem(tag);
}

/** Parses one tag to its stored form, refusing it (naming the problem) when it breaks the rule. */
export const tagSchema = z.string({ error: "must be a string" }).transform((raw, ctx) => {
  const problem = tagProblem(raw);
  if (problem) {
    ctx.addIssue({ code: "custom", message: problem });
    return z.NEVER;
  }
  return normaliseTag(raw);
});

const tagListSchema = z
  .array(tagSchema)
  .max(LIMITS.tagsMax, { error: `must list at most ${LIMITS.tagsMax} tags` });

/** A session's (or saved scenario's) title or name: one line, trimmed, 1 to nameMax characters. */
export const libraryNameSchema = z
  .string({ error: "must be a string" })
  .trim()
  .min(1, { error: "must not be empty" })
  .max(LIMITS.nameMax, { error: `must be at most ${LIMITS.nameMax} characters` })
  .superRefine((s, ctx) => {
    const problem = nameProblem(s);
    if (problem) ctx.addIssue({ code: "custom", message: problem });
  });

/**
 * PATCH /api/sessions/:id body: rename, add and remove tags, archive or unarchive. At least
 * one change; a tag both added and removed is refused. Tags removed that the session does not
 * carry are ignored; at most `tagsMax` tags stay on a session.
 */
export const sessionPatchSchema = z
  .strictObject({
    title: libraryNameSchema.optional(),
    addTags: tagListSchema.optional(),
    removeTags: tagListSchema.optional(),
    archived: z.boolean({ error: "must be true or false" }).optional(),
  })
  .superRefine((patch, ctx) => {
    if (Object.values(patch).every((v) => v === undefined)) {
      ctx.addIssue({
        code: "custom",
        path: [],
        message: "name at least one change: title, addTags, removeTags or archived",
      });
    }
    const removed = new Set(patch.removeTags ?? []);
    const both = (patch.addTags ?? []).findIndex((t) => removed.has(t));
    if (both >= 0) {
      ctx.addIssue({
        code: "custom",
        path: ["addTags", both],
        message: "is also in removeTags",
      });
    }
  });
export type SessionPatch = z.output<typeof sessionPatchSchema>;

const instantSchema = z.iso
  .datetime({ offset: true, error: "must be an ISO 8601 date and time, e.g. 2026-12-01T00:00:00Z" })
  .transform((s) => new Date(s));

/** Which sessions to show by their archive flag. */
export const ARCHIVE_FILTERS = ["hide", "only", "all"] as const;

/**
 * A library search: title text (case-insensitive substring), one tag, created and ended
 * ranges (inclusive instants; a session that has not ended never matches an ended range),
 * archived ones hidden unless asked for. Every field is optional.
 */
export const sessionFilterSchema = z
  .strictObject({
    q: z
      .string({ error: "must be a string" })
      .trim()
      .max(LIMITS.searchMax, { error: `must be at most ${LIMITS.searchMax} characters` })
      .optional(),
    tag: tagSchema.optional(),
    createdFrom: instantSchema.optional(),
    createdTo: instantSchema.optional(),
    endedFrom: instantSchema.optional(),
    endedTo: instantSchema.optional(),
    archived: z.enum(ARCHIVE_FILTERS, { error: "must be hide, only or all" }).default("hide"),
  })
  .superRefine((f, ctx) => {
    for (const [from, to] of [
      ["createdFrom", "createdTo"],
      ["endedFrom", "endedTo"],
    ] as const) {
      const a = f[from];
      const b = f[to];
      // zod runs this even when a field failed (it is then still a string): dates only
      if (a instanceof Date && b instanceof Date && a.getTime() > b.getTime()) {
        ctx.addIssue({ code: "custom", path: [to], message: `must not be before ${from}` });
      }
    }
  });
export type SessionFilter = z.output<typeof sessionFilterSchema>;
export type SessionFilterInput = z.input<typeof sessionFilterSchema>;

/** GET /api/sessions?q=…&tag=…: the query string as a filter object (empty values dropped). */
export function filterFromQuery(params: URLSearchParams): Record<string, string> {
  const out: Record<string, string> = {};
  for (const [k, v] of params) if (v !== "") out[k] = v;
  return out;
}
