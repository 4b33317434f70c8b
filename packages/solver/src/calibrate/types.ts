/** Shapes of a calibration: the panel it reads and what it reports. */

/** One observation: what a rival spent in a period and the share it won. */
export interface PanelRow {
  period: string;
  rival: string;
  /** money, >= 0 */
  spend: number;
  /** fraction in [0, 1] */
  share: number;
  /** the row's number for messages (a spreadsheet's row number: the header is row 1) */
  row: number;
}

/** An estimate with the ends of its interval. */
export interface Estimate {
  estimate: number;
  low: number;
  high: number;
}

export interface RivalEstimate extends Estimate {
  rival: string;
}

/** One usable observation after the fit: observed and fitted share, log-centred residual. */
export interface FittedPoint {
  period: string;
  /** index into Calibration.periods */
  periodIndex: number;
  spend: number;
  observed: number;
  fitted: number;
  /** residual of the log-centred regression */
  residual: number;
  /** spend / (r p (1 - p)) at the fitted share: what winning was worth if this spend was a best reply */
  revealedValue: number;
}

export interface CalibrationFit {
  /** R^2 of the log-centred regression (no intercept: the centring removed it) */
  r2: number;
  /** root mean square of fitted minus observed shares over the usable rows */
  rmse: number;
  observations: number;
  periods: number;
  /** rows that could not enter the log model (zero spend or zero share, or alone in a period) */
  dropped: number;
  /** residual degrees of freedom n - T - N */
  residualDf: number;
}

export interface Calibration {
  form: "ratio";
  /** r with its 95% interval (t distribution, residualDf degrees of freedom) */
  decisiveness: Estimate & { standardError: number };
  /** a_i / a_1 with 95% intervals; the first rival is 1 exactly */
  headStarts: RivalEstimate[];
  /** median over periods of the per-period revealed values, with a bootstrap 90% interval */
  revealedValues: RivalEstimate[];
  fit: CalibrationFit;
  /** periods in first-appearance order */
  periods: string[];
  /** rivals in first-appearance order */
  rivals: string[];
  /** per rival (same order), its usable observations in period order */
  points: FittedPoint[][];
  /** what the bootstrap used */
  bootstrap: { seed: number; resamples: number };
}

export interface CalibrateOptions {
  /** seed of the bootstrap (default 1) */
  seed?: number;
  /** bootstrap resamples (default 1,000) */
  resamples?: number;
}

export const CALIBRATION_DEFAULTS = { seed: 1, resamples: 1000, resamplesMax: 100_000 } as const;

/**
 * What a calibration assumes and cannot know; shown wherever its results are (CLI table, web
 * Calibrate page, editor and debrief provenance).
 */
export const CALIBRATION_CAUTIONS = [
  "These are estimates from past data, not facts.",
  "They assume the market behaves like a ratio contest and that each period's spends were best replies to the others.",
  "Spend also reacts to the share a rival expects (endogeneity; Jia, Skaperdas & Vaidya 2013), which can bias the estimates.",
] as const;
