/**
 * Calibration benchmark: a 50-rival, 200-period panel (log-normal spends, shares from the ratio
 * form with log-normal noise), fitted with 1,000 bootstrap resamples; and the same panel read
 * from CSV text first.
 */
import { calibrate, mulberry32, parsePanelCsv, type PanelRow } from "../src/index";

interface Timed {
  median: number;
  p95: number;
}

export interface CalibrationBenchRow {
  case: string;
  target: string;
  runs: number;
  medianMs: number;
  p95Ms: number;
  note?: string;
}

function panel(rivals: number, periods: number): PanelRow[] {
  const rng = mulberry32(99);
  const normal = () => Math.sqrt(-2 * Math.log(1 - rng())) * Math.cos(2 * Math.PI * rng());
  const rows: PanelRow[] = [];
  let row = 2;
  for (let t = 0; t < periods; t++) {
    const spends = Array.from(
      { length: rivals },
      (_, i) => 1000 * (1 + (i % 7)) * Math.exp(0.5 * normal()),
    );
    const att = spends.map((s, i) => (1 + (i % 5) / 4) * s ** 0.8 * Math.exp(0.2 * normal()));
    const total = att.reduce((a, b) => a + b, 0);
    spends.forEach((s, i) => {
      rows.push({ period: `P${t}`, rival: `R${i}`, spend: s, share: att[i]! / total, row: row++ });
    });
  }
  return rows;
}

export function calibrationBench(
  time: (fn: () => unknown, opts: { warmup: number; runs: number }) => Timed,
): CalibrationBenchRow[] {
  const rows = panel(50, 200);
  const text = [
    "period,rival,spend,share",
    ...rows.map((r) => `${r.period},${r.rival},${r.spend},${r.share}`),
  ].join("\n");
  const fit = () => {
    const c = calibrate(rows, { resamples: 1000 });
    if (!c.ok) throw new Error(c.message);
    return c.value;
  };
  const c = fit();
  const t = time(fit, { warmup: 3, runs: 15 });
  const tCsv = time(
    () => {
      const parsed = parsePanelCsv(text);
      if (!parsed.ok) throw new Error(parsed.message);
      return calibrate(parsed.value, { resamples: 1000 });
    },
    { warmup: 2, runs: 10 },
  );
  return [
    {
      case: "calibrate: 50 rivals x 200 periods, 1,000 bootstrap resamples",
      target: "< 500 ms",
      runs: 15,
      medianMs: t.median,
      p95Ms: t.p95,
      note: `r = ${c.decisiveness.estimate.toFixed(3)} (true 0.8), ${c.fit.observations} observations`,
    },
    {
      case: "the same from CSV text (papaparse) to estimates",
      target: "-",
      runs: 10,
      medianMs: tCsv.median,
      p95Ms: tCsv.p95,
    },
  ];
}
