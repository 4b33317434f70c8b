/**
 * Strict, dependency-free validation of a scenario file. Returns the first problem found as a
 * value with the dotted path of the offending field ("rivals.2.cost"); never throws for bad
 * input. The protocol package wraps this function, so it stays pure.
 */
import { validateProvenance } from "./calibrate/provenance";
import type { CsfSpec, InputError, Parsed, RivalSpec, Scenario } from "./types";

export const LIMITS = {
  titleMax: 200,
  nameMax: 80,
  currencyMax: 8,
  rivalsMax: 10_000,
  decisivenessMax: 20,
} as const;

const SCENARIO_FIELDS = [
  "title",
  "prize",
  "csf",
  "rivals",
  "leader",
  "currency",
  "provenance",
] as const;
const RIVAL_FIELDS = ["name", "cost", "value", "weight", "budget", "decisiveness"] as const;
const CSF_FIELDS: Record<CsfSpec["kind"], readonly string[]> = {
  ratio: ["kind", "decisiveness"],
  logit: ["kind", "scale"],
  allpay: ["kind"],
};

export function fail(path: string, message: string): InputError {
  return { ok: false, path, message };
}

export function isRecord(x: unknown): x is Record<string, unknown> {
  return typeof x === "object" && x !== null && !Array.isArray(x);
}

export function describe(x: unknown): string {
  if (typeof x === "string") return JSON.stringify(x.length > 40 ? `${x.slice(0, 40)}...` : x);
  if (typeof x === "number") return String(x);
  if (x === null) return "null";
  if (Array.isArray(x)) return "an array";
  return typeof x;
}

/** A title or name: a non-empty string of at most `max` characters; else the problem at `path`. */
export function checkText(x: unknown, path: string, max: number): Parsed<string> {
  if (typeof x !== "string" || x.trim() === "") {
    return fail(path, `must be a non-empty string (got ${describe(x)})`);
  }
  if (x.length > max) return fail(path, `must be at most ${max} characters (got ${x.length})`);
  return { ok: true, value: x };
}

/**
 * A scenario's optional `currency` label: absent stays undefined, null stays null, anything else
 * must be a string of at most LIMITS.currencyMax characters.
 */
export function checkCurrency(x: unknown): Parsed<string | null | undefined> {
  if (x === undefined || x === null) return { ok: true, value: x };
  if (typeof x !== "string" || x.length > LIMITS.currencyMax) {
    return fail(
      "currency",
      `must be a string of at most ${LIMITS.currencyMax} characters (got ${describe(x)})`,
    );
  }
  return { ok: true, value: x };
}

function join(prefix: string, key: string | number): string {
  return prefix === "" ? String(key) : `${prefix}.${key}`;
}

function unknownField(obj: Record<string, unknown>, allowed: readonly string[], prefix: string) {
  const extra = Object.keys(obj).filter((k) => !allowed.includes(k));
  if (extra.length === 0) return null;
  const first = extra[0] as string;
  const list = extra.map((k) => JSON.stringify(k)).join(", ");
  return fail(
    join(prefix, first),
    `unknown field${extra.length > 1 ? "s" : ""} ${list}; allowed: ${allowed.join(", ")}`,
  );
}

export type NumberRule = { min: number; minInclusive: boolean; max?: number };

export function checkNumber(x: unknown, path: string, rule: NumberRule): InputError | null {
  const range =
    (rule.minInclusive ? `>= ${rule.min}` : `> ${rule.min}`) +
    (rule.max === undefined ? "" : ` and <= ${rule.max}`);
  if (typeof x !== "number" || !Number.isFinite(x)) {
    return fail(path, `must be a finite number ${range} (got ${describe(x)})`);
  }
  const tooLow = rule.minInclusive ? x < rule.min : x <= rule.min;
  const tooHigh = rule.max !== undefined && x > rule.max;
  if (tooLow || tooHigh) return fail(path, `must be ${range} (got ${x})`);
  return null;
}

export const POSITIVE: NumberRule = { min: 0, minInclusive: false };
export const NON_NEGATIVE: NumberRule = { min: 0, minInclusive: true };
const DECISIVENESS: NumberRule = { min: 0, minInclusive: false, max: LIMITS.decisivenessMax };

/** Absent and null both mean "use the default". */
function optionalNumber(
  obj: Record<string, unknown>,
  key: string,
  path: string,
  rule: NumberRule,
): InputError | null {
  const x = obj[key];
  if (x === undefined || x === null) return null;
  return checkNumber(x, path, rule);
}

