/**
 * Distributions of an uncertain number: the quantile function (inverse CDF), used both to draw
 * (quantile of a uniform number, the inversion method: Devroye 1986, Non-Uniform Random Variate
 * Generation, section 2.1) and to place a parameter at its 10th, 50th or 90th percentile.
 * Triangular inverse CDF: Johnson, Kotz & Balakrishnan 1995, Continuous Univariate
 * Distributions vol. 2 (from memory).
 */
import type { Dist, Uncertain } from "./types";

export function isDist(x: unknown): x is Dist {
  return typeof x === "object" && x !== null && "dist" in x;
}

/** The value below which a fraction q of the distribution lies (q in [0, 1]). */
export function quantile(d: Dist, q: number): number {
  const { low, high } = d;
  const width = high - low;
  if (!(width > 0)) return low;
  if (d.dist === "uniform") return low + q * width;
  const left = d.mode - low;
  const right = high - d.mode;
  const atMode = left / width;
  return q <= atMode
    ? low + Math.sqrt(q * width * left)
    : high - Math.sqrt((1 - q) * width * right);
}

/** A point stays itself; a range gives its quantile q. */
export function at(x: Uncertain, q: number): number {
  return isDist(x) ? quantile(x, q) : x;
}

export function mean(d: Dist): number {
  return d.dist === "uniform" ? (d.low + d.high) / 2 : (d.low + d.mode + d.high) / 3;
}
