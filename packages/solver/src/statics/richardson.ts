/**
 * Numerical derivative of a vector-valued function by central differences with one Richardson
 * extrapolation step (Richardson 1911; standard numerical analysis, e.g. Press et al.,
 * Numerical Recipes, section 5.7): D(h) = (f(x+h) - f(x-h)) / 2h has error O(h^2), so
 * (4 D(h/2) - D(h)) / 3 cancels the leading term. |R - D(h/2)| is reported as an error estimate.
 * Where x - h would leave the domain (x near a lower bound) a forward difference is used instead.
 */
export interface NumericDerivative {
  d: number[];
  /** per-component estimate of the absolute error */
  error: number[];
  scheme: "central" | "forward";
  step: number;
}

export function richardson(
  f: (x: number) => number[],
  x: number,
  opts: { step: number; lowerBound?: number; base?: number[] },
): NumericDerivative {
  const h = opts.step;
  const central = opts.lowerBound === undefined || x - h >= opts.lowerBound;
  if (central) {
    const fp = f(x + h);
    const fm = f(x - h);
    const fp2 = f(x + h / 2);
    const fm2 = f(x - h / 2);
    const d: number[] = [];
    const error: number[] = [];
    for (let c = 0; c < fp.length; c++) {
      const dh = ((fp[c] as number) - (fm[c] as number)) / (2 * h);
      const dh2 = ((fp2[c] as number) - (fm2[c] as number)) / h;
      const r = (4 * dh2 - dh) / 3;
      d.push(r);
      error.push(Math.abs(r - dh2));
    }
    return { d, error, scheme: "central", step: h };
  }
  // Forward differences have error O(h): one extrapolation is 2 D(h/2) - D(h).
  const f0 = opts.base ?? f(x);
  const fp = f(x + h);
  const fp2 = f(x + h / 2);
  const d: number[] = [];
  const error: number[] = [];
  for (let c = 0; c < fp.length; c++) {
    const dh = ((fp[c] as number) - (f0[c] as number)) / h;
    const dh2 = ((fp2[c] as number) - (f0[c] as number)) / (h / 2);
    const r = 2 * dh2 - dh;
    d.push(r);
    error.push(Math.abs(r - dh2));
  }
  return { d, error, scheme: "forward", step: h };
}
