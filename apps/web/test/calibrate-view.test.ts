import { describe, expect, it } from "vitest";
import { DEMO_PANEL, parsePanelCsv, validateScenario } from "@contend/solver";
import {
  csvToGrid,
  gridToCsv,
  handoffLinks,
  newGridRow,
  residualKey,
  residualRows,
  roundedScenario,
  runCalibration,
  shareRows,
} from "../src/lib/calibrateView";
import { formToScenario } from "../src/lib/editorForm";
import { parseScenarioValue } from "../src/lib/editorImport";
import { decodeState } from "../src/lib/urlState";

const demoInput = {
  text: DEMO_PANEL.csv,
  source: DEMO_PANEL.file,
  title: "",
  currency: "EUR",
  seed: 1,
  resamples: 200,
};

describe("calibrate-view", () => {
  it("csvToGrid then gridToCsv reads back the same rows (quotes and all)", () => {
    const grid = csvToGrid(DEMO_PANEL.csv);
    if (!grid.ok) throw new Error(grid.message);
    expect(grid.grid).toHaveLength(48);
    expect(grid.grid[1]!.share).toBe("0.372"); // 37.2% without binary noise
    const again = parsePanelCsv(gridToCsv([...grid.grid, newGridRow()]));
    const first = parsePanelCsv(DEMO_PANEL.csv);
    if (!again.ok || !first.ok) throw new Error("parse failed");
    expect(again.value).toHaveLength(first.value.length);
    again.value.forEach((r, k) => {
      const f = first.value[k]!;
      expect([r.period, r.rival, r.spend]).toEqual([f.period, f.rival, f.spend]);
      expect(Math.abs(r.share - f.share)).toBeLessThan(1e-12);
    });
    const quoted = gridToCsv([
      newGridRow({ period: "Q1", rival: 'Mill, "The"', spend: "1", share: "1" }),
    ]);
    const back = parsePanelCsv(quoted);
    expect(back.ok && back.value[0]!.rival).toBe('Mill, "The"');
  });

  it("runCalibration names where bad input is, and fits the demo", () => {
    const bad = runCalibration({ ...demoInput, text: "period,rival,spend\n" });
    expect(bad).toMatchObject({ ok: false, where: "column share" });
    const good = runCalibration(demoInput);
    if (!good.ok) throw new Error(good.message);
    expect(good.scenario.currency).toBe("EUR");
    expect(good.scenario.provenance?.source).toBe(DEMO_PANEL.file);
    expect(validateScenario(good.scenario).ok).toBe(true);
  });

  it("chart rows: shares per period for one rival, residuals keyed per rival", () => {
    const good = runCalibration(demoInput);
    if (!good.ok) throw new Error(good.message);
    const c = good.calibration;
    const rows = shareRows(c, 1);
    expect(rows).toHaveLength(12);
    expect(rows[0]).toMatchObject({ x: 0, period: "2023-Q1" });
    expect(rows[0]!.observed).toBeCloseTo(0.372, 12);
    const res = residualRows(c);
    expect(res).toHaveLength(12);
    // residuals of a period sum to zero across rivals (the centring)
    const sum = c.rivals.reduce((a, _, i) => a + (res[3]![residualKey(i)] as number), 0);
    expect(Math.abs(sum)).toBeLessThan(1e-12);
  });

  it("the editor link carries the scenario with its provenance into a session scenario", () => {
    const good = runCalibration(demoInput);
    if (!good.ok) throw new Error(good.message);
    const { editor, explorer } = handoffLinks(good.scenario);
    expect(explorer.startsWith("/explore?s=")).toBe(true);
    const handed = decodeState(new URL(editor, "http://x").searchParams.get("s")) as {
      sc: unknown;
    };
    const form = parseScenarioValue(handed.sc);
    if (!form.ok) throw new Error(form.message);
    expect(form.form.provenance).toEqual(good.scenario.provenance);
    const session = formToScenario(form.form);
    if (!session.ok) throw new Error(JSON.stringify(session.errors));
    expect(session.scenario.provenance).toEqual(good.scenario.provenance);
    expect(session.scenario.rivals.map((r) => r.weight)).toEqual(
      good.scenario.rivals.map((r) => r.weight),
    );
  });

  it("roundedScenario: whole money, 4 significant digits for r and weights, provenance unrounded", () => {
    const good = runCalibration(demoInput);
    if (!good.ok) throw new Error(good.message);
    const exact = good.scenario;
    const r = roundedScenario(exact);
    expect(validateScenario(r).ok).toBe(true);
    expect(Number.isInteger(r.prize)).toBe(true);
    expect(Math.abs(r.prize - exact.prize)).toBeLessThanOrEqual(0.5);
    const rr = r.csf.kind === "ratio" ? r.csf.decisiveness : NaN;
    const re = exact.csf.kind === "ratio" ? exact.csf.decisiveness : NaN;
    expect(Math.abs(rr / re - 1)).toBeLessThan(5e-4);
    r.rivals.forEach((x, i) => {
      expect(Number.isInteger(x.value)).toBe(true);
      expect(Math.abs(x.weight! / exact.rivals[i]!.weight! - 1)).toBeLessThan(5e-4);
    });
    expect(r.provenance).toEqual(exact.provenance);
  });
});
