/**
 * Where a scenario's numbers came from. A calibrated scenario carries a summary of its
 * calibration (estimates with intervals and fit quality) in the optional `provenance` field of
 * the scenario file, so that it survives the editor, the explorer and a live session, and the
 * debrief can say that the numbers are estimates. Checked strictly like the rest of the file.
 */
import type { InputError, Parsed } from "../types";
import type {
  CalibrationProvenance,
  Provenance,
  ProvenanceEstimate,
  ProvenanceRivalEstimate,
} from "./provenanceTypes";

export type {
  CalibrationProvenance,
  Provenance,
  ProvenanceEstimate,
  ProvenanceRivalEstimate,
} from "./provenanceTypes";

export const PROVENANCE_LIMITS = { sourceMax: 200, nameMax: 80, rivalsMax: 10_000 } as const;

const FIELDS = [
  "kind",
  "source",
  "decisiveness",
  "headStarts",
  "revealedValues",
  "fit",
  "bootstrap",
];
const ESTIMATE_FIELDS = ["estimate", "low", "high"];
const FIT_FIELDS = ["r2", "rmse", "observations", "periods", "dropped"];
const BOOTSTRAP_FIELDS = ["seed", "resamples"];

function fail(path: string, message: string): InputError {
  return { ok: false, path, message };
}

function isRecord(x: unknown): x is Record<string, unknown> {
  return typeof x === "object" && x !== null && !Array.isArray(x);
}

function fields(x: unknown, allowed: readonly string[], path: string): InputError | null {
  if (!isRecord(x)) return fail(path, `must be an object with ${allowed.join(", ")}`);
  const extra = Object.keys(x).find((k) => !allowed.includes(k));
  if (extra !== undefined)
    return fail(`${path}.${extra}`, `unknown field; allowed: ${allowed.join(", ")}`);
  return null;
}

function numbers(
  x: Record<string, unknown>,
  keys: readonly string[],
  path: string,
): InputError | null {
  for (const k of keys) {
    const v = x[k];
    if (typeof v !== "number" || !Number.isFinite(v))
      return fail(`${path}.${k}`, "must be a finite number");
  }
  return null;
}

function estimate(x: unknown, path: string): Parsed<ProvenanceEstimate> {
  const bad =
    fields(x, ESTIMATE_FIELDS, path) ??
    numbers(x as Record<string, unknown>, ESTIMATE_FIELDS, path);
  if (bad) return bad;
  const e = x as Record<string, number>;
  return { ok: true, value: { estimate: e.estimate!, low: e.low!, high: e.high! } };
}

function rivalEstimates(x: unknown, path: string): Parsed<ProvenanceRivalEstimate[]> {
  if (!Array.isArray(x) || x.length > PROVENANCE_LIMITS.rivalsMax) {
    return fail(path, `must be an array of at most ${PROVENANCE_LIMITS.rivalsMax} entries`);
  }
  const out: ProvenanceRivalEstimate[] = [];
  for (let i = 0; i < x.length; i++) {
    const at = `${path}.${i}`;
    const bad = fields(x[i], ["rival", ...ESTIMATE_FIELDS], at);
    if (bad) return bad;
    const item = x[i] as Record<string, unknown>;
    const rival = item.rival;
    if (typeof rival !== "string" || rival === "" || rival.length > PROVENANCE_LIMITS.nameMax) {
      return fail(`${at}.rival`, `must be a name of 1 to ${PROVENANCE_LIMITS.nameMax} characters`);
    }
    const e = estimate({ estimate: item.estimate, low: item.low, high: item.high }, at);
    if (!e.ok) return e;
    out.push({ rival, ...e.value });
  }
  return { ok: true, value: out };
}

/** Checks an untrusted `provenance` field; `path` prefixes error paths. */
export function validateProvenance(x: unknown, path = "provenance"): Parsed<Provenance> {
  const bad = fields(x, FIELDS, path);
  if (bad) return bad;
  const p = x as Record<string, unknown>;
  if (p.kind !== "calibration") return fail(`${path}.kind`, `must be "calibration"`);
  const source = p.source;
  if (typeof source !== "string" || source.length > PROVENANCE_LIMITS.sourceMax) {
    return fail(
      `${path}.source`,
      `must be a string of at most ${PROVENANCE_LIMITS.sourceMax} characters`,
    );
  }
  const decisiveness = estimate(p.decisiveness, `${path}.decisiveness`);
  if (!decisiveness.ok) return decisiveness;
  const headStarts = rivalEstimates(p.headStarts, `${path}.headStarts`);
  if (!headStarts.ok) return headStarts;
  const revealedValues = rivalEstimates(p.revealedValues, `${path}.revealedValues`);
  if (!revealedValues.ok) return revealedValues;
  const badFit =
    fields(p.fit, FIT_FIELDS, `${path}.fit`) ??
    numbers(p.fit as Record<string, unknown>, FIT_FIELDS, `${path}.fit`);
  if (badFit) return badFit;
  const badBoot =
    fields(p.bootstrap, BOOTSTRAP_FIELDS, `${path}.bootstrap`) ??
    numbers(p.bootstrap as Record<string, unknown>, BOOTSTRAP_FIELDS, `${path}.bootstrap`);
  if (badBoot) return badBoot;
  const fit = p.fit as CalibrationProvenance["fit"];
  const boot = p.bootstrap as CalibrationProvenance["bootstrap"];
  return {
    ok: true,
    value: {
      kind: "calibration",
      source,
      decisiveness: decisiveness.value,
      headStarts: headStarts.value,
      revealedValues: revealedValues.value,
      fit: {
        r2: fit.r2,
        rmse: fit.rmse,
        observations: fit.observations,
        periods: fit.periods,
        dropped: fit.dropped,
      },
      bootstrap: { seed: boot.seed, resamples: boot.resamples },
    },
  };
}
