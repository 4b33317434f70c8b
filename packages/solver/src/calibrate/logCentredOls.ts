/**
 * Estimates decisiveness r and head starts a_i of the ratio form q_it = a_i s_it^r / sum_j a_j s_jt^r
 * from spends and shares, by the log-centring transformation of the attraction model (Cooper &
 * Nakanishi, Market-Share Analysis, 1988, ch. 5):
 *
 *   ln(q_it / q~_t) = (ln a_i - mean_{j in t} ln a_j) + r ln(s_it / s~_t) + e_it,
 *
 * with ~ the geometric mean over the rivals present in period t. Ordinary least squares with one
 * centred dummy per rival and one common slope; the first rival is the baseline, so the dummy
 * coefficient of rival k is ln(a_k / a_1) and its variance comes straight from the covariance
 * matrix. The centring spends one degree of freedom per period, so the residual degrees of freedom
 * are n - T - N (n observations, T periods, N rivals: N - 1 dummies and the slope).
 *
 * The normal equations are accumulated period by period without forming the design matrix: a
 * centred dummy column is D_k = 1[i = k] - 1[k in t] / m_t, so D^T D sums the centring matrices of
 * the periods' rival sets, D^T x and D^T y are each rival's sums of its centred logs, and x^T x,
 * x^T y are plain sums (X^T X is N x N; cost O(n N) for dense periods).
 */
import type { InputError, Parsed } from "../types";
import { cholesky, choleskyInverse, choleskySolve } from "./cholesky";
import type { IndexedPanel } from "./panel";

export interface OlsFit {
  /** ln(a_k / a_1) for k = 0..N-1 (0 for the first rival) */
  logHeadStart: Float64Array;
  r: number;
  /** covariance of (ln a_2/a_1, ..., ln a_N/a_1, r), N x N row-major */
  covariance: Float64Array;
  residualDf: number;
  rss: number;
  tss: number;
  /** per observation (panel order): centred log share, its fitted value, and the log spend */
  centredLogShare: Float64Array;
  fittedCentred: Float64Array;
  logSpend: Float64Array;
}

function fail(path: string, message: string): InputError {
  return { ok: false, path, message };
}

/** The log-centred OLS fit of an indexed panel (which guarantees n - T - N >= 1). */
export function logCentredOls(panel: IndexedPanel): Parsed<OlsFit> {
  const N = panel.rivals.length;
  const T = panel.start.length - 1;
  const n = panel.spend.length;
  const P = N; // parameters: N - 1 dummies (rivals 1..N-1) then r
  const XtX = new Float64Array(P * P);
  const Xty = new Float64Array(P);
  const yc = new Float64Array(n);
  const xc = new Float64Array(n);
  const lx = new Float64Array(n);
  let tss = 0;
  for (let p = 0; p < T; p++) {
    const a = panel.start[p]!;
    const b = panel.start[p + 1]!;
    const m = b - a;
    let my = 0;
    let mx = 0;
    for (let k = a; k < b; k++) {
      lx[k] = Math.log(panel.spend[k]!);
      my += Math.log(panel.share[k]!);
      mx += lx[k]!;
    }
    my /= m;
    mx /= m;
    for (let k = a; k < b; k++) {
      yc[k] = Math.log(panel.share[k]!) - my;
      xc[k] = lx[k]! - mx;
      tss += yc[k]! * yc[k]!;
      XtX[(P - 1) * P + (P - 1)]! += xc[k]! * xc[k]!;
      Xty[P - 1]! += xc[k]! * yc[k]!;
      const i = panel.obsRival[k]!;
      if (i === 0) continue;
      const c = i - 1;
      XtX[c * P + c]! += 1;
      XtX[c * P + (P - 1)]! += xc[k]!;
      Xty[c]! += yc[k]!;
      for (let l = a; l < b; l++) {
        const j = panel.obsRival[l]!;
        if (j !== 0) XtX[c * P + (j - 1)]! -= 1 / m;
      }
    }
  }
  for (let c = 0; c < P - 1; c++) XtX[(P - 1) * P + c] = XtX[c * P + (P - 1)]!;

  const chol = cholesky(XtX, P);
  if (!chol.ok) {
    if (chol.column === P - 1) {
      return fail(
        "column spend",
        "relative spends do not change from period to period beyond each rival's usual level, so decisiveness r cannot be estimated",
      );
    }
    return fail(
      `rival ${JSON.stringify(panel.rivals[chol.column + 1])}`,
      `never shares a period with ${JSON.stringify(panel.rivals[0])}, directly or through other rivals, so its head start cannot be compared`,
    );
  }
  const theta = choleskySolve(chol.L, P, Xty);
  const r = theta[P - 1]!;
  const logHeadStart = new Float64Array(N);
  for (let i = 1; i < N; i++) logHeadStart[i] = theta[i - 1]!;

  const fittedCentred = new Float64Array(n);
  let rss = 0;
  for (let p = 0; p < T; p++) {
    const a = panel.start[p]!;
    const b = panel.start[p + 1]!;
    let mean = 0;
    for (let k = a; k < b; k++) mean += logHeadStart[panel.obsRival[k]!]!;
    mean /= b - a;
    for (let k = a; k < b; k++) {
      const f = logHeadStart[panel.obsRival[k]!]! - mean + r * xc[k]!;
      fittedCentred[k] = f;
      const e = yc[k]! - f;
      rss += e * e;
    }
  }
  const residualDf = n - T - N;
  const sigma2 = rss / residualDf;
  const inv = choleskyInverse(chol.L, P);
  const covariance = inv.map((v) => v * sigma2);
  return {
    ok: true,
    value: {
      logHeadStart,
      r,
      covariance,
      residualDf,
      rss,
      tss,
      centredLogShare: yc,
      fittedCentred,
      logSpend: lx,
    },
  };
}
