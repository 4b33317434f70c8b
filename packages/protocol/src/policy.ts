/**
 * Computer-played rival policies, mirroring the solver's `PolicySpec`. A compile-time check in
 * the tests keeps this schema and the solver type identical.
 */
import { z } from "zod";

export const policySpecSchema = z.discriminatedUnion("kind", [
  z.strictObject({ kind: z.literal("equilibrium") }),
  z.strictObject({ kind: z.literal("best-response") }),
  z.strictObject({ kind: z.literal("fictitious-play") }),
  z.strictObject({
    kind: z.literal("overspender"),
    factor: z.number().gt(0).max(10).optional(),
  }),
]);

export type PolicySpecInput = z.input<typeof policySpecSchema>;
