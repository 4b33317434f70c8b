/**
 * Packages a pure-strategy profile as an Equilibrium record, measuring its Nash gap with the
 * same global best-response search the rest of the solver uses (never assumed to be zero).
 */
import { nashGap } from "./bestResponse";
import { dissipation, shares } from "./csf";
import type { Contest, Equilibrium } from "./types";

export function pureEquilibrium(
  contest: Contest,
  efforts: number[],
  method: string,
  gridPoints?: number,
  note?: string,
): Equilibrium {
  const p = shares(contest, efforts);
  const eq: Equilibrium = {
    kind: "pure",
    efforts,
    shares: p,
    payoffs: contest.rivals.map((rv, i) => rv.value * p[i]! - rv.cost * efforts[i]!),
    totalEffort: efforts.reduce((s, e) => s + e, 0),
    dissipation: dissipation(contest, efforts),
    active: efforts.map((e) => e > 0),
    nashGap: nashGap(contest, efforts, gridPoints === undefined ? {} : { gridPoints }),
    method,
  };
  if (note !== undefined) eq.note = note;
  return eq;
}

/** A "no pure equilibrium" record: efforts, shares and payoffs are null. */
export function noPureEquilibrium(contest: Contest, method: string, note: string): Equilibrium {
  const n = contest.rivals.length;
  return {
    kind: "none-pure",
    efforts: null,
    shares: null,
    payoffs: null,
    totalEffort: 0,
    dissipation: 0,
    active: new Array<boolean>(n).fill(false),
    nashGap: Number.NaN,
    method,
    note,
  };
}
