/**
 * `contend fit FILE.csv [--seed N] [--resamples N] [--json]`: calibrate a ratio contest from a
 * CSV of past spends and shares (src/calibrate) and print the estimates with their intervals,
 * the fit quality and a scenario file that `contend solve` accepts.
 */
import {
  CALIBRATION_CAUTIONS,
  calibrate,
  calibratedScenario,
  calibrationSummary,
  parsePanelCsv,
  type Calibration,
  type Estimate,
} from "../calibrate";
import type { Parsed, Scenario } from "../types";
import type { ParsedArgs } from "./args";
import { parseNumber } from "./args";
import { CAUTIONS, fmt, table } from "./format";

/** The JSON of `contend fit --json`, in the documented field order. */
export function fitJson(c: Calibration, scenario: Scenario): string {
  return `${JSON.stringify({ form: c.form, ...calibrationSummary(c), scenario })}\n`;
}

function range(e: Estimate): string {
  return `${fmt(e.low)} to ${fmt(e.high)}`;
}

export function fitTable(c: Calibration, source: string): string {
  const f = c.fit;
  const lines = [
    `Ratio contest calibrated from ${source}: ${f.observations} observations in ${f.periods} periods, ${f.dropped} row${f.dropped === 1 ? "" : "s"} dropped (zero spend or share).`,
    "",
    `Decisiveness r = ${fmt(c.decisiveness.estimate)} (95% interval ${range(c.decisiveness)}; ${f.residualDf} residual degrees of freedom)`,
    "",
    table(
      ["rival", "head start", "95% interval", "revealed value (money)", "90% interval"],
      c.rivals.map((name, i) => {
        const h = c.headStarts[i]!;
        const v = c.revealedValues[i]!;
        return [
          name,
          fmt(h.estimate),
          i === 0 ? "(baseline)" : range(h),
          fmt(v.estimate),
          range(v),
        ];
      }),
    ),
    "",
    `Head starts are relative to ${c.rivals[0]} (= 1). Revealed value: median over periods of spend / (r p (1 - p)),`,
    `with a bootstrap over periods (${c.bootstrap.resamples} resamples, seed ${c.bootstrap.seed}).`,
    `Fit: R^2 ${fmt(f.r2)} (log-centred regression); RMSE of fitted vs observed shares ${fmt(f.rmse * 100)} percentage points.`,
    'The implied scenario (cost 1 per unit of money) is the "scenario" field of --json.',
    "",
    ...CALIBRATION_CAUTIONS,
    CAUTIONS,
  ];
  return `${lines.join("\n")}\n`;
}

function intFlag(args: ParsedArgs, flag: string): Parsed<number | undefined> {
  const raw = args.flags.get(flag);
  if (raw === undefined) return { ok: true, value: undefined };
  const x = parseNumber(raw);
  if (x === null || !Number.isInteger(x)) {
    return { ok: false, path: `--${flag}`, message: `must be a whole number (got "${raw}")` };
  }
  return { ok: true, value: x };
}

export function runFit(
  text: string,
  source: string,
  args: ParsedArgs,
  json: boolean,
): Parsed<string> {
  const seed = intFlag(args, "seed");
  if (!seed.ok) return seed;
  const resamples = intFlag(args, "resamples");
  if (!resamples.ok) return resamples;
  const rows = parsePanelCsv(text);
  if (!rows.ok) return rows;
  const res = calibrate(rows.value, {
    ...(seed.value === undefined ? {} : { seed: seed.value }),
    ...(resamples.value === undefined ? {} : { resamples: resamples.value }),
  });
  if (!res.ok) {
    const flag = res.path === "seed" || res.path === "resamples" ? `--${res.path}` : res.path;
    return { ...res, path: flag };
  }
  const scenario = calibratedScenario(res.value, { source });
  return { ok: true, value: json ? fitJson(res.value, scenario) : fitTable(res.value, source) };
}
