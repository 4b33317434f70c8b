/**
 * Local maximisation of a 1-D function on [a, b] by Brent's method (golden-section search
 * with parabolic interpolation): R. P. Brent 1973, "Algorithms for Minimization without
 * Derivatives", chapter 5 (procedure localmin).
 */
export function brentMaximize(
  f: (x: number) => number,
  a: number,
  b: number,
  relTol = 1e-12,
  maxIter = 200,
): { x: number; fx: number } {
  const g = (x: number) => -f(x);
  const c = 0.5 * (3 - Math.sqrt(5));
  let lo = a;
  let hi = b;
  let x = lo + c * (hi - lo);
  let w = x;
  let v = x;
  let fx = g(x);
  let fw = fx;
  let fv = fx;
  let d = 0;
  let e = 0;
  const absTol = 1e-300;
  for (let iter = 0; iter < maxIter; iter++) {
    const m = 0.5 * (lo + hi);
    const tol = relTol * Math.abs(x) + absTol;
    const t2 = 2 * tol;
    if (Math.abs(x - m) <= t2 - 0.5 * (hi - lo)) break;
    let useGolden = true;
    if (Math.abs(e) > tol) {
      let r = (x - w) * (fx - fv);
      let q = (x - v) * (fx - fw);
      let p = (x - v) * q - (x - w) * r;
      q = 2 * (q - r);
      if (q > 0) p = -p;
      else q = -q;
      r = e;
      e = d;
      if (Math.abs(p) < Math.abs(0.5 * q * r) && p > q * (lo - x) && p < q * (hi - x)) {
        d = p / q;
        const u = x + d;
        if (u - lo < t2 || hi - u < t2) d = x < m ? tol : -tol;
        useGolden = false;
      }
    }
    if (useGolden) {
      e = (x < m ? hi : lo) - x;
      d = c * e;
    }
    const u = Math.abs(d) >= tol ? x + d : x + (d > 0 ? tol : -tol);
    const fu = g(u);
    if (fu <= fx) {
      if (u < x) hi = x;
      else lo = x;
      v = w;
      fv = fw;
      w = x;
      fw = fx;
      x = u;
      fx = fu;
    } else {
      if (u < x) lo = u;
      else hi = u;
      if (fu <= fw || w === x) {
        v = w;
        fv = fw;
        w = u;
        fw = fu;
      } else if (fu <= fv || v === x || v === w) {
        v = u;
        fv = fu;
      }
    }
  }
  return { x, fx: -fx };
}
