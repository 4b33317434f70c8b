/**
 * Calibrates a ratio contest from past spends and shares: checks the panel, fits r and head starts
 * by log-centred least squares (./logCentredOls.ts), computes fitted shares, fit quality and each
 * period's revealed value (./revealedValues.ts). Pure: rows in, a value out; the bootstrap draws
 * only from mulberry32(seed).
 */
import type { InputError, Parsed } from "../types";
import { LIMITS } from "../validate";
import { logCentredOls } from "./logCentredOls";
import { indexPanel } from "./panel";
import { summariseRevealedValues } from "./revealedValues";
import { studentTQuantile } from "./studentT";
import {
  CALIBRATION_DEFAULTS,
  type CalibrateOptions,
  type Calibration,
  type FittedPoint,
  type PanelRow,
} from "./types";

function fail(path: string, message: string): InputError {
  return { ok: false, path, message };
}

function checkOptions(opts: CalibrateOptions): Parsed<{ seed: number; resamples: number }> {
  const seed = opts.seed ?? CALIBRATION_DEFAULTS.seed;
  const resamples = opts.resamples ?? CALIBRATION_DEFAULTS.resamples;
  if (!Number.isInteger(seed) || seed < 0 || seed > 0xffffffff) {
    return fail("seed", `must be an integer from 0 to 4294967295 (got ${seed})`);
  }
  if (
    !Number.isInteger(resamples) ||
    resamples < 1 ||
    resamples > CALIBRATION_DEFAULTS.resamplesMax
  ) {
    return fail(
      "resamples",
      `must be an integer from 1 to ${CALIBRATION_DEFAULTS.resamplesMax} (got ${resamples})`,
    );
  }
  return { ok: true, value: { seed, resamples } };
}

/** Fits the ratio form to a panel of spends and shares; bad input comes back as a value. */
export function calibrate(
  rows: readonly PanelRow[],
  options: CalibrateOptions = {},
): Parsed<Calibration> {
  const opts = checkOptions(options);
  if (!opts.ok) return opts;
  const indexed = indexPanel(rows);
  if (!indexed.ok) return indexed;
  const panel = indexed.value;
  const ols = logCentredOls(panel);
  if (!ols.ok) return ols;
  const fit = ols.value;
  const N = panel.rivals.length;
  const T = panel.start.length - 1;
  const n = panel.spend.length;
  const r = fit.r;
  if (!(r > 0)) {
    return fail(
      "column share",
      `the estimated decisiveness is r = ${+r.toPrecision(4)} <= 0: in these data a larger spend does not win a larger share, so a ratio contest does not describe them`,
    );
  }
  if (r > LIMITS.decisivenessMax) {
    return fail(
      "column share",
      `the estimated decisiveness is r = ${+r.toPrecision(4)}, above the largest a scenario allows (${LIMITS.decisivenessMax})`,
    );
  }
  const tq = studentTQuantile(0.975, fit.residualDf);
  const cov = (a: number, b: number) => fit.covariance[a * N + b]!;
  const seR = Math.sqrt(cov(N - 1, N - 1));

  const headStarts = panel.rivals.map((rival, i) => {
    if (i === 0) return { rival, estimate: 1, low: 1, high: 1 };
    const b = fit.logHeadStart[i]!;
    const se = Math.sqrt(cov(i - 1, i - 1));
    return {
      rival,
      estimate: Math.exp(b),
      low: Math.exp(b - tq * se),
      high: Math.exp(b + tq * se),
    };
  });

  // Fitted shares at the observed spends (max-shifted for stability), revealed values.
  const points: FittedPoint[][] = panel.rivals.map(() => []);
  const values: number[][] = panel.rivals.map(() => []);
  const valuePeriods: number[][] = panel.rivals.map(() => []);
  let sq = 0;
  for (let p = 0; p < T; p++) {
    const a = panel.start[p]!;
    const b = panel.start[p + 1]!;
    let top = -Infinity;
    for (let k = a; k < b; k++) {
      top = Math.max(top, fit.logHeadStart[panel.obsRival[k]!]! + r * fit.logSpend[k]!);
    }
    let total = 0;
    for (let k = a; k < b; k++) {
      total += Math.exp(fit.logHeadStart[panel.obsRival[k]!]! + r * fit.logSpend[k]! - top);
    }
    for (let k = a; k < b; k++) {
      const i = panel.obsRival[k]!;
      const fitted = Math.exp(fit.logHeadStart[i]! + r * fit.logSpend[k]! - top) / total;
      const observed = panel.share[k]!;
      const spend = panel.spend[k]!;
      const revealedValue = spend / (r * fitted * (1 - fitted));
      sq += (fitted - observed) ** 2;
      const periodIndex = panel.obsPeriod[k]!;
      points[i]!.push({
        period: panel.periods[periodIndex]!,
        periodIndex,
        spend,
        observed,
        fitted,
        residual: fit.centredLogShare[k]! - fit.fittedCentred[k]!,
        revealedValue,
      });
      values[i]!.push(revealedValue);
      valuePeriods[i]!.push(p);
    }
  }
  const summaries = summariseRevealedValues(
    values.map((v) => Float64Array.from(v)),
    valuePeriods.map((v) => Int32Array.from(v)),
    T,
    opts.value,
  );

  return {
    ok: true,
    value: {
      form: "ratio",
      decisiveness: { estimate: r, low: r - tq * seR, high: r + tq * seR, standardError: seR },
      headStarts,
      revealedValues: summaries.map((s, i) => ({ rival: panel.rivals[i]!, ...s })),
      fit: {
        r2: fit.tss > 0 ? 1 - fit.rss / fit.tss : 1,
        rmse: Math.sqrt(sq / n),
        observations: n,
        periods: T,
        dropped: panel.dropped,
        residualDf: fit.residualDf,
      },
      periods: panel.periods,
      rivals: panel.rivals,
      points,
      bootstrap: opts.value,
    },
  };
}
