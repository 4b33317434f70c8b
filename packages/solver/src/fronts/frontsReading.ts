/**
 * Where each rival concentrates and where it concedes, read from an allocation of money. The
 * yardstick is the split in proportion to what each front is worth to the rival,
 * s_ik = S_i V_ik / sum_m V_im, which is Friedman's equilibrium when budgets are sunk and the
 * rivals are alike (Friedman 1958, Operations Research 6; from memory). A rival concentrates on
 * a front when it puts at least CONCENTRATE times that share of its money there, and concedes a
 * front when it puts less than CONCEDE of its money there (nothing, or a token). A reading aid
 * with thresholds chosen for display (common practice, no source), not a result of the model.
 */
import type { FrontsContest } from "./types";

export const CONCENTRATE = 1.25;
export const CONCEDE = 0.02;

export interface FrontReading {
  /** fronts (indices) where the rival spends well above its value-proportional share */
  concentrates: number[];
  /** fronts where it spends nothing or a token */
  concedes: number[];
}

export function readAllocation(
  fc: FrontsContest,
  spends: readonly (readonly number[])[],
): FrontReading[] {
  return fc.rivals.map((rv, i) => {
    const row = spends[i] ?? [];
    const total = row.reduce((a, b) => a + b, 0);
    const worth = rv.value.reduce((a, b) => a + b, 0);
    const out: FrontReading = { concentrates: [], concedes: [] };
    if (!(total > 0)) {
      out.concedes = fc.fronts.map((_, k) => k);
      return out;
    }
    row.forEach((s, k) => {
      const frac = s / total;
      if (frac < CONCEDE) out.concedes.push(k);
      else if (frac >= (CONCENTRATE * rv.value[k]!) / worth) out.concentrates.push(k);
    });
    return out;
  });
}
