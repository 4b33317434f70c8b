/**
 * The explorer's whole state, kept in ?s= so that a copied link reproduces the view:
 *   sc  the contest scenario (the CLI file format, leader included)
 *   sw  the sweep axis {param, from, to, steps}
 *   pf  a clicked effort profile (two-rival best-response chart)
 *   rg  ranges switched on for the uncertainty panel, by field path (absent when none)
 */
import { getParam, MAX_STEPS_1D, parseParamPath, validateScenario } from "@contend/solver";
import type { AxisSpec, Scenario } from "@contend/solver";
import { rangeFields, type RangeForm, type RangeText } from "./rangeForm";
import { decodeState, encodeState } from "./urlState";

export interface ExplorerState {
  sc: Scenario;
  sw: AxisSpec;
  pf: number[] | null;
  rg?: RangeForm | null;
}

export const DEFAULT_SCENARIO: Scenario = {
  title: "Two rivals, one prize",
  prize: 100,
  currency: "$",
  csf: { kind: "ratio", decisiveness: 1 },
  rivals: [
    { name: "Rival A", cost: 5 },
    { name: "Rival B", cost: 2 },
  ],
  leader: null,
};

/** Sweep parameters a scenario offers, with labels for the picker. */
export function sweepParams(s: Scenario): { path: string; label: string }[] {
  const out: { path: string; label: string }[] = [{ path: "prize", label: "Prize" }];
  if (s.csf.kind === "ratio") out.push({ path: "csf.decisiveness", label: "Decisiveness r" });
  if (s.csf.kind === "logit") out.push({ path: "csf.scale", label: "Logit scale k" });
  s.rivals.forEach((r, i) => {
    out.push({ path: `rivals.${i}.cost`, label: `Cost of ${r.name}` });
    out.push({ path: `rivals.${i}.value`, label: `Value to ${r.name}` });
    out.push({ path: `rivals.${i}.weight`, label: `Weight of ${r.name}` });
    out.push({ path: `rivals.${i}.budget`, label: `Budget of ${r.name}` });
    if (s.csf.kind === "ratio")
      out.push({ path: `rivals.${i}.decisiveness`, label: `Own r of ${r.name}` });
  });
  return out;
}

function round(x: number): number {
  return Number(x.toPrecision(6));
}

/**
 * A sensible axis for a parameter: a quarter to four times its current value (decisiveness
 * up to 2, the validator's cap respected), or up to twice the prize for an uncapped budget.
 */
export function defaultAxis(s: Scenario, param: string, steps = 61): AxisSpec {
  const p = parseParamPath(s, param);
  if (!p.ok) return defaultAxis(s, s.rivals.length > 1 ? "rivals.1.cost" : "prize", steps);
  const at = getParam(s, p.value);
  if (param.endsWith("decisiveness")) return { param, from: 0.1, to: 2, steps };
  if (!Number.isFinite(at)) return { param, from: 0, to: round(2 * s.prize), steps };
  if (param.endsWith("budget")) return { param, from: 0, to: round(Math.max(at, 1) * 2), steps };
  return { param, from: round(at / 4), to: round(at * 4), steps };
}

export function initialState(s: Scenario = DEFAULT_SCENARIO): ExplorerState {
  return { sc: s, sw: defaultAxis(s, s.rivals.length > 1 ? "rivals.1.cost" : "prize"), pf: null };
}

function isAxis(x: unknown): x is AxisSpec {
  if (typeof x !== "object" || x === null) return false;
  const a = x as Record<string, unknown>;
  return (
    typeof a.param === "string" &&
    typeof a.from === "number" &&
    typeof a.to === "number" &&
    Number.isInteger(a.steps) &&
    (a.steps as number) >= 1 &&
    (a.steps as number) <= MAX_STEPS_1D
  );
}

/** Only the ranges that are switched on travel in the link. */
function rangesOn(rg: RangeForm | null | undefined): RangeForm | null {
  const on = Object.entries(rg ?? {}).filter(([, r]) => r.on);
  return on.length === 0 ? null : Object.fromEntries(on);
}

export function encodeExplorer(state: ExplorerState): string {
  const rg = rangesOn(state.rg);
  return encodeState({
    sc: state.sc,
    sw: state.sw,
    ...(state.pf === null ? {} : { pf: state.pf }),
    ...(rg === null ? {} : { rg }),
  });
}

function isRangeText(x: unknown): x is RangeText {
  if (typeof x !== "object" || x === null) return false;
  const r = x as Record<string, unknown>;
  return (
    r.on === true &&
    (r.dist === "uniform" || r.dist === "triangular") &&
    ["low", "mode", "high"].every((k) => typeof r[k] === "string" && (r[k] as string).length < 40)
  );
}

/** Ranges from a link: well-formed entries for fields this scenario has; anything else dropped. */
function decodeRanges(x: unknown, sc: Scenario): RangeForm | null {
  if (typeof x !== "object" || x === null) return null;
  const paths = new Set(rangeFields(sc).map((f) => f.path));
  const out: RangeForm = {};
  for (const [path, r] of Object.entries(x as Record<string, unknown>)) {
    if (paths.has(path) && isRangeText(r)) out[path] = { ...r };
  }
  return Object.keys(out).length === 0 ? null : out;
}

/**
 * Reads ?s=. The scenario must pass the solver's validator; a missing or broken axis or
 * profile falls back to defaults rather than discarding the scenario.
 */
export function decodeExplorer(text: string | null | undefined): ExplorerState | null {
  const raw = decodeState(text);
  if (typeof raw !== "object" || raw === null) return null;
  const obj = raw as Record<string, unknown>;
  const sc = validateScenario(obj.sc);
  if (!sc.ok) return null;
  const base = initialState(sc.value);
  const sw = isAxis(obj.sw) && parseParamPath(sc.value, obj.sw.param).ok ? obj.sw : base.sw;
  const pf =
    Array.isArray(obj.pf) &&
    obj.pf.length === sc.value.rivals.length &&
    obj.pf.every((x) => typeof x === "number" && Number.isFinite(x) && x >= 0)
      ? (obj.pf as number[])
      : null;
  const rg = decodeRanges(obj.rg, sc.value);
  return { sc: sc.value, sw, pf, ...(rg === null ? {} : { rg }) };
}
