/**
 * Global maximisation of a 1-D function on [0, hi] for payoffs that need not be concave:
 * evaluate a dense grid (uniform points plus geometrically spaced points near zero, where
 * ratio-form payoffs change fastest), then polish the best few local grid maxima with
 * Brent's method on their neighbouring cells. Endpoints (spending nothing, spending the cap)
 * are always candidates. Common practice, no source.
 */
import { brentMaximize } from "./brentMaximize";

export function gridMaximize(
  f: (x: number) => number,
  hi: number,
  gridPoints = 2001,
  extra: readonly number[] = [],
): { x: number; fx: number } {
  let bestX = 0;
  let bestF = f(0);
  if (!(hi > 0)) return { x: 0, fx: bestF };
  const nu = Math.max(3, gridPoints);
  const ng = Math.max(8, Math.floor(nu / 4));
  const xs = new Float64Array(nu + ng);
  for (let k = 0; k < nu; k++) xs[k] = (hi * k) / (nu - 1);
  const logLo = Math.log(hi * 1e-12);
  const logHi = Math.log(hi);
  for (let k = 0; k < ng; k++) xs[nu + k] = Math.exp(logLo + ((logHi - logLo) * k) / ng);
  xs.sort();
  const fs = new Float64Array(xs.length);
  for (let k = 0; k < xs.length; k++) fs[k] = f(xs[k]!);
  // local maxima of the sampled values
  const peaks: number[] = [];
  for (let k = 0; k < xs.length; k++) {
    const left = k > 0 ? fs[k - 1]! : -Infinity;
    const right = k + 1 < xs.length ? fs[k + 1]! : -Infinity;
    if (fs[k]! >= left && fs[k]! >= right) peaks.push(k);
  }
  peaks.sort((p, q) => fs[q]! - fs[p]!);
  for (let j = 0; j < Math.min(4, peaks.length); j++) {
    const k = peaks[j]!;
    if (fs[k]! > bestF) {
      bestF = fs[k]!;
      bestX = xs[k]!;
    }
    const a = xs[Math.max(0, k - 1)]!;
    const b = xs[Math.min(xs.length - 1, k + 1)]!;
    if (b > a) {
      const r = brentMaximize(f, a, b);
      if (r.fx > bestF) {
        bestF = r.fx;
        bestX = r.x;
      }
    }
  }
  for (const x of extra) {
    if (x >= 0 && x <= hi) {
      const fx = f(x);
      if (fx > bestF) {
        bestF = fx;
        bestX = x;
      }
    }
  }
  return { x: bestX, fx: bestF };
}
