/**
 * Strict validation of a fronts scenario (see ./types.ts). Each front's prize and contest form
 * are checked by the single-contest validator (one set of contest rules); the per-front rival
 * fields, the money budget and `sunkBudget` are checked here. The first problem comes back as a
 * value naming the field, e.g. `rivals.1.cost.2` or `rivals.0.sunkBudget`; never throws.
 */
import type { InputError, Parsed } from "../types";
import {
  LIMITS,
  POSITIVE,
  checkCurrency,
  checkNumber,
  checkText,
  describe,
  fail,
  isRecord,
  validateScenario,
} from "../validate";
import type { FrontSpec, FrontsRivalSpec, FrontsScenario, PerFront } from "./types";

/** Most fronts in one scenario. */
export const FRONTS_MAX = 200;
/**
 * Most all-pay fronts in one scenario: a best allocation tries every concede / tie / outbid
 * combination on them (up to 3^A, see allPayAllocation.ts).
 */
export const ALL_PAY_FRONTS_MAX = 8;

const SCENARIO_FIELDS = ["title", "fronts", "rivals", "currency"] as const;
const FRONT_FIELDS = ["name", "prize", "csf"] as const;
const RIVAL_FIELDS = ["name", "cost", "value", "weight", "budget", "sunkBudget"] as const;

function unknownField(obj: Record<string, unknown>, allowed: readonly string[], prefix: string) {
  const extra = Object.keys(obj).filter((k) => !allowed.includes(k));
  if (extra.length === 0) return null;
  const at = prefix === "" ? extra[0]! : `${prefix}.${extra[0]!}`;
  const why =
    prefix === "" && (extra[0] === "prize" || extra[0] === "csf")
      ? "is not used with fronts: each front has its own prize and csf"
      : prefix === "" && extra[0] === "leader"
        ? "is not supported with fronts (every rival moves at once)"
        : `unknown field; allowed: ${allowed.join(", ")}`;
  return fail(at, why);
}

function checkName(x: unknown, path: string): InputError | null {
  const named = checkText(x, path, LIMITS.nameMax);
  return named.ok ? null : named;
}

function checkPositive(x: unknown, path: string): InputError | null {
  return checkNumber(x, path, POSITIVE);
}

/** A number for every front or an array of exactly one positive number per front. */
function checkPerFront(x: unknown, path: string, k: number): Parsed<PerFront> {
  if (Array.isArray(x)) {
    if (x.length !== k) {
      return fail(
        path,
        `must be one number or an array with one entry per front (${k}), got ${x.length} entries`,
      );
    }
    for (let j = 0; j < k; j++) {
      const bad = checkPositive(x[j], `${path}.${j}`);
      if (bad) return bad;
    }
    return { ok: true, value: (x as number[]).slice() };
  }
  const bad = checkPositive(x, path);
  return bad ?? { ok: true, value: x as number };
}

function validateFront(x: unknown, k: number): Parsed<FrontSpec> {
  const path = `fronts.${k}`;
  if (!isRecord(x)) return fail(path, `must be an object with "name", "prize" and "csf"`);
  const extra = unknownField(x, FRONT_FIELDS, path);
  if (extra) return extra;
  const badName = checkName(x.name, `${path}.name`);
  if (badName) return badName;
  // the front's prize and form follow the single-contest rules exactly
  const probe = validateScenario({
    title: "front",
    prize: x.prize,
    csf: x.csf,
    rivals: [{ name: "probe", cost: 1 }],
  });
  if (!probe.ok) return fail(`${path}.${probe.path}`, probe.message);
  return {
    ok: true,
    value: { name: x.name as string, prize: probe.value.prize, csf: probe.value.csf },
  };
}

