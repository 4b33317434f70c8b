/**
 * Validation of scenarios whose prize, costs, values, weights or budgets may be ranges:
 * {"dist":"uniform","low":a,"high":b} or {"dist":"triangular","low":a,"mode":m,"high":b}.
 * Each range is checked here with the field's own number rule (positive, or non-negative for a
 * budget) and low <= mode <= high; everything else goes through `validateScenario` on a copy
 * with each range replaced by its low end, so point and range scenarios share one set of rules.
 */
import type { InputError, Parsed, Scenario } from "../types";
import {
  checkNumber,
  NON_NEGATIVE,
  POSITIVE,
  validateScenario,
  type NumberRule,
} from "../validate";
import { isDist } from "./dist";
import {
  UNCERTAIN_RIVAL_FIELDS,
  type Dist,
  type UncertainParam,
  type UncertainScenario,
} from "./types";

function fail(path: string, message: string): InputError {
  return { ok: false, path, message };
}

const FIELDS: Record<Dist["dist"], readonly string[]> = {
  uniform: ["dist", "low", "high"],
  triangular: ["dist", "low", "mode", "high"],
};

/** Checks one range at `path`; `rule` is the number rule of the field it stands for. */
export function validateDist(
  x: Record<string, unknown>,
  path: string,
  rule: NumberRule,
): Parsed<Dist> {
  const kind = x.dist;
  if (kind !== "uniform" && kind !== "triangular") {
    return fail(`${path}.dist`, `must be "uniform" or "triangular" (got ${JSON.stringify(kind)})`);
  }
  const extra = Object.keys(x).find((k) => !FIELDS[kind].includes(k));
  if (extra !== undefined) {
    return fail(
      `${path}.${extra}`,
      `unknown field in a ${kind} range; allowed: ${FIELDS[kind].join(", ")}`,
    );
  }
  for (const key of FIELDS[kind].slice(1)) {
    const bad = checkNumber(x[key], `${path}.${key}`, rule);
    if (bad) return bad;
  }
  const low = x.low as number;
  const high = x.high as number;
  if (kind === "uniform") {
    if (low > high) return fail(`${path}.high`, `must be >= low (got low ${low}, high ${high})`);
    return { ok: true, value: { dist: kind, low, high } };
  }
  const mode = x.mode as number;
  if (low > mode) return fail(`${path}.mode`, `must be >= low (got low ${low}, mode ${mode})`);
  if (mode > high) return fail(`${path}.high`, `must be >= mode (got mode ${mode}, high ${high})`);
  return { ok: true, value: { dist: kind, low, mode, high } };
}

type Raw = Record<string, unknown>;

function isRecord(x: unknown): x is Raw {
  return typeof x === "object" && x !== null && !Array.isArray(x);
}

/**
 * Checks an untrusted value against the scenario format with ranges allowed, and returns a
 * typed copy. A scenario without any range comes back exactly as `validateScenario` gives it.
 */
export function validateUncertainScenario(input: unknown): Parsed<UncertainScenario> {
  const params: UncertainParam[] = [];
  let probe: unknown = input;
  if (isRecord(input)) {
    const top: Raw = { ...input };
    if (isRecord(input.prize)) {
      const d = validateDist(input.prize, "prize", POSITIVE);
      if (!d.ok) return d;
      params.push({ path: "prize", rival: null, field: "prize", dist: d.value });
      top.prize = d.value.low;
    }
    if (Array.isArray(input.rivals)) {
      top.rivals = input.rivals.map((r: unknown) => (isRecord(r) ? { ...r } : r));
      const rivals = top.rivals as unknown[];
      for (let i = 0; i < rivals.length; i++) {
        const r = rivals[i];
        if (!isRecord(r)) continue;
        for (const field of UNCERTAIN_RIVAL_FIELDS) {
          const x = r[field];
          if (!isRecord(x)) continue;
          const path = `rivals.${i}.${field}`;
          const d = validateDist(x, path, field === "budget" ? NON_NEGATIVE : POSITIVE);
          if (!d.ok) return d;
          params.push({ path, rival: i, field, dist: d.value });
          r[field] = d.value.low;
        }
      }
    }
    probe = top;
  }
  const point = validateScenario(probe);
  if (!point.ok) return point;
  return { ok: true, value: withRanges(point.value, params) };
}

function withRanges(s: Scenario, params: UncertainParam[]): UncertainScenario {
  const out: UncertainScenario = { ...s, rivals: s.rivals.map((r) => ({ ...r })) };
  for (const p of params) {
    if (p.rival === null) out.prize = p.dist;
    else {
      const r = out.rivals[p.rival]!;
      if (p.field !== "prize") r[p.field] = p.dist;
    }
  }
  return out;
}

/** The uncertain parameters in a fixed order: prize, then each rival's cost, value, weight, budget. */
export function uncertainParams(s: UncertainScenario): UncertainParam[] {
  const out: UncertainParam[] = [];
  if (isDist(s.prize)) out.push({ path: "prize", rival: null, field: "prize", dist: s.prize });
  s.rivals.forEach((r, i) => {
    for (const field of UNCERTAIN_RIVAL_FIELDS) {
      const x = r[field];
      if (isDist(x)) out.push({ path: `rivals.${i}.${field}`, rival: i, field, dist: x });
    }
  });
  return out;
}
