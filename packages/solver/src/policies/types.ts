import type { Contest } from "../types";

export type PolicySpec =
  | { kind: "equilibrium" }
  | { kind: "best-reply" }
  | { kind: "fictitious-play" }
  | {
      kind: "overspender";
      /** multiple of the equilibrium effort in round 1 (default 1.7) */
      factor?: number;
      /** relative noise: each round's effort is scaled by a uniform draw in [1 - noise, 1 + noise] */
      noise?: number;
      /** per-round multiplier of the excess over equilibrium, in (0, 1]; 1 = no learning */
      decay?: number;
    }
  /** a set amount of money every round (`spend`); the older form gives `effort` instead */
  | { kind: "fixed"; spend?: number; effort?: number };

export type PolicyKind = PolicySpec["kind"];

export interface PolicyContext {
  contest: Contest;
  /** index of the rival this policy plays */
  self: number;
  /** earlier rounds, oldest first; efforts in rival order */
  history: { efforts: number[] }[];
  /** effort granularity: the decision is rounded to a multiple of it */
  step?: number;
}

export interface RivalPolicy {
  spec: PolicySpec;
  seed: number;
  /** short display name */
  label: string;
  /** one sentence on how it plays */
  description: string;
  /** effort for the next round: a pure function of the context and the seed */
  decide(ctx: PolicyContext): number;
}
