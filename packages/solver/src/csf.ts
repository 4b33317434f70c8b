/**
 * Contest success functions and the payoff bookkeeping built on them.
 * - Ratio form (Tullock 1980): p_i = w_i e_i^r_i / sum_j w_j e_j^r_j, with per-rival r_i.
 *   Convention: when every effort is zero the prize is split equally among all rivals (also when
 *   every w_i e_i^r_i underflows to zero in double precision, e.g. efforts near 1e-300).
 * - Logit / difference form (Hirshleifer 1989): p_i = w_i exp(k e_i) / sum_j w_j exp(k e_j),
 *   evaluated in log space (subtract the largest exponent) so large k*e never overflows.
 * - All-pay auction: the highest effort wins; rivals tied at the top split the prize.
 */
import type { Contest } from "./types";

/**
 * ln of rival i's weight in the success function at effort e: ln w_i + r_i ln e for the ratio
 * form (-Infinity at e = 0), ln w_i + k e for logit. Not defined for the all-pay auction.
 */
export function logWeight(contest: Contest, i: number, e: number): number {
  const rv = contest.rivals[i]!;
  const csf = contest.csf;
  if (csf.kind === "logit") return Math.log(rv.weight) + csf.scale * e;
  return e > 0 ? Math.log(rv.weight) + rv.r * Math.log(e) : -Infinity;
}

/** ln of the smallest positive double: below it w e^r is 0 in natural units. */
const LOG_MIN_POSITIVE = Math.log(Number.MIN_VALUE);

export function shares(contest: Contest, efforts: readonly number[]): number[] {
  const rivals = contest.rivals;
  const n = rivals.length;
  const out = new Array<number>(n).fill(0);
  if (n === 0) return out;
  const csf = contest.csf;
  if (csf.kind === "allpay") {
    let top = -Infinity;
    for (let i = 0; i < n; i++) top = Math.max(top, efforts[i] ?? 0);
    let ties = 0;
    for (let i = 0; i < n; i++) if ((efforts[i] ?? 0) === top) ties++;
    for (let i = 0; i < n; i++) out[i] = (efforts[i] ?? 0) === top ? 1 / ties : 0;
    return out;
  }
  const logs = new Array<number>(n);
  let top = -Infinity;
  for (let i = 0; i < n; i++) {
    const l = logWeight(contest, i, efforts[i] ?? 0);
    logs[i] = l;
    if (l > top) top = l;
  }
  if (top === -Infinity || (csf.kind === "ratio" && top < LOG_MIN_POSITIVE)) {
    // ratio form with every effort zero: equal split (documented convention). Efforts so small
    // that every w e^r underflows to 0 in double precision count as zero too, so shares agree
    // with the payoff and best-response code, which works in natural units.
    return out.fill(1 / n);
  }
  let sum = 0;
  for (let i = 0; i < n; i++) {
    const t = Math.exp(logs[i]! - top);
    out[i] = t;
    sum += t;
  }
  for (let i = 0; i < n; i++) out[i] = out[i]! / sum;
  return out;
}

/** u_i = v_i p_i - m_i e_i (risk neutral). */
export function payoffs(contest: Contest, efforts: readonly number[]): number[] {
  const p = shares(contest, efforts);
  return contest.rivals.map((rv, i) => rv.value * p[i]! - rv.cost * (efforts[i] ?? 0));
}

/** Total money spent: sum_i m_i e_i. */
export function expenditure(contest: Contest, efforts: readonly number[]): number {
  let s = 0;
  contest.rivals.forEach((rv, i) => {
    s += rv.cost * (efforts[i] ?? 0);
  });
  return s;
}

/** Rent dissipation: expenditure as a fraction of the prize. */
export function dissipation(contest: Contest, efforts: readonly number[]): number {
  return expenditure(contest, efforts) / contest.prize;
}
