/**
 * The logit form's interior best response (Hirshleifer 1989): with p = own winning chance,
 * the payoff v p - m e has at most one interior local maximum, where v k p (1 - p) = m with
 * p > 1/2, i.e. p = (1 + s) / 2 with s = sqrt(1 - a), a = 4 m / (v k). Its log-odds
 * ln(p / (1 - p)) = 2 ln(1 + s) - ln a (derived here from 1 - p = a / (2 (1 + s))) stay finite
 * when a is below double precision (k v / m >= ~1e16), where p itself rounds to 1.
 */

/** ln(p / (1 - p)) at the interior maximum, or null when a >= 1 (no interior maximum). */
export function logitInteriorLogOdds(value: number, cost: number, scale: number): number | null {
  const lnA = Math.log(4) + Math.log(cost) - Math.log(value) - Math.log(scale);
  if (!(lnA < 0)) return null;
  const s = Math.sqrt(-Math.expm1(lnA));
  return 2 * Math.log1p(s) - lnA;
}
