/**
 * Comparative statics: how each rival's equilibrium effort and payoff respond to each
 * parameter. Analytic (Hillman & Riley 1989 closed form, differentiated) where it applies;
 * otherwise a checked numerical derivative (central differences with Richardson
 * extrapolation, step scaled to the parameter). Each row says which method produced it.
 */
import { normalize } from "../normalize";
import { solve } from "../solve";
import {
  formatParamPath,
  getParam,
  parseParamPath,
  withParam,
  type ParamPath,
} from "../sweep/params";
import { effortsOf } from "../sweep/point";
import type { Contest, Equilibrium, EquilibriumKind, Parsed, Scenario } from "../types";
import {
  hillmanRileyDerivatives,
  hillmanRileyStaticsState,
  type ActiveSetState,
} from "./hillmanRileyStatics";
import { richardson } from "./richardson";

export interface StaticsSeries {
  /** derivative per rival */
  d: number[];
  /** elasticity d ln(y) / d ln(param) per rival; null where the rival's value is 0 */
  elasticity: (number | null)[];
}

export interface StaticsRow {
  param: string;
  label: string;
  method: "analytic" | "numeric";
  /** the parameter's value at the base point */
  at: number;
  effort: StaticsSeries;
  payoff: StaticsSeries;
  totalEffort: { d: number; elasticity: number | null };
  /** numeric rows: largest estimated absolute error of the effort derivatives */
  errorEstimate?: number;
  note?: string;
}

export interface StaticsResult {
  names: string[];
  kind: EquilibriumKind;
  efforts: number[];
  payoffs: number[];
  totalEffort: number;
  rows: StaticsRow[];
}

export interface StaticsOptions {
  /** "auto" (default) uses the analytic form where it applies; "numeric" forces numbers */
  method?: "auto" | "numeric";
  /** restrict to these parameter paths (default: every parameter, budgets only where binding) */
  params?: string[];
  /**
   * The scenario's equilibrium when the caller has solved it already (it must be
   * `solve(normalize(scenario)).equilibrium`): saves solving it a second time.
   */
  equilibrium?: Equilibrium;
}

const BINDING = 1e-9;

export const STATICS_MAX_RIVALS = 200;

function elasticity(d: number, x: number, y: number): number | null {
  if (y === 0 || !Number.isFinite(y) || !Number.isFinite(x)) return null;
  return (d * x) / y;
}

function series(d: number[], x: number, ys: number[]): StaticsSeries {
  return { d, elasticity: d.map((di, i) => elasticity(di, x, ys[i] as number)) };
}

function label(scenario: Scenario, p: ParamPath): string {
  if (p.kind === "prize") return "Prize";
  if (p.kind === "csf") return p.field === "decisiveness" ? "Decisiveness r" : "Logit scale k";
  const name = scenario.rivals[p.index]?.name ?? `rival ${p.index}`;
  const what = {
    cost: "Cost",
    value: "Value",
    weight: "Weight",
    budget: "Budget",
    decisiveness: "Decisiveness",
  };
  return `${what[p.field]} of ${name}`;
}

function defaultParams(scenario: Scenario, contest: Contest, efforts: number[]): ParamPath[] {
  const out: ParamPath[] = [];
  scenario.rivals.forEach((spec, index) => {
    out.push({ kind: "rival", index, field: "cost" });
    out.push({ kind: "rival", index, field: "value" });
    // The all-pay auction has no head-start parameter in this model (highest effort wins).
    if (scenario.csf.kind !== "allpay") out.push({ kind: "rival", index, field: "weight" });
    const cap = contest.rivals[index]!.maxEffort;
    if (Number.isFinite(cap) && efforts[index]! >= cap * (1 - BINDING)) {
      out.push({ kind: "rival", index, field: "budget" });
    }
    if (
      scenario.csf.kind === "ratio" &&
      spec.decisiveness !== null &&
      spec.decisiveness !== undefined
    ) {
      out.push({ kind: "rival", index, field: "decisiveness" });
    }
  });
  out.push({ kind: "prize" });
  if (scenario.csf.kind === "ratio") out.push({ kind: "csf", field: "decisiveness" });
  if (scenario.csf.kind === "logit") out.push({ kind: "csf", field: "scale" });
  return out;
}

/** d(efforts), d(payoffs) for one analytic parameter, or null when the formula does not cover it. */
function analyticRow(
  scenario: Scenario,
  contest: Contest,
  s: ActiveSetState,
  efforts: number[],
  p: ParamPath,
): { de: number[]; du: number[] } | null {
  const n = contest.rivals.length;
  const forRival = (j: number, field: "cost" | "value" | "weight") => {
    const r = contest.rivals[j]!;
    const aj = s.a[j]!;
    const g = field === "cost" ? aj / r.cost : field === "value" ? -aj / r.value : -aj / r.weight;
    const { de, du } = hillmanRileyDerivatives(contest, s, j);
    const dE = de.map((x) => x * g);
    const dU = du.map((x) => x * g);
    if (field === "value" && s.active[j]) dU[j]! += (1 - aj * s.Y) ** 2;
    if (field === "weight") dE[j]! -= efforts[j]! / r.weight;
    return { de: dE, du: dU };
  };
  if (p.kind === "rival") {
    if (p.field === "cost" || p.field === "value" || p.field === "weight")
      return forRival(p.index, p.field);
    return null;
  }
  if (p.kind === "prize") {
    const de = new Array<number>(n).fill(0);
    const du = new Array<number>(n).fill(0);
    scenario.rivals.forEach((spec, j) => {
      if (spec.value !== null && spec.value !== undefined) return;
      const part = forRival(j, "value");
      for (let i = 0; i < n; i++) {
        de[i]! += part.de[i]!;
        du[i]! += part.du[i]!;
      }
    });
    return { de, du };
  }
  return null;
}

