/**
 * What the main thread and the PGlite thread say to each other. Every request carries an id;
 * the reply with the same id settles it. Errors cross as plain data (structured cloning keeps
 * an Error's message but drops its class and fields) and are rebuilt on the main thread.
 */
import type { PreparedStatement, PreparedValue } from "../sqlRunner";

export type Request =
  | { op: "adapter.query"; tx: number | null; query: unknown; rows: boolean }
  | { op: "adapter.script"; script: string }
  | { op: "adapter.begin"; isolationLevel?: string }
  | { op: "adapter.end"; tx: number; commit: boolean }
  | { op: "runner.query"; tx: number | null; sql: string; params?: unknown[] }
  | { op: "runner.exec"; tx: number; script: string }
  | { op: "runner.prepared"; statement: PreparedStatement; params: readonly PreparedValue[] }
  | { op: "runner.begin" }
  | { op: "runner.end"; tx: number; commit: boolean }
  | { op: "close" };

export type Envelope = Request & { id: number };

export interface WireError {
  name: string;
  message: string;
  stack?: string;
  /** own enumerable fields: code, severity, detail, hint, a driver error's cause, ... */
  fields: Record<string, unknown>;
}

export type Reply = { id: number } & (
  { ok: true; value: unknown } | { ok: false; error: WireError }
);

/** What the thread posts once, before any reply: the database is open, or why it is not. */
export type Ready = { ready: true } | { ready: false; error: WireError };

export function toWire(error: unknown): WireError {
  if (!(error instanceof Error)) return { name: "Error", message: String(error), fields: {} };
  const fields: Record<string, unknown> = {};
  for (const [key, value] of Object.entries(error)) {
    if (typeof value !== "function") fields[key] = plain(value);
  }
  // A driver error's payload lives in `cause`, which is not enumerable on every Error.
  if (error.cause !== undefined && !("cause" in fields)) fields.cause = plain(error.cause);
  return { name: error.name, message: error.message, stack: error.stack, fields };
}

export function fromWire(wire: WireError): Error {
  const error = new Error(wire.message);
  Object.assign(error, wire.fields);
  Object.defineProperty(error, "name", { value: wire.name, enumerable: false, writable: true });
  if (wire.stack) error.stack = wire.stack;
  return error;
}

/** Drops what cannot be cloned (functions, class instances with methods become their fields). */
function plain(value: unknown): unknown {
  if (value === null || typeof value !== "object")
    return typeof value === "function" ? undefined : value;
  try {
    return structuredClone(value);
  } catch {
    return JSON.parse(JSON.stringify(value)) as unknown;
  }
}
