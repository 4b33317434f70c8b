/** Effort grid rules shared by sealed moves, computer moves and defaulted moves. */

/** Relative tolerance for "effort is a multiple of the step" and "within the budget". */
export const EFFORT_TOLERANCE = 1e-9;

/** True when effort = k * step for an integer k, within 1e-9 (relative to max(1, effort)). */
export function onStep(effort: number, step: number): boolean {
  const k = Math.round(effort / step);
  return Math.abs(effort - k * step) <= EFFORT_TOLERANCE * Math.max(1, Math.abs(effort));
}

/** True when the money an effort costs (cost x effort) is within the budget (money), within 1e-9. */
export function withinBudget(
  effort: number,
  cost: number,
  budget: number | null | undefined,
): boolean {
  if (budget === null || budget === undefined) return true;
  return cost * effort <= budget + EFFORT_TOLERANCE * Math.max(1, budget);
}
