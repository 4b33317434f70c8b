/**
 * Every problem of a form at once, one per field. The rules live in the solver's validateScenario
 * (validateFrontsScenario for fronts) and the protocol's schemas; this module only collects all of their messages instead of the
 * first one, so each field can show its own.
 */
import { validateScenario } from "@contend/solver";

/** Field path (as the validators report it, e.g. "rivals.2.cost") -> message. */
export type FieldErrors = Record<string, string>;

/** A value that passes the validator at this path, used to look past one problem to the next. */
function placeholderFor(path: string): unknown {
  const last = path.split(".").pop() ?? "";
  if (last === "title") return "untitled";
  if (last === "name") return `placeholder-${path}`;
  if (last === "budget") return null;
  if (last === "currency" || last === "leader") return null;
  if (last === "csf" || last === "kind") return { kind: "ratio", decisiveness: 1 };
  return 1;
}

function setAtPath(root: Record<string, unknown>, path: string, value: unknown): boolean {
  const parts = path.split(".");
  let node: unknown = root;
  for (let i = 0; i < parts.length - 1; i++) {
    const part = parts[i] as string;
    if (typeof node !== "object" || node === null) return false;
    node = (node as Record<string, unknown>)[part];
  }
  if (typeof node !== "object" || node === null) return false;
  const lastKey = parts[parts.length - 1] as string;
  if (lastKey === "kind" && parts.length === 2) {
    root.csf = value;
    return true;
  }
  (node as Record<string, unknown>)[lastKey] = value;
  return true;
}

/** A validator that reports its first problem with the field's path (the solver's shape). */
type FirstProblem = (raw: unknown) => { ok: true } | { ok: false; path: string; message: string };

/**
 * Every problem of a scenario, one per field: validate, note the first problem, patch that
 * field with a valid placeholder, repeat. The validator stays the only place the rules live.
 */
export function collectErrors(
  raw: Record<string, unknown>,
  validate: FirstProblem,
  limit = 64,
): FieldErrors {
  const errors: FieldErrors = {};
  const work = structuredClone(raw);
  for (let i = 0; i < limit; i++) {
    const r = validate(work);
    if (r.ok) break;
    const path = r.path === "" ? "scenario" : r.path;
    if (errors[path] !== undefined) break;
    errors[path] = r.message;
    if (
      path === "scenario" ||
      path === "rivals" ||
      !setAtPath(work, r.path, placeholderFor(r.path))
    )
      break;
  }
  return errors;
}

/** Every problem of a single contest (the solver's validateScenario), one per field. */
export function contestErrors(raw: Record<string, unknown>, limit = 64): FieldErrors {
  return collectErrors(raw, validateScenario, limit);
}

export function zodPath(path: readonly PropertyKey[]): string {
  return path.map((p) => String(p)).join(".");
}
