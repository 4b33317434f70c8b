/**
 * The fronts explorer's state in ?s= (see urlState.ts for the encoding), so that a copied link
 * reproduces the view:
 *   sc  the fronts scenario (the CLI file format)
 *   sw  the sweep settings {param, from, to, steps, metric}, as typed (blank from/to = around
 *       the parameter's current value)
 * The scenario must pass the solver's validator; broken sweep settings fall back to defaults.
 */
import { frontsParamPaths, validateFrontsScenario } from "@contend/solver";
import type { FrontsContest, FrontsScenario, Scenario } from "@contend/solver";
import { encodeExplorer, initialState } from "./explorerState";
import { decodeState, encodeState } from "./urlState";

export interface FrontsSweepSettings {
  param: string;
  from: string;
  to: string;
  steps: string;
  /** "total", "front:<k>", "shadow" or "payoff" */
  metric: string;
}

export interface FrontsViewState {
  sc: FrontsScenario;
  sw: FrontsSweepSettings;
}

export function defaultSweepSettings(s: FrontsScenario): FrontsSweepSettings {
  return {
    param: frontsParamPaths(s)[0]?.path ?? "",
    from: "",
    to: "",
    steps: "21",
    metric: "front:0",
  };
}

export function encodeFronts(state: FrontsViewState): string {
  return encodeState({ sc: state.sc, sw: state.sw });
}

const TEXT_MAX = 40;

function isMetric(m: unknown, s: FrontsScenario): m is string {
  if (m === "total" || m === "shadow" || m === "payoff") return true;
  const k = typeof m === "string" ? /^front:(\d+)$/.exec(m) : null;
  return k !== null && Number(k[1]) < s.fronts.length;
}

/** Sweep settings that fit the scenario: unknown paths and metrics fall back to defaults. */
export function readSettings(x: unknown, s: FrontsScenario): FrontsSweepSettings {
  const base = defaultSweepSettings(s);
  if (typeof x !== "object" || x === null) return base;
  const o = x as Record<string, unknown>;
  const text = (v: unknown, fallback: string) =>
    typeof v === "string" && v.length <= TEXT_MAX ? v : fallback;
  const paths = new Set(frontsParamPaths(s).map((p) => p.path));
  return {
    param: typeof o.param === "string" && paths.has(o.param) ? o.param : base.param,
    from: text(o.from, base.from),
    to: text(o.to, base.to),
    steps: text(o.steps, base.steps),
    metric: isMetric(o.metric, s) ? o.metric : base.metric,
  };
}

/** Reads ?s=; null when absent or when the scenario does not validate. */
export function decodeFronts(text: string | null | undefined): FrontsViewState | null {
  const raw = decodeState(text);
  if (typeof raw !== "object" || raw === null) return null;
  const obj = raw as Record<string, unknown>;
  const sc = validateFrontsScenario(obj.sc);
  if (!sc.ok) return null;
  return { sc: sc.value, sw: readSettings(obj.sw, sc.value) };
}

/**
 * Front k as a single contest (its prize and form; each rival's cost, value and weight there).
 * Only equal to the front inside the whole game when no rival has a budget: then the fronts
 * are independent contests and each front's equilibrium, mixed ones included, is its own.
 */
export function frontAsContest(fc: FrontsContest, k: number, currency: string | null): Scenario {
  const f = fc.fronts[k]!;
  return {
    title: `${fc.title}: ${f.name}`,
    prize: f.prize,
    csf: f.csf,
    rivals: fc.rivals.map((r) => ({
      name: r.name,
      cost: r.cost[k]!,
      value: r.value[k]!,
      weight: r.weight[k]!,
    })),
    leader: null,
    ...(currency ? { currency } : {}),
  };
}

/** Link to the single-contest explorer showing front k alone (see frontAsContest). */
export function frontExplorerLink(fc: FrontsContest, k: number, currency: string | null): string {
  return `/explore?s=${encodeExplorer(initialState(frontAsContest(fc, k, currency)))}`;
}
