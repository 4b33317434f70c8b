/**
 * The Calibrate page's pure side: the data grid as cells and back to CSV text (the solver's one
 * CSV reader parses both), chart rows of a calibration, and the links that hand its scenario to
 * the editor and the explorer with the calibration kept as provenance.
 */
import {
  calibrate,
  calibratedScenario,
  cellsToCsv,
  parsePanelCsv,
  PANEL_COLUMNS,
  type Calibration,
  type InputError,
  type Scenario,
} from "@contend/solver";
import type { Row } from "./chartData";
import { encodeState } from "./urlState";

export interface GridRow {
  /** stable React key */
  key: string;
  period: string;
  rival: string;
  spend: string;
  share: string;
}

let gridKey = 0;
export function newGridRow(cells: Partial<Omit<GridRow, "key">> = {}): GridRow {
  gridKey += 1;
  return { key: `g${gridKey}`, period: "", rival: "", spend: "", share: "", ...cells };
}

/** The grid as CSV text with the standard header; blank rows are left out. */
export function gridToCsv(grid: readonly GridRow[]): string {
  const rows = grid
    .filter((g) => [g.period, g.rival, g.spend, g.share].some((c) => c.trim() !== ""))
    .map((g) => [g.period, g.rival, g.spend, g.share]);
  return cellsToCsv([[...PANEL_COLUMNS], ...rows]);
}

/** CSV text to grid rows (shares as fractions), or the reader's first problem. */
export function csvToGrid(text: string): { ok: true; grid: GridRow[] } | InputError {
  const rows = parsePanelCsv(text);
  if (!rows.ok) return rows;
  return {
    ok: true,
    grid: rows.value.map((r) =>
      newGridRow({
        period: r.period,
        rival: r.rival,
        spend: String(r.spend),
        // 37.2% reads back as 0.372, not 0.37200000000000005
        share: String(Number(r.share.toPrecision(12))),
      }),
    ),
  };
}

export interface CalibrateInput {
  text: string;
  source: string;
  title: string;
  currency: string;
  seed: number;
  resamples: number;
}

export type CalibrateOutcome =
  | { ok: true; calibration: Calibration; scenario: Scenario }
  | { ok: false; where: string; message: string };

/** Reads the text and fits it; the scenario carries the calibration as provenance. */
export function runCalibration(input: CalibrateInput): CalibrateOutcome {
  const rows = parsePanelCsv(input.text);
  if (!rows.ok) return { ok: false, where: rows.path, message: rows.message };
  const fit = calibrate(rows.value, { seed: input.seed, resamples: input.resamples });
  if (!fit.ok) return { ok: false, where: fit.path, message: fit.message };
  const currency = input.currency.trim();
  const scenario = calibratedScenario(fit.value, {
    source: input.source,
    ...(input.title.trim() === "" ? {} : { title: input.title.trim() }),
    currency: currency === "" ? null : currency,
  });
  return { ok: true, calibration: fit.value, scenario };
}

/** Observed and fitted share (as fractions) of one rival per period; null where it has no row. */
export function shareRows(c: Calibration, rival: number): Row[] {
  const byPeriod = new Map((c.points[rival] ?? []).map((p) => [p.periodIndex, p]));
  return c.periods.map((period, x) => {
    const p = byPeriod.get(x);
    return { x, period, observed: p?.observed ?? null, fitted: p?.fitted ?? null };
  });
}

export const residualKey = (i: number) => `res${i}`;

/** Log-centred residuals per period, one key per rival. */
export function residualRows(c: Calibration): Row[] {
  const rows: Row[] = c.periods.map((period, x) => ({ x, period }));
  c.points.forEach((pts, i) => {
    for (const row of rows) row[residualKey(i)] = null;
    for (const p of pts) rows[p.periodIndex]![residualKey(i)] = p.residual;
  });
  return rows;
}

/** x to `digits` significant digits. */
function significant(x: number, digits: number): number {
  return Number(x.toPrecision(digits));
}

/**
 * The scenario as people edit it: r and head starts to 4 significant digits, money (prize and
 * values) to whole units. The provenance keeps the unrounded estimates.
 */
export function roundedScenario(s: Scenario): Scenario {
  const money = (x: number) => (x >= 100 ? Math.round(x) : significant(x, 4));
  return {
    ...s,
    prize: money(s.prize),
    csf:
      s.csf.kind === "ratio"
        ? { ...s.csf, decisiveness: significant(s.csf.decisiveness, 4) }
        : s.csf,
    rivals: s.rivals.map((r) => ({
      ...r,
      ...(typeof r.value === "number" ? { value: money(r.value) } : {}),
      ...(typeof r.weight === "number" ? { weight: significant(r.weight, 4) } : {}),
    })),
  };
}

/** Where "use this scenario" goes: the editor (to start a session) and the explorer. */
export function handoffLinks(scenario: Scenario): { editor: string; explorer: string } {
  const s = encodeState({ sc: scenario });
  return { editor: `/new?s=${s}`, explorer: `/explore?s=${s}` };
}
