/** Best-response curves of a two-rival contest, for the reaction-curve chart. */
import { bestResponse } from "@contend/solver";
import type { Contest } from "@contend/solver";

export interface CurvePoint {
  e0: number;
  e1: number;
}

/** A plot range that shows the equilibrium with room around it. */
export function curveRange(
  contest: Contest,
  equilibrium: readonly number[] | null,
  profile: readonly number[] | null,
): number {
  const stakes = Math.max(...contest.rivals.map((r) => r.value / r.cost));
  const eqMax = equilibrium ? Math.max(...equilibrium) : 0;
  const pfMax = profile ? Math.max(...profile) : 0;
  const base = eqMax > 0 ? eqMax * 2.2 : stakes / 2;
  return Math.max(base, pfMax * 1.15, 1e-9);
}

/**
 * curves[0]: rival 0's best reply to each effort of rival 1 (points (BR0(y), y));
 * curves[1]: rival 1's best reply to each effort of rival 0 (points (x, BR1(x))).
 */
export function bestResponseCurves(
  contest: Contest,
  max: number,
  points = 121,
): [CurvePoint[], CurvePoint[]] {
  const a: CurvePoint[] = [];
  const b: CurvePoint[] = [];
  for (let k = 0; k < points; k++) {
    const t = (max * k) / (points - 1);
    a.push({ e0: bestResponse(contest, 0, [0, t]).effort, e1: t });
    b.push({ e0: t, e1: bestResponse(contest, 1, [t, 0]).effort });
  }
  return [a, b];
}
