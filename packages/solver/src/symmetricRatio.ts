/**
 * Symmetric ratio-form contest (Tullock 1980): n rivals with common value v, cost m, weight w
 * and decisiveness r. The symmetric pure equilibrium is e* = r v (n - 1) / (m n^2), total
 * effort r v (n - 1) / (m n), dissipation r (n - 1) / n. It is an equilibrium if and only if
 * r <= n / (n - 1) (Baye, Kovenock & de Vries 1994, Public Choice 81; volume from memory):
 * beyond that bound a rival earns more by spending nothing.
 */
import type { Contest } from "./types";

/** True when every rival has the same value, cost, weight, decisiveness and budget. */
export function identicalRivals(contest: Contest): boolean {
  const [a, ...rest] = contest.rivals;
  if (!a) return false;
  return rest.every(
    (b) =>
      b.value === a.value &&
      b.cost === a.cost &&
      b.weight === a.weight &&
      b.r === a.r &&
      b.maxEffort === a.maxEffort,
  );
}

/** e* = r v (n-1) / (m n^2); the formula only, with no applicability check. */
export function symmetricRatioEffort(n: number, v: number, m: number, r: number): number {
  return (r * v * (n - 1)) / (m * n * n);
}

/** Existence bound of the symmetric pure equilibrium: r <= n / (n - 1). */
export function symmetricExistenceBound(n: number): number {
  return n / (n - 1);
}

/**
 * Efforts of the symmetric equilibrium, or null when it does not apply (not ratio form,
 * rivals not identical, fewer than two rivals, r above the existence bound, budget binding).
 */
export function symmetricRatioEquilibrium(contest: Contest): number[] | null {
  const n = contest.rivals.length;
  const a = contest.rivals[0];
  if (contest.csf.kind !== "ratio" || n < 2 || !a || !identicalRivals(contest)) return null;
  if (a.r > symmetricExistenceBound(n)) return null;
  const e = symmetricRatioEffort(n, a.value, a.cost, a.r);
  if (e > a.maxEffort) return null;
  return new Array<number>(n).fill(e);
}
