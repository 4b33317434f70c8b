/**
 * Sweeps of one parameter of a fronts scenario: the equilibrium at evenly spaced values.
 * Paths: fronts.<k>.prize, fronts.<k>.csf.decisiveness (ratio), fronts.<k>.csf.scale (logit),
 * rivals.<i>.budget, rivals.<i>.<cost|value|weight>.<k> (k and i count from 0 in file order).
 * Every point is validated like a file, so a sweep never solves a scenario a file could not hold.
 */
import type { InputError, Parsed } from "../types";
import { solveFronts } from "./frontsEquilibrium";
import { normalizeFronts } from "./normalizeFronts";
import type { FrontsEquilibrium, FrontsScenario } from "./types";
import { validateFrontsScenario } from "./validateFronts";

export interface FrontsSweepSpec {
  param: string;
  from: number;
  to: number;
  /** points including both ends, 2..201 */
  steps: number;
}

export interface FrontsSweepPoint {
  value: number;
  equilibrium: FrontsEquilibrium;
}

export const FRONTS_SWEEP_MAX_STEPS = 201;

function fail(path: string, message: string): InputError {
  return { ok: false, path, message };
}

/** Every sweepable path of the scenario with a label, in a stable order. */
export function frontsParamPaths(s: FrontsScenario): { path: string; label: string }[] {
  const out: { path: string; label: string }[] = [];
  s.fronts.forEach((f, k) => {
    out.push({ path: `fronts.${k}.prize`, label: `${f.name}: prize` });
    if (f.csf.kind === "ratio")
      out.push({ path: `fronts.${k}.csf.decisiveness`, label: `${f.name}: decisiveness r` });
    if (f.csf.kind === "logit")
      out.push({ path: `fronts.${k}.csf.scale`, label: `${f.name}: logit scale k` });
  });
  s.rivals.forEach((r, i) => {
    out.push({ path: `rivals.${i}.budget`, label: `${r.name}: budget` });
    for (const field of ["cost", "value", "weight"] as const) {
      s.fronts.forEach((f, k) =>
        out.push({ path: `rivals.${i}.${field}.${k}`, label: `${r.name}: ${field} on ${f.name}` }),
      );
    }
  });
  return out;
}

/** A copy of the scenario with one parameter set (validated), or an error naming the path. */
export function withFrontsParam(
  s: FrontsScenario,
  path: string,
  value: number,
): Parsed<FrontsScenario> {
  const parts = path.split(".");
  const K = s.fronts.length;
  const copy: FrontsScenario = JSON.parse(JSON.stringify(s)) as FrontsScenario;
  const idx = (t: string | undefined, n: number) =>
    t !== undefined && /^\d+$/.test(t) && Number(t) < n ? Number(t) : -1;
  if (parts[0] === "fronts") {
    const k = idx(parts[1], K);
    const f = copy.fronts[k];
    if (!f) return fail(path, `no front ${parts[1]} (there are ${K})`);
    const rest = parts.slice(2).join(".");
    if (rest === "prize") f.prize = value;
    else if (rest === "csf.decisiveness" && f.csf.kind === "ratio")
      f.csf = { kind: "ratio", decisiveness: value };
    else if (rest === "csf.scale" && f.csf.kind === "logit")
      f.csf = { kind: "logit", scale: value };
    else
      return fail(
        path,
        "not a sweepable front parameter (prize, csf.decisiveness for ratio, csf.scale for logit)",
      );
  } else if (parts[0] === "rivals") {
    const i = idx(parts[1], s.rivals.length);
    const r = copy.rivals[i];
    if (!r) return fail(path, `no rival ${parts[1]} (there are ${s.rivals.length})`);
    const field = parts[2];
    if (field === "budget" && parts.length === 3) r.budget = value;
    else if ((field === "cost" || field === "value" || field === "weight") && parts.length === 4) {
      const k = idx(parts[3], K);
      if (k < 0) return fail(path, `no front ${parts[3]} (there are ${K})`);
      const fallback = (j: number) => (field === "value" ? s.fronts[j]!.prize : 1);
      const cur = r[field];
      const arr = Array.isArray(cur)
        ? cur.slice()
        : Array.from({ length: K }, (_, j) => (typeof cur === "number" ? cur : fallback(j)));
      arr[k] = value;
      r[field] = arr;
    } else
      return fail(path, "not a sweepable rival parameter (budget, or cost/value/weight.<front>)");
  } else return fail(path, "must start with fronts.<k> or rivals.<i>");
  const v = validateFrontsScenario(copy);
  return v.ok ? v : fail(path, `value ${value} is not allowed: ${v.path}: ${v.message}`);
}

export interface FrontsSweepOptions {
  /** called after each point with the points done and the total */
  onProgress?: (done: number, total: number) => void;
}

/** The equilibrium at `steps` evenly spaced values of one parameter. */
export function sweepFronts(
  s: FrontsScenario,
  spec: FrontsSweepSpec,
  opts: FrontsSweepOptions = {},
): Parsed<FrontsSweepPoint[]> {
  if (!Number.isInteger(spec.steps) || spec.steps < 2 || spec.steps > FRONTS_SWEEP_MAX_STEPS) {
    return fail(
      "steps",
      `must be an integer from 2 to ${FRONTS_SWEEP_MAX_STEPS} (got ${spec.steps})`,
    );
  }
  if (!Number.isFinite(spec.from) || !Number.isFinite(spec.to))
    return fail("from", "from and to must be finite numbers");
  const points: FrontsSweepPoint[] = [];
  for (let j = 0; j < spec.steps; j++) {
    const value = spec.from + ((spec.to - spec.from) * j) / (spec.steps - 1);
    const at = withFrontsParam(s, spec.param, value);
    if (!at.ok) return at;
    points.push({ value, equilibrium: solveFronts(normalizeFronts(at.value)).equilibrium });
    opts.onProgress?.(j + 1, spec.steps);
  }
  return { ok: true, value: points };
}