function validateRival(x: unknown, i: number, k: number): Parsed<FrontsRivalSpec> {
  const path = `rivals.${i}`;
  if (!isRecord(x)) return fail(path, `must be an object with at least "name" and "cost"`);
  const extra = unknownField(x, RIVAL_FIELDS, path);
  if (extra) return extra;
  const badName = checkName(x.name, `${path}.name`);
  if (badName) return badName;
  const cost = checkPerFront(x.cost, `${path}.cost`, k);
  if (!cost.ok) return cost;
  const rival: FrontsRivalSpec = { name: x.name as string, cost: cost.value };
  for (const key of ["value", "weight"] as const) {
    if (x[key] === undefined) continue;
    if (x[key] === null) {
      rival[key] = null;
      continue;
    }
    const v = checkPerFront(x[key], `${path}.${key}`, k);
    if (!v.ok) return v;
    rival[key] = v.value;
  }
  const budget = x.budget;
  if (budget !== undefined && budget !== null) {
    if (typeof budget !== "number" || !Number.isFinite(budget)) {
      return fail(
        `${path}.budget`,
        `must be a finite amount of money >= 0 (got ${describe(budget)})`,
      );
    }
    if (budget < 0) return fail(`${path}.budget`, `must be >= 0 (got ${budget})`);
    rival.budget = budget;
  } else if (budget === null) rival.budget = null;
  const sunk = x.sunkBudget;
  if (sunk !== undefined && sunk !== null) {
    if (typeof sunk !== "boolean") {
      return fail(`${path}.sunkBudget`, `must be true or false (got ${describe(sunk)})`);
    }
    if (sunk && (rival.budget === undefined || rival.budget === null)) {
      return fail(`${path}.sunkBudget`, "needs a budget: a sunk budget is money already committed");
    }
    rival.sunkBudget = sunk;
  }
  return { ok: true, value: rival };
}

/** True when a parsed JSON value is meant as a fronts scenario (it has a `fronts` field). */
export function isFrontsInput(input: unknown): boolean {
  return isRecord(input) && "fronts" in input;
}

export function validateFrontsScenario(input: unknown): Parsed<FrontsScenario> {
  if (!isRecord(input)) return fail("", `scenario must be a JSON object (got ${describe(input)})`);
  const extra = unknownField(input, SCENARIO_FIELDS, "");
  if (extra) return extra;
  const titled = checkText(input.title, "title", LIMITS.titleMax);
  if (!titled.ok) return titled;
  const title = titled.value;
  const frontsIn = input.fronts;
  if (!Array.isArray(frontsIn) || frontsIn.length < 1 || frontsIn.length > FRONTS_MAX) {
    return fail(
      "fronts",
      `must be an array of 1 to ${FRONTS_MAX} fronts (got ${Array.isArray(frontsIn) ? `${frontsIn.length}` : describe(frontsIn)})`,
    );
  }
  const fronts: FrontSpec[] = [];
  const frontNames = new Map<string, number>();
  for (let k = 0; k < frontsIn.length; k++) {
    const f = validateFront(frontsIn[k], k);
    if (!f.ok) return f;
    const prev = frontNames.get(f.value.name);
    if (prev !== undefined) {
      return fail(`fronts.${k}.name`, `duplicates the name of fronts.${prev}`);
    }
    frontNames.set(f.value.name, k);
    fronts.push(f.value);
    if (fronts.filter((x) => x.csf.kind === "allpay").length > ALL_PAY_FRONTS_MAX) {
      return fail(
        `fronts.${k}.csf.kind`,
        `at most ${ALL_PAY_FRONTS_MAX} fronts may be "allpay" (each rival's best allocation tries every concede, tie or outbid combination on them)`,
      );
    }
  }
  const rivalsIn = input.rivals;
  if (!Array.isArray(rivalsIn) || rivalsIn.length < 1 || rivalsIn.length > LIMITS.rivalsMax) {
    return fail(
      "rivals",
      `must be an array of 1 to ${LIMITS.rivalsMax} rivals (got ${Array.isArray(rivalsIn) ? `${rivalsIn.length}` : describe(rivalsIn)})`,
    );
  }
  const rivals: FrontsRivalSpec[] = [];
  const names = new Map<string, number>();
  for (let i = 0; i < rivalsIn.length; i++) {
    const r = validateRival(rivalsIn[i], i, fronts.length);
    if (!r.ok) return r;
    const prev = names.get(r.value.name);
    if (prev !== undefined)
      return fail(`rivals.${i}.name`, `duplicates the name of rivals.${prev}`);
    names.set(r.value.name, i);
    rivals.push(r.value);
  }
  const scenario: FrontsScenario = { title, fronts, rivals };
  const currency = checkCurrency(input.currency);
  if (!currency.ok) return currency;
  if (currency.value !== undefined) scenario.currency = currency.value;
  return { ok: true, value: scenario };
}
