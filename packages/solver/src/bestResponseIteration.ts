/**
 * Gauss-Seidel best-response iteration (fictitious-play-free "tatonnement": each rival in
 * turn moves to its global best response to the others' current efforts, optionally damped).
 * A classic way to look for pure equilibria numerically; it can cycle, so the caller must
 * verify whatever it returns. Common practice, no source.
 */
import { bestResponseAgainst, oppositions } from "./bestResponse";
import type { Contest } from "./types";

export interface IterationOptions {
  sweeps?: number;
  /** weight on the new best response (1 = undamped) */
  damping?: number;
  /** stop when no effort moves by more than this fraction of its scale v_i/m_i */
  tolerance?: number;
}

/** The profile the iteration settles on, or null when it does not settle within the sweeps. */
export function bestResponseIteration(
  contest: Contest,
  start: readonly number[],
  opts: IterationOptions = {},
): number[] | null {
  const sweeps = opts.sweeps ?? 200;
  const damping = opts.damping ?? 1;
  const tol = opts.tolerance ?? 1e-12;
  const e = start.slice();
  const n = e.length;
  for (let s = 0; s < sweeps; s++) {
    let moved = 0;
    for (let i = 0; i < n; i++) {
      // oppositions is O(n); recomputing it per rival keeps the update exact
      const o = oppositions(contest, e)[i]!;
      const br = bestResponseAgainst(contest, i, o).effort;
      const next = damping === 1 ? br : e[i]! + damping * (br - e[i]!);
      const rv = contest.rivals[i]!;
      moved = Math.max(moved, Math.abs(next - e[i]!) / (rv.value / rv.cost));
      e[i] = next;
    }
    if (moved <= tol) return e;
  }
  return null;
}
