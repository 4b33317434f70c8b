/**
 * Computer-played rival policies. The solver's `validatePolicySpec` is the one policy
 * validator; this schema wraps it so its problems arrive as zod issues with a path.
 */
import { z } from "zod";
import { validatePolicySpec } from "@contend/solver";
import type { PolicySpec } from "@contend/solver";

function toPath(dotted: string): string[] {
  return dotted === "" ? [] : dotted.split(".");
}

export const policySpecSchema = z.unknown().transform((raw, ctx): PolicySpec => {
  const r = validatePolicySpec(raw);
  if (r.ok) return r.value;
  ctx.addIssue({ code: "custom", message: r.message, path: toPath(r.path) });
  return z.NEVER;
});
