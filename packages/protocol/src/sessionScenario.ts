/**
 * The body of POST /api/sessions: a contest scenario file plus an optional `session` object.
 * The contest part goes through the solver's validator (with `session` stripped first); the
 * settings go through zod; then the few cross-field rules of a live session are checked.
 */
import { z } from "zod";
import type { Scenario } from "@contend/solver";
import { contestScenarioSchema } from "./contest";
import { LIMITS } from "./limits";
import { parseSettings } from "./settings";
import type { SessionSettings } from "./settings";
import { findTextIssue } from "./text";
import { hiddenIssue } from "./hidden";
import { frontsSessionScenario } from "./frontsSession";
import type { FrontsSessionScenario } from "./frontsSession";

export type SessionScenario = Scenario & { session: SessionSettings };
/** What POST /api/sessions and session-created carry: one contest, or several fronts. */
export type AnySessionScenario = SessionScenario | FrontsSessionScenario;

export function isFrontsSession(s: AnySessionScenario): s is FrontsSessionScenario {
  return "fronts" in s;
}

function isRecord(x: unknown): x is Record<string, unknown> {
  return typeof x === "object" && x !== null && !Array.isArray(x);
}

export const sessionScenarioSchema = z.unknown().transform((raw, ctx): AnySessionScenario => {
  if (!isRecord(raw)) {
    ctx.addIssue({ code: "custom", message: "session scenario must be a JSON object", path: [] });
    return z.NEVER;
  }
  const text = findTextIssue(raw);
  if (text) {
    ctx.addIssue({ code: "custom", message: text.message, path: text.path });
    return z.NEVER;
  }
  if ("fronts" in raw) return frontsSessionScenario(raw, ctx);
  const { session: rawSession, ...contestPart } = raw;
  const contest = contestScenarioSchema.safeParse(contestPart);
  if (!contest.success) {
    for (const issue of contest.error.issues) {
      ctx.addIssue({ code: "custom", message: issue.message, path: issue.path });
    }
    return z.NEVER;
  }
  const settings = parseSettings(rawSession, ctx);
  if (!settings) return z.NEVER;
  const scenario = contest.data;
  const n = scenario.rivals.length;
  if (n < LIMITS.seatsMin || n > LIMITS.seatsMax) {
    ctx.addIssue({
      code: "custom",
      message: `a live session needs ${LIMITS.seatsMin} to ${LIMITS.seatsMax} rivals (got ${n})`,
      path: ["rivals"],
    });
    return z.NEVER;
  }
  if (scenario.leader !== undefined && scenario.leader !== null) {
    ctx.addIssue({
      code: "custom",
      message:
        "live rounds are simultaneous: set leader to null (leader-follower play is for the explorer)",
      path: ["leader"],
    });
    return z.NEVER;
  }
  const names = new Set(scenario.rivals.map((r) => r.name));
  for (const name of Object.keys(settings.computer)) {
    if (!names.has(name)) {
      ctx.addIssue({
        code: "custom",
        message: `names no rival of this scenario (${JSON.stringify(name)})`,
        path: ["session", "computer", name],
      });
      return z.NEVER;
    }
  }
  const hidden = settings.hidden ? hiddenIssue(scenario, settings.hidden) : null;
  if (hidden) {
    ctx.addIssue({ code: "custom", message: hidden.message, path: hidden.path });
    return z.NEVER;
  }
  return { ...scenario, session: settings };
});
