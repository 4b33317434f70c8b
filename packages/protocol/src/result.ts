import type { z } from "zod";
import { findTextIssue } from "./text";

/** Every expected failure the server reports; the same strings appear in acks and REST bodies. */
export const ERROR_CODES = [
  "bad-request",
  "unauthorized",
  "forbidden",
  "wrong-state",
  "not-found",
  "rate-limited",
  "too-large",
  "conflict",
  "version-mismatch",
  "unavailable",
  "internal",
] as const;

export type ErrorCode = (typeof ERROR_CODES)[number];

/** Outcome of parsing untrusted input: a typed value, or the first problem with its field. */
export type ParseResult<T> =
  | { ok: true; value: T }
  | { ok: false; code: "bad-request" | "version-mismatch"; path: string; message: string };

function joinPath(path: readonly PropertyKey[]): string {
  return path.map((p) => String(p)).join(".");
}

/** Turns the first zod issue into a message that starts with the offending field's path. */
export function firstProblem(error: z.ZodError): { path: string; message: string } {
  const issue = error.issues[0];
  if (!issue) return { path: "", message: "invalid input" };
  let path = joinPath(issue.path);
  let message = issue.message;
  if (issue.code === "unrecognized_keys") {
    const keys = issue.keys;
    path = joinPath([...issue.path, keys[0] ?? ""]);
    message = `unknown field${keys.length > 1 ? "s" : ""} ${keys.map((k) => JSON.stringify(k)).join(", ")}`;
  }
  return { path, message: `${path === "" ? "message" : path}: ${message}` };
}

/** Runs a schema over untrusted input and never throws. */
export function parseWith<S extends z.ZodType>(schema: S, raw: unknown): ParseResult<z.output<S>> {
  const r = schema.safeParse(raw);
  if (r.success) return { ok: true, value: r.data };
  return { ok: false, code: "bad-request", ...firstProblem(r.error) };
}

/**
 * parseWith for anything a client sent: the text rule (text.ts) first, so a NUL, a lone
 * surrogate, a control character or a reserved key is refused naming its field, then the schema.
 */
export function parseInput<S extends z.ZodType>(schema: S, raw: unknown): ParseResult<z.output<S>> {
  const issue = findTextIssue(raw);
  if (issue) {
    const path = joinPath(issue.path);
    return {
      ok: false,
      code: "bad-request",
      path,
      message: `${path === "" ? "message" : path}: ${issue.message}`,
    };
  }
  return parseWith(schema, raw);
}
