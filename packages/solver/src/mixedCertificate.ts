/**
 * Certified Nash gap of n independent finite mixes in the ratio (r > 1) or logit form: for each
 * rival, its best pure deviation over [0, min(budget, value / cost)] (dense grid fine near
 * zero, the points just above the others' atoms, Brent refinement: gridMaximize) against the
 * others' mixes, minus its expected payoff, plus twice the quadrature error of the winning
 * chances in money (othersTotal.ts), so the reported gap is never below the true one up to the
 * grid search. Common practice, no source.
 */
import { effortCeiling, justAbove, type DiscreteMix } from "./discreteMixed";
import { gridMaximize } from "./gridMaximize";
import { FINE_STEP, othersTotal, rivalClasses } from "./othersTotal";
import type { Contest } from "./types";

export interface CertifyOptions {
  /** points of the dense grid that certifies the gap (default 2001) */
  certifyGridPoints?: number;
  /** lattice step of the winning-chance quadrature (default FINE_STEP) */
  step?: number;
}

export interface MixesCertificate {
  /** certified gap (money), quadrature error included */
  gap: number;
  /** each rival's own gain from its best pure deviation (money), quadrature error included */
  gains: number[];
  expectedEfforts: number[];
  shares: number[];
  payoffs: number[];
}

export function certifyMixes(
  contest: Contest,
  mixes: readonly DiscreteMix[],
  opts: CertifyOptions = {},
): MixesCertificate {
  const total = othersTotal(contest, mixes, opts.step ?? FINE_STEP);
  const n = contest.rivals.length;
  const expectedEfforts = new Array<number>(n);
  const shares = new Array<number>(n);
  const payoffs = new Array<number>(n);
  const gains = new Array<number>(n);
  // members of a class (same parameters, same mix object) face the same others: one check each
  rivalClasses(contest, mixes).members.forEach((members) => {
    const i = members[0]!;
    const rv = contest.rivals[i]!;
    const own = mixes[i]!;
    let u = 0;
    let e = 0;
    own.efforts.forEach((x, k) => {
      const p = own.probabilities[k]!;
      if (p > 0) {
        u += p * total.payoff(i, x);
        e += p * x;
      }
    });
    const extra = [...own.efforts];
    for (const m of new Set(mixes.filter((_, j) => j !== i))) {
      extra.push(...justAbove(contest, m, 1e-3));
    }
    const dev = gridMaximize(
      (x) => total.payoff(i, x),
      effortCeiling(contest, i),
      opts.certifyGridPoints ?? 2001,
      extra,
    );
    for (const j of members) {
      gains[j] = Math.max(0, dev.fx - u + 2 * rv.value * total.error);
      expectedEfforts[j] = e;
      payoffs[j] = u;
      shares[j] = (u + rv.cost * e) / rv.value;
    }
  });
  return { gap: Math.max(0, ...gains), gains, expectedEfforts, shares, payoffs };
}
