/**
 * A live session over several fronts with one budget per rival (docs/protocol.md R45-R50):
 * the fronts scenario file (checked by the solver's `validateFrontsScenario`, the one set of
 * fronts rules) plus the same `session` object as a single contest, with the few rules a live
 * fronts session adds. `frontsRoster` is the single-contest summary of such a session that
 * every layer reads for names, budgets and currency (see its comment).
 */
import { z } from "zod";
import { validateFrontsScenario } from "@contend/solver";
import type { FrontsScenario, PolicyKind, Scenario } from "@contend/solver";
import { toPath } from "./contest";
import { LIMITS } from "./limits";
import { parseSettings } from "./settings";
import type { SessionSettings } from "./settings";

/** A session played over several fronts with one budget per rival. */
export type FrontsSessionScenario = FrontsScenario & { session: SessionSettings };

/** R49: the computer policies that play a whole allocation. */
export const FRONTS_POLICIES: readonly PolicyKind[] = ["equilibrium", "best-reply"];

/** The fronts form of sessionScenarioSchema's transform (the caller has run the text rule). */
export function frontsSessionScenario(
  raw: Record<string, unknown>,
  ctx: z.RefinementCtx,
): FrontsSessionScenario {
  const { session: rawSession, ...contestPart } = raw;
  const issue = (message: string, path: (string | number)[]) => {
    ctx.addIssue({ code: "custom", message, path });
    return z.NEVER;
  };
  const fronts = validateFrontsScenario(contestPart);
  if (!fronts.ok) return issue(fronts.message, toPath(fronts.path));
  const settings = parseSettings(rawSession, ctx);
  if (!settings) return z.NEVER;
  const scenario = fronts.value;
  const n = scenario.rivals.length;
  if (n < LIMITS.seatsMin || n > LIMITS.seatsMax) {
    return issue(
      `a live session needs ${LIMITS.seatsMin} to ${LIMITS.seatsMax} rivals (got ${n})`,
      ["rivals"],
    );
  }
  if (scenario.fronts.length > LIMITS.frontsMax) {
    return issue(
      `a live session takes at most ${LIMITS.frontsMax} fronts (got ${scenario.fronts.length})`,
      ["fronts"],
    );
  }
  if (settings.outcome !== "shares") {
    return issue('R45: every front is split by shares in a session with fronts; use "shares"', [
      "session",
      "outcome",
    ]);
  }
  if (settings.hidden) {
    return issue("R45: private numbers are not available in a session with fronts", [
      "session",
      "hidden",
    ]);
  }
  const names = new Set(scenario.rivals.map((r) => r.name));
  for (const [name, policy] of Object.entries(settings.computer)) {
    if (!names.has(name)) {
      return issue(`names no rival of this scenario (${JSON.stringify(name)})`, [
        "session",
        "computer",
        name,
      ]);
    }
    if (!FRONTS_POLICIES.includes(policy.kind)) {
      return issue(
        `R49: with fronts the computer plays ${FRONTS_POLICIES.join(" or ")} (got ${policy.kind})`,
        ["session", "computer", name, "kind"],
      );
    }
  }
  return { ...scenario, session: settings };
}

/**
 * The single-contest summary of a fronts session (R45): same title and currency, the prize is
 * the sum of the fronts' prizes, each rival has cost 1 (so its effort is its money) and its
 * total budget. Names, budgets and the money totals of resolved rounds read from it; it is
 * never solved as a contest (the fronts are, in the round's `fronts` record).
 */
export function frontsRoster(fronts: FrontsScenario): Scenario {
  return {
    title: fronts.title,
    prize: fronts.fronts.reduce((sum, f) => sum + f.prize, 0),
    csf: { kind: "ratio", decisiveness: 1 },
    rivals: fronts.rivals.map((r) => ({ name: r.name, cost: 1, budget: r.budget ?? null })),
    leader: null,
    ...(fronts.currency !== undefined ? { currency: fronts.currency } : {}),
  };
}
