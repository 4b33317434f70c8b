/**
 * Addressing one numeric parameter of a scenario by a dotted path ("prize", "csf.decisiveness",
 * "csf.scale", "rivals.<i>.<field>"), the same paths the validator reports errors with. Used by
 * sweeps and comparative statics.
 */
import type { InputError, Parsed, RivalSpec, Scenario } from "../types";

export const RIVAL_PARAMS = ["cost", "value", "weight", "budget", "decisiveness"] as const;
export type RivalParam = (typeof RIVAL_PARAMS)[number];

export type ParamPath =
  | { kind: "prize" }
  | { kind: "csf"; field: "decisiveness" | "scale" }
  | { kind: "rival"; index: number; field: RivalParam };

function fail(path: string, message: string): InputError {
  return { ok: false, path, message };
}

export function formatParamPath(p: ParamPath): string {
  if (p.kind === "prize") return "prize";
  if (p.kind === "csf") return `csf.${p.field}`;
  return `rivals.${p.index}.${p.field}`;
}

/** Parses a path and checks that it exists in this scenario (right form, rival index in range). */
export function parseParamPath(scenario: Scenario, path: string): Parsed<ParamPath> {
  const parts = path.split(".");
  const usage = `use "prize", "csf.decisiveness", "csf.scale" or "rivals.<index>.<${RIVAL_PARAMS.join("|")}>"`;
  if (parts.length === 1 && parts[0] === "prize") return { ok: true, value: { kind: "prize" } };
  if (parts.length === 2 && parts[0] === "csf") {
    const field = parts[1];
    if (field === "decisiveness" && scenario.csf.kind === "ratio") {
      return { ok: true, value: { kind: "csf", field } };
    }
    if (field === "scale" && scenario.csf.kind === "logit") {
      return { ok: true, value: { kind: "csf", field } };
    }
    return fail(path, `the ${scenario.csf.kind} form has no parameter "${field}"`);
  }
  if (parts.length === 3 && parts[0] === "rivals") {
    const [, idx, field] = parts as [string, string, string];
    if (!/^\d+$/.test(idx)) return fail(path, `rival index must be a whole number; ${usage}`);
    const index = Number(idx);
    if (index >= scenario.rivals.length) {
      return fail(
        path,
        `there is no rival ${index} (indices run 0..${scenario.rivals.length - 1})`,
      );
    }
    if (!(RIVAL_PARAMS as readonly string[]).includes(field)) {
      return fail(path, `unknown rival parameter "${field}"; ${usage}`);
    }
    if (field === "decisiveness" && scenario.csf.kind !== "ratio") {
      return fail(path, `only the ratio form uses per-rival decisiveness`);
    }
    return { ok: true, value: { kind: "rival", index, field: field as RivalParam } };
  }
  return fail(path || "param", `unknown parameter path; ${usage}`);
}

/**
 * The value the model actually uses at this path, defaults resolved: a rival without its own
 * value competes for the prize, weight defaults to 1, a missing budget is Infinity and a missing
 * per-rival decisiveness is the form's.
 */
export function getParam(scenario: Scenario, p: ParamPath): number {
  if (p.kind === "prize") return scenario.prize;
  if (p.kind === "csf") {
    const csf = scenario.csf;
    if (p.field === "decisiveness" && csf.kind === "ratio") return csf.decisiveness;
    if (p.field === "scale" && csf.kind === "logit") return csf.scale;
    return NaN;
  }
  const r = scenario.rivals[p.index];
  if (!r) return NaN;
  switch (p.field) {
    case "cost":
      return r.cost;
    case "value":
      return r.value ?? scenario.prize;
    case "weight":
      return r.weight ?? 1;
    case "budget":
      return r.budget ?? Infinity;
    case "decisiveness":
      return r.decisiveness ?? (scenario.csf.kind === "ratio" ? scenario.csf.decisiveness : NaN);
  }
}

/** Returns a copy with one parameter replaced; shares every untouched rival object. */
export function withParam(scenario: Scenario, p: ParamPath, value: number): Scenario {
  if (p.kind === "prize") return { ...scenario, prize: value };
  if (p.kind === "csf") {
    const csf = scenario.csf;
    if (p.field === "decisiveness" && csf.kind === "ratio") {
      return { ...scenario, csf: { kind: "ratio", decisiveness: value } };
    }
    if (p.field === "scale" && csf.kind === "logit") {
      return { ...scenario, csf: { kind: "logit", scale: value } };
    }
    return scenario;
  }
  const rivals = scenario.rivals.slice();
  const old = rivals[p.index] as RivalSpec;
  rivals[p.index] = { ...old, [p.field]: value };
  return { ...scenario, rivals };
}

/** setParam(scenario, "rivals.1.cost", 2): a copy with that parameter set, or a typed path error. */
export function setParam(scenario: Scenario, path: string, value: number): Parsed<Scenario> {
  const p = parseParamPath(scenario, path);
  if (!p.ok) return p;
  if (typeof value !== "number" || Number.isNaN(value)) {
    return fail(path, `value must be a number (got ${String(value)})`);
  }
  return { ok: true, value: withParam(scenario, p.value, value) };
}