function validateCsf(x: unknown): Parsed<CsfSpec> {
  if (!isRecord(x)) return fail("csf", `must be an object like {"kind":"ratio","decisiveness":1}`);
  const kind = x.kind;
  if (kind !== "ratio" && kind !== "logit" && kind !== "allpay") {
    return fail("csf.kind", `must be "ratio", "logit" or "allpay" (got ${describe(kind)})`);
  }
  const extra = unknownField(x, CSF_FIELDS[kind], "csf");
  if (extra) return extra;
  if (kind === "ratio") {
    const bad = checkNumber(x.decisiveness, "csf.decisiveness", DECISIVENESS);
    return bad ?? { ok: true, value: { kind, decisiveness: x.decisiveness as number } };
  }
  if (kind === "logit") {
    const bad = checkNumber(x.scale, "csf.scale", POSITIVE);
    return bad ?? { ok: true, value: { kind, scale: x.scale as number } };
  }
  return { ok: true, value: { kind } };
}

function validateRival(x: unknown, i: number): Parsed<RivalSpec> {
  const path = `rivals.${i}`;
  if (!isRecord(x)) return fail(path, `must be an object with at least "name" and "cost"`);
  const extra = unknownField(x, RIVAL_FIELDS, path);
  if (extra) return extra;
  const named = checkText(x.name, `${path}.name`, LIMITS.nameMax);
  if (!named.ok) return named;
  const name = named.value;
  const bad =
    checkNumber(x.cost, `${path}.cost`, POSITIVE) ??
    optionalNumber(x, "value", `${path}.value`, POSITIVE) ??
    optionalNumber(x, "weight", `${path}.weight`, POSITIVE) ??
    optionalNumber(x, "budget", `${path}.budget`, NON_NEGATIVE) ??
    optionalNumber(x, "decisiveness", `${path}.decisiveness`, DECISIVENESS);
  if (bad) return bad;
  const rival: RivalSpec = { name, cost: x.cost as number };
  for (const key of ["value", "weight", "budget", "decisiveness"] as const) {
    const v = x[key];
    if (v === null) rival[key] = null;
    else if (typeof v === "number") rival[key] = v;
  }
  return { ok: true, value: rival };
}

/**
 * Checks an untrusted value (typically parsed JSON) against the scenario format and returns a
 * fresh, typed copy. Per-rival decisiveness is accepted for every form but only the ratio form
 * uses it, so switching a scenario's form never invalidates it.
 */
export function validateScenario(input: unknown): Parsed<Scenario> {
  if (!isRecord(input)) {
    return fail("", `scenario must be a JSON object (got ${describe(input)})`);
  }
  const extra = unknownField(input, SCENARIO_FIELDS, "");
  if (extra) return extra;

  const titled = checkText(input.title, "title", LIMITS.titleMax);
  if (!titled.ok) return titled;
  const title = titled.value;

  const badPrize = checkNumber(input.prize, "prize", POSITIVE);
  if (badPrize) return badPrize;

  const csf = validateCsf(input.csf);
  if (!csf.ok) return csf;

  const rivalsIn = input.rivals;
  if (!Array.isArray(rivalsIn)) {
    return fail("rivals", `must be an array of rivals (got ${describe(rivalsIn)})`);
  }
  if (rivalsIn.length < 1 || rivalsIn.length > LIMITS.rivalsMax) {
    return fail("rivals", `must have 1 to ${LIMITS.rivalsMax} rivals (got ${rivalsIn.length})`);
  }
  const rivals: RivalSpec[] = [];
  const seen = new Map<string, number>();
  for (let i = 0; i < rivalsIn.length; i++) {
    const r = validateRival(rivalsIn[i], i);
    if (!r.ok) return r;
    const prev = seen.get(r.value.name);
    if (prev !== undefined) {
      return fail(
        `rivals.${i}.name`,
        `duplicates the name of rivals.${prev} (${describe(r.value.name)})`,
      );
    }
    seen.set(r.value.name, i);
    rivals.push(r.value);
  }

  const scenario: Scenario = { title, prize: input.prize as number, csf: csf.value, rivals };

  const leader = input.leader;
  if (leader !== undefined && leader !== null) {
    if (typeof leader !== "string" || !seen.has(leader)) {
      return fail(
        "leader",
        `must be null or the name of one of the rivals (got ${describe(leader)})`,
      );
    }
    scenario.leader = leader;
  } else if (leader === null) {
    scenario.leader = null;
  }

  const currency = checkCurrency(input.currency);
  if (!currency.ok) return currency;
  if (currency.value !== undefined) scenario.currency = currency.value;

  if (input.provenance !== undefined && input.provenance !== null) {
    const provenance = validateProvenance(input.provenance);
    if (!provenance.ok) return provenance;
    scenario.provenance = provenance.value;
  } else if (input.provenance === null) {
    scenario.provenance = null;
  }

  return { ok: true, value: scenario };
}
