import { describe, expect, it } from "vitest";
import { sweepBands, type UncertainScenario } from "@contend/solver";
import { bandPairKey, bandRows, worstNoPure } from "../src/lib/bandRows";

const s: UncertainScenario = {
  title: "Two rivals, one unknown cost",
  prize: 100,
  csf: { kind: "ratio", decisiveness: 1 },
  rivals: [
    { name: "A", cost: 1 },
    { name: "B", cost: { dist: "uniform", low: 1, high: 3 } },
  ],
};

describe("bandRows", () => {
  it("bandRows(sweep, spends) gives one table row per value with P10 <= P50 <= P90 and the chart's [P10, P90] pair", () => {
    const r = sweepBands(s, "rivals.0.cost", [0.5, 1], { draws: 300, seed: 3 });
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    const rows = bandRows(r.value, "spends");
    expect(rows.table.map((x) => x.x)).toEqual([0.5, 1]);
    rows.table.forEach((row, k) => {
      const band = r.value.points[k]!.spends;
      for (const i of [0, 1]) {
        expect(row[`p10_${i}`]).toBe(band.p10[i]);
        expect(row[`p50_${i}`]).toBe(band.p50[i]);
        expect(row[`p90_${i}`]).toBe(band.p90[i]);
        expect(row[`p10_${i}`] as number).toBeLessThanOrEqual(row[`p50_${i}`] as number);
        expect(row[`p50_${i}`] as number).toBeLessThanOrEqual(row[`p90_${i}`] as number);
        expect(rows.chart[k]![bandPairKey(i)]).toEqual([band.p10[i], band.p90[i]]);
      }
    });
    expect(worstNoPure(r.value)).toBe(0);
  });
});
