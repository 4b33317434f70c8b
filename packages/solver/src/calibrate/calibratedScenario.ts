/**
 * The scenario a calibration implies: ratio form with the estimated decisiveness, cost 1 per unit
 * of money (so spend = effort), weight = head start, value = revealed value, prize = the largest
 * revealed value; the calibration summary rides along as the scenario's provenance.
 */
import type { Scenario } from "../types";
import type { CalibrationProvenance } from "./provenance";
import type { Calibration } from "./types";

/**
 * What a calibration found, in its documented field order: the estimates with their intervals
 * and the fit's statistics (shared by the provenance and `contend fit --json`).
 */
export function calibrationSummary(c: Calibration) {
  const est = ({ estimate, low, high }: { estimate: number; low: number; high: number }) => ({
    estimate,
    low,
    high,
  });
  return {
    decisiveness: est(c.decisiveness),
    headStarts: c.headStarts.map((h) => ({ rival: h.rival, ...est(h) })),
    revealedValues: c.revealedValues.map((v) => ({ rival: v.rival, ...est(v) })),
    fit: {
      r2: c.fit.r2,
      rmse: c.fit.rmse,
      observations: c.fit.observations,
      periods: c.fit.periods,
      dropped: c.fit.dropped,
    },
  };
}

export function calibrationProvenance(c: Calibration, source: string): CalibrationProvenance {
  return {
    kind: "calibration",
    source: source.slice(0, 200),
    ...calibrationSummary(c),
    bootstrap: { ...c.bootstrap },
  };
}

export function calibratedScenario(
  c: Calibration,
  opts: { title?: string; source?: string; currency?: string | null } = {},
): Scenario {
  const source = opts.source ?? "pasted data";
  const prize = Math.max(...c.revealedValues.map((v) => v.estimate));
  const scenario: Scenario = {
    title: (opts.title ?? `Calibrated from ${source}`).slice(0, 200),
    prize,
    csf: { kind: "ratio", decisiveness: c.decisiveness.estimate },
    rivals: c.rivals.map((name, i) => ({
      name,
      cost: 1,
      value: c.revealedValues[i]!.estimate,
      weight: c.headStarts[i]!.estimate,
    })),
    provenance: calibrationProvenance(c, source),
  };
  if (opts.currency) scenario.currency = opts.currency;
  return scenario;
}