/** Vector [efforts..., payoffs..., total] at one parameter value, plus its active set. */
function evaluator(scenario: Scenario, p: ParamPath, n: number) {
  const seen: string[] = [];
  const f = (x: number): number[] => {
    const eq = solve(normalize(withParam(scenario, p, x))).equilibrium;
    const e = effortsOf(eq);
    seen.push(`${eq.kind}:${eq.active.map((b) => (b ? 1 : 0)).join("")}`);
    if (!e || !eq.payoffs) return new Array<number>(2 * n + 1).fill(NaN);
    return [...e, ...eq.payoffs, e.reduce((a, b) => a + b, 0)];
  };
  return { f, seen };
}

export function comparativeStatics(
  scenario: Scenario,
  opts: StaticsOptions = {},
): Parsed<StaticsResult> {
  const contest = normalize(scenario);
  const eq = opts.equilibrium ?? solve(contest).equilibrium;
  const efforts = effortsOf(eq);
  if (!efforts || !eq.payoffs) {
    return {
      ok: false,
      path: "csf",
      message: "no equilibrium is known for this scenario, so there is nothing to differentiate",
    };
  }
  if (eq.kind === "mixed" && eq.approximate) {
    // a learning method's expected spends move by up to its certified gap between nearby
    // scenarios: a finite difference of them would be noise (and each point a costly solve)
    return {
      ok: false,
      path: "csf",
      message:
        "the equilibrium here is an approximate mixed one (fictitious play with a certified gap), too coarse to differentiate, so no comparative statics are shown",
    };
  }
  const payoffs = eq.payoffs;
  const n = contest.rivals.length;
  const total = efforts.reduce((a, b) => a + b, 0);

  let params: ParamPath[];
  if (opts.params) {
    params = [];
    for (const path of opts.params) {
      const p = parseParamPath(scenario, path);
      if (!p.ok) return p;
      params.push(p.value);
    }
  } else if (n > STATICS_MAX_RIVALS) {
    // Every parameter of every rival means O(n^2) numbers: make the caller choose.
    return {
      ok: false,
      path: "rivals",
      message: `comparative statics over every parameter are limited to ${STATICS_MAX_RIVALS} rivals (got ${n}); choose parameters explicitly`,
    };
  } else {
    params = defaultParams(scenario, contest, efforts);
  }

  const state = opts.method === "numeric" ? null : hillmanRileyStaticsState(contest, efforts);
  const baseSignature = `${eq.kind}:${eq.active.map((b) => (b ? 1 : 0)).join("")}`;
  const rows: StaticsRow[] = [];
  for (const p of params) {
    const x = getParam(scenario, p);
    const common = { param: formatParamPath(p), label: label(scenario, p), at: x };
    const exact = state ? analyticRow(scenario, contest, state, efforts, p) : null;
    if (exact) {
      const dTotal = exact.de.reduce((a, b) => a + b, 0);
      rows.push({
        ...common,
        method: "analytic",
        effort: series(exact.de, x, efforts),
        payoff: series(exact.du, x, payoffs),
        totalEffort: { d: dTotal, elasticity: elasticity(dTotal, x, total) },
      });
      continue;
    }
    if (!Number.isFinite(x)) continue; // an uncapped budget has no derivative to report
    const { f, seen } = evaluator(scenario, p, n);
    const step = x > 0 ? 1e-3 * x : 1e-6 * scenario.prize;
    const nd = richardson(f, x, { step, lowerBound: 0, base: [...efforts, ...payoffs, total] });
    const de = nd.d.slice(0, n);
    const du = nd.d.slice(n, 2 * n);
    const dTotal = nd.d[2 * n]!;
    const kink = seen.some((sig) => sig !== baseSignature);
    const missing = nd.d.some((d) => Number.isNaN(d));
    rows.push({
      ...common,
      method: "numeric",
      effort: series(de, x, efforts),
      payoff: series(du, x, payoffs),
      totalEffort: { d: dTotal, elasticity: elasticity(dTotal, x, total) },
      errorEstimate: Math.max(0, ...nd.error.slice(0, n)),
      ...(missing
        ? { note: "no equilibrium is known at a nearby parameter value, so there is no derivative" }
        : kink
          ? {
              note: "the active set or equilibrium kind changes within the step: a kink, read as one-sided",
            }
          : nd.scheme === "forward"
            ? { note: "forward difference (parameter at its lower bound)" }
            : {}),
    });
  }
  return {
    ok: true,
    value: {
      names: contest.rivals.map((r) => r.name),
      kind: eq.kind,
      efforts,
      payoffs,
      totalEffort: total,
      rows,
    },
  };
}
