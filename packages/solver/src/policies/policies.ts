/**
 * Computer-played rivals for drills. Each decision is a pure function of (seed, round, rival,
 * history), so a replayed session gives the same efforts.
 * - equilibrium: plays the solver's Nash equilibrium (draws from the mixed strategy when the
 *   equilibrium is mixed).
 * - best-reply: best response to the others' efforts last round (Cournot adjustment).
 * - fictitious-play: best response to the average of the others' past efforts (Brown 1951).
 * - overspender: spends a multiple of equilibrium, as laboratory subjects do on average
 *   (Sheremeta 2013, Journal of Economic Surveys 27, volume from memory: overbidding of about
 *   70% on average, heterogeneous, falling with repetition but rarely reaching equilibrium).
 * - fixed: a set spend (money) every round, i.e. effort spend / cost (older specs: a set effort).
 */
import { bestResponse } from "../bestResponse";
import { solve } from "../solve";
import { deriveSeed, mulberry32 } from "../rng";
import type { Contest, Equilibrium, InputError, Parsed } from "../types";
import type { PolicyContext, PolicySpec, RivalPolicy } from "./types";

export const OVERSPEND_DEFAULTS = { factor: 1.7, noise: 0.2, decay: 1 } as const;

export const POLICY_LABELS: Record<PolicySpec["kind"], { label: string; description: string }> = {
  equilibrium: {
    label: "Textbook strategist",
    description: "Plays the Nash equilibrium effort every round.",
  },
  "best-reply": {
    label: "Last-round reactor",
    description: "Plays the best response to what the others spent last round.",
  },
  "fictitious-play": {
    label: "Pattern learner",
    description:
      "Plays the best response to the average of everything the others have spent so far.",
  },
  overspender: {
    label: "Eager spender",
    description: "Spends well above equilibrium, as people typically do in contest experiments.",
  },
  fixed: { label: "Fixed budget", description: "Spends the same set amount every round." },
};

const cache = new WeakMap<Contest, Equilibrium>();

/** The solver's main equilibrium for a contest, computed once per contest object. */
function equilibriumOf(contest: Contest): Equilibrium {
  let eq = cache.get(contest);
  if (!eq) {
    eq = solve(contest).equilibrium;
    cache.set(contest, eq);
  }
  return eq;
}

/**
 * A reference profile: equilibrium efforts, else expected efforts of a mixed equilibrium, else
 * (no equilibrium known) the symmetric r = 1 formula e_i = v_i (n - 1) / (m_i n^2)
 * (Tullock 1980) as a plain starting point.
 */
export function referenceEfforts(contest: Contest): number[] {
  const eq = equilibriumOf(contest);
  const known = eq.efforts ?? eq.expectedEfforts;
  if (known) return known.slice();
  const n = contest.rivals.length;
  return contest.rivals.map((r) => Math.min(r.maxEffort, (r.value * (n - 1)) / (r.cost * n * n)));
}

/** Clamps to [0, budget], then rounds to the step without exceeding the budget. */
export function clampEffort(effort: number, budget: number, step?: number): number {
  let x = Math.min(Math.max(Number.isFinite(effort) ? effort : 0, 0), budget);
  if (step !== undefined && step > 0) {
    x = Math.round(x / step) * step;
    if (x > budget) x = Math.floor(budget / step) * step;
    x = Number(x.toPrecision(12)); // drop binary noise such as 0.30000000000000004
  }
  return x;
}

function rngFor(seed: number, ctx: PolicyContext) {
  return mulberry32(deriveSeed(seed, ctx.history.length, ctx.self));
}

function othersAverage(ctx: PolicyContext): number[] {
  const n = ctx.contest.rivals.length;
  const sum = new Array<number>(n).fill(0);
  for (const round of ctx.history) for (let j = 0; j < n; j++) sum[j]! += round.efforts[j] ?? 0;
  return sum.map((s) => s / ctx.history.length);
}

/** The effort of a finite mixed strategy at probability level u in [0, 1) (inverse CDF). */
export function drawPoint(
  points: readonly { effort: number; probability: number }[],
  u: number,
): number {
  let acc = 0;
  for (const p of points) {
    acc += p.probability;
    if (u < acc) return p.effort;
  }
  return points.at(-1)?.effort ?? 0;
}

