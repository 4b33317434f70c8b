/**
 * Contest part of every scenario. The solver's `validateScenario` is the one contest validator;
 * these schemas only wrap it so that contest problems come back as zod issues with the right
 * path inside any larger message.
 */
import { z } from "zod";
import { validateScenario, validateUncertainScenario } from "@contend/solver";
import type { CsfSpec, RivalSpec, Scenario, UncertainScenario } from "@contend/solver";

/** "rivals.1.cost" -> ["rivals", 1, "cost"] (a validator's dotted path as a zod path). */
export function toPath(dotted: string): (string | number)[] {
  if (dotted === "") return [];
  return dotted.split(".").map((seg) => (/^\d+$/.test(seg) ? Number(seg) : seg));
}

/** Any value -> a validated contest scenario (title, prize, csf, rivals, leader, currency). */
export const contestScenarioSchema = z.unknown().transform((raw, ctx): Scenario => {
  const r = validateScenario(raw);
  if (r.ok) return r.value;
  ctx.addIssue({ code: "custom", message: r.message, path: toPath(r.path) });
  return z.NEVER;
});

/**
 * Any value -> a contest scenario whose prize, costs, values, weights and budgets may be ranges
 * (uniform or triangular), for uncertainty runs; same rules as contestScenarioSchema otherwise.
 */
export const uncertainScenarioSchema = z.unknown().transform((raw, ctx): UncertainScenario => {
  const r = validateUncertainScenario(raw);
  if (r.ok) return r.value;
  ctx.addIssue({ code: "custom", message: r.message, path: toPath(r.path) });
  return z.NEVER;
});

// A stand-in contest that is valid by itself, so that only the wrapped part can fail.
const PROBE = { title: "probe", prize: 1, csf: { kind: "ratio", decisiveness: 1 } } as const;
const PROBE_RIVAL = { name: "probe", cost: 1 } as const;

function stripPrefix(path: string, prefix: string): string {
  if (path === prefix) return "";
  return path.startsWith(`${prefix}.`) ? path.slice(prefix.length + 1) : path;
}

/** One rival as written in a scenario, checked by the same validator. */
export const rivalSpecSchema = z.unknown().transform((raw, ctx): RivalSpec => {
  const r = validateScenario({ ...PROBE, rivals: [raw] });
  if (r.ok) return r.value.rivals[0] as RivalSpec;
  ctx.addIssue({
    code: "custom",
    message: r.message,
    path: toPath(stripPrefix(r.path, "rivals.0")),
  });
  return z.NEVER;
});

/** A contest success function spec, checked by the same validator. */
export const csfSpecSchema = z.unknown().transform((raw, ctx): CsfSpec => {
  const r = validateScenario({ ...PROBE, csf: raw, rivals: [PROBE_RIVAL] });
  if (r.ok) return r.value.csf;
  ctx.addIssue({ code: "custom", message: r.message, path: toPath(stripPrefix(r.path, "csf")) });
  return z.NEVER;
});
