/**
 * Student's t distribution: cumulative probability and quantile, for confidence intervals of
 * least-squares estimates.
 *
 * F(t; df) = 1 - I_x(df/2, 1/2) / 2 for t >= 0 with x = df / (df + t^2) (Abramowitz & Stegun
 * 1964, 26.7.1 with 26.5.27), where I_x(a, b) is the regularised incomplete beta function,
 * evaluated by its continued fraction with the modified Lentz method (Press et al., Numerical
 * Recipes, 3rd ed. 2007, section 6.4; Lentz 1976). ln Gamma by the Lanczos approximation
 * (g = 7, nine coefficients; Press et al. 2007, section 6.1). The quantile inverts F by
 * safeguarded Newton steps inside a bracket that always holds the root.
 *
 * Policy: df must be finite and > 0, p in (0, 1); anything else is a bug and throws.
 */

const LANCZOS = [
  0.99999999999980993, 676.5203681218851, -1259.1392167224028, 771.32342877765313,
  -176.61502916214059, 12.507343278686905, -0.13857109526572012, 9.9843695780195716e-6,
  1.5056327351493116e-7,
];

/** ln Gamma(x) for x > 0. */
export function logGamma(x: number): number {
  if (x < 0.5) return Math.log(Math.PI / Math.sin(Math.PI * x)) - logGamma(1 - x);
  const z = x - 1;
  let a = LANCZOS[0]!;
  const t = z + 7.5;
  for (let k = 1; k < 9; k++) a += LANCZOS[k]! / (z + k);
  return 0.5 * Math.log(2 * Math.PI) + (z + 0.5) * Math.log(t) - t + Math.log(a);
}

function betaContinuedFraction(x: number, a: number, b: number): number {
  const tiny = 1e-300;
  let c = 1;
  let d = 1 - ((a + b) * x) / (a + 1);
  if (Math.abs(d) < tiny) d = tiny;
  d = 1 / d;
  let h = d;
  for (let m = 1; m <= 10_000; m++) {
    const m2 = 2 * m;
    let aa = (m * (b - m) * x) / ((a + m2 - 1) * (a + m2));
    d = 1 + aa * d;
    if (Math.abs(d) < tiny) d = tiny;
    c = 1 + aa / c;
    if (Math.abs(c) < tiny) c = tiny;
    d = 1 / d;
    h *= d * c;
    aa = (-(a + m) * (a + b + m) * x) / ((a + m2) * (a + m2 + 1));
    d = 1 + aa * d;
    if (Math.abs(d) < tiny) d = tiny;
    c = 1 + aa / c;
    if (Math.abs(c) < tiny) c = tiny;
    d = 1 / d;
    const del = d * c;
    h *= del;
    if (Math.abs(del - 1) < 1e-16) return h;
  }
  throw new Error(`incomplete beta did not converge (x=${x}, a=${a}, b=${b})`);
}

/** Regularised incomplete beta I_x(a, b) for x in [0, 1], a, b > 0. */
export function incompleteBeta(x: number, a: number, b: number): number {
  if (x <= 0) return 0;
  if (x >= 1) return 1;
  const lnFront =
    logGamma(a + b) - logGamma(a) - logGamma(b) + a * Math.log(x) + b * Math.log1p(-x);
  const front = Math.exp(lnFront);
  if (x < (a + 1) / (a + b + 2)) return (front * betaContinuedFraction(x, a, b)) / a;
  return 1 - (front * betaContinuedFraction(1 - x, b, a)) / b;
}

function checkDf(df: number): void {
  if (!(Number.isFinite(df) && df > 0))
    throw new RangeError(`degrees of freedom must be > 0 (got ${df})`);
}

/** P(T <= t) for T ~ Student t with df degrees of freedom. */
export function studentTCdf(t: number, df: number): number {
  checkDf(df);
  if (t === Infinity) return 1;
  if (t === -Infinity) return 0;
  const tail = 0.5 * incompleteBeta(df / (df + t * t), df / 2, 0.5);
  return t >= 0 ? 1 - tail : tail;
}

function studentTDensity(t: number, df: number): number {
  const ln =
    logGamma((df + 1) / 2) -
    logGamma(df / 2) -
    0.5 * Math.log(df * Math.PI) -
    ((df + 1) / 2) * Math.log1p((t * t) / df);
  return Math.exp(ln);
}

/** The t with P(T <= t) = p, for p in (0, 1). */
export function studentTQuantile(p: number, df: number): number {
  checkDf(df);
  if (!(p > 0 && p < 1)) throw new RangeError(`probability must be in (0, 1) (got ${p})`);
  if (p === 0.5) return 0;
  if (p < 0.5) return -studentTQuantile(1 - p, df);
  // Upper half: the root lies in [0, hi]; grow hi until it brackets.
  let lo = 0;
  let hi = 2;
  while (studentTCdf(hi, df) < p) {
    lo = hi;
    hi *= 2;
    if (hi > 1e300) return Infinity;
  }
  let t = (lo + hi) / 2;
  for (let k = 0; k < 200; k++) {
    const f = studentTCdf(t, df) - p;
    if (f === 0) return t;
    if (f < 0) lo = t;
    else hi = t;
    const step = f / studentTDensity(t, df);
    let next = t - step;
    if (!(next > lo && next < hi)) next = (lo + hi) / 2;
    if (Math.abs(next - t) <= 1e-15 * Math.max(1, Math.abs(t))) return next;
    t = next;
  }
  return t;
}