function playEquilibrium(ctx: PolicyContext, seed: number): number {
  const eq = equilibriumOf(ctx.contest);
  const mixed = eq.strategies?.[ctx.self];
  if (eq.kind === "mixed" && mixed) {
    const rng = rngFor(seed, ctx);
    if (mixed.points) return drawPoint(mixed.points, rng());
    if (rng() < mixed.atomAtZero) return 0;
    // inverse of the conditional CDF ((x - low) / (high - low))^a: low + (high - low) u^(1/a)
    const shape = mixed.cdfExponent ?? 1;
    return mixed.low + (mixed.high - mixed.low) * Math.pow(rng(), 1 / shape);
  }
  const pure = eq.efforts?.[ctx.self];
  if (pure !== undefined) return pure;
  const last = ctx.history.at(-1);
  // No pure equilibrium and no mixed strategy to draw from: react to last round instead.
  if (last) return bestResponse(ctx.contest, ctx.self, last.efforts).effort;
  return referenceEfforts(ctx.contest)[ctx.self] ?? 0;
}

function decideRaw(spec: PolicySpec, seed: number, ctx: PolicyContext): number {
  switch (spec.kind) {
    case "equilibrium":
      return playEquilibrium(ctx, seed);
    case "best-reply": {
      const last = ctx.history.at(-1);
      if (!last) return playEquilibrium(ctx, seed);
      return bestResponse(ctx.contest, ctx.self, last.efforts).effort;
    }
    case "fictitious-play": {
      if (ctx.history.length === 0) return playEquilibrium(ctx, seed);
      return bestResponse(ctx.contest, ctx.self, othersAverage(ctx)).effort;
    }
    case "overspender": {
      const factor = spec.factor ?? OVERSPEND_DEFAULTS.factor;
      const noise = spec.noise ?? OVERSPEND_DEFAULTS.noise;
      const decay = spec.decay ?? OVERSPEND_DEFAULTS.decay;
      const base = referenceEfforts(ctx.contest)[ctx.self] ?? 0;
      const excess = (factor - 1) * decay ** ctx.history.length;
      const jitter = 1 + noise * (2 * rngFor(seed, ctx)() - 1);
      return base * (1 + excess) * jitter;
    }
    case "fixed": {
      const cost = ctx.contest.rivals[ctx.self]?.cost ?? 1;
      return spec.spend !== undefined ? spec.spend / cost : (spec.effort ?? 0);
    }
  }
}

export function createPolicy(spec: PolicySpec, seed: number): RivalPolicy {
  const { label, description } = POLICY_LABELS[spec.kind];
  return {
    spec,
    seed,
    label,
    description,
    decide(ctx) {
      const budget = ctx.contest.rivals[ctx.self]?.maxEffort ?? Infinity;
      return clampEffort(decideRaw(spec, seed, ctx), budget, ctx.step);
    },
  };
}

function fail(path: string, message: string): InputError {
  return { ok: false, path, message };
}

function checkOptional(x: unknown, path: string, ok: (v: number) => boolean, rule: string) {
  if (x === undefined) return null;
  if (typeof x !== "number" || !Number.isFinite(x) || !ok(x)) {
    return fail(path, `must be a finite number ${rule} (got ${String(x)})`);
  }
  return null;
}

/** Strict check of an untrusted policy spec (same conventions as validateScenario). */
export function validatePolicySpec(input: unknown): Parsed<PolicySpec> {
  if (typeof input !== "object" || input === null || Array.isArray(input)) {
    return fail("", "policy must be an object with a kind");
  }
  const o = input as Record<string, unknown>;
  const allowed: Record<string, string[]> = {
    equilibrium: ["kind"],
    "best-reply": ["kind"],
    "fictitious-play": ["kind"],
    overspender: ["kind", "factor", "noise", "decay"],
    fixed: ["kind", "spend", "effort"],
  };
  const kind = o.kind;
  if (typeof kind !== "string" || !(kind in allowed)) {
    return fail("kind", `must be one of ${Object.keys(allowed).join(", ")} (got ${String(kind)})`);
  }
  const extra = Object.keys(o).find((k) => !allowed[kind]!.includes(k));
  if (extra) return fail(extra, `unknown field "${extra}" for policy ${kind}`);
  if (kind === "overspender") {
    const bad =
      checkOptional(o.factor, "factor", (v) => v > 0, "> 0") ??
      checkOptional(o.noise, "noise", (v) => v >= 0 && v <= 1, "in [0, 1]") ??
      checkOptional(o.decay, "decay", (v) => v > 0 && v <= 1, "in (0, 1]");
    if (bad) return bad;
  }
  if (kind === "fixed") {
    // money (spend) is the amount; the older specs give effort. Exactly one of them.
    const field = o.spend !== undefined ? "spend" : "effort";
    if (o.spend !== undefined && o.effort !== undefined) {
      return fail("effort", "give spend (money) or the older effort, not both");
    }
    const e = o[field];
    if (typeof e !== "number" || !Number.isFinite(e) || e < 0) {
      return fail(field, `must be a finite number >= 0 (got ${String(e)})`);
    }
  }
  return { ok: true, value: { ...o } as PolicySpec };
}
