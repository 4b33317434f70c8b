"use client";

import type { Calibration } from "@contend/solver";
import { residualKey, residualRows, shareRows } from "../../lib/calibrateView";
import { formatNumber } from "../../lib/format";
import { seriesColour } from "../../lib/palette";
import { DataTable } from "../DataTable";
import { LineSeriesChart } from "../LineSeriesChart";

/** Observed against fitted share per rival (small multiples), then the residuals. */
export function FitCharts({ c }: { c: Calibration }) {
  const periodLabel = (x: number) => c.periods[Math.round(x)] ?? "";
  const residuals = residualRows(c);
  return (
    <div>
      <h3>Observed and fitted share</h3>
      <div className="calibrate-multiples">
        {c.rivals.map((name, i) => (
          <figure key={name} style={{ margin: 0 }}>
            <figcaption className="small">
              <strong>{name}</strong>
            </figcaption>
            <LineSeriesChart
              rows={shareRows(c, i)}
              xKey="x"
              series={[
                { key: "observed", name: "observed", colour: seriesColour(i) },
                { key: "fitted", name: "fitted", colour: "#4a5565", dashed: true },
              ]}
              xLabel="period"
              yLabel="share"
              formatX={periodLabel}
              formatY={(v) => `${formatNumber(v * 100, 0)}%`}
              height={210}
              testId={`calibrate-share-chart-${i}`}
              slide={{
                title: `${name}: observed and fitted share`,
                caption:
                  "The rival's observed share of the contested outcome per period (solid) and the share the fitted contest predicts (dashed). A fit to past data, not a forecast.",
              }}
            />
          </figure>
        ))}
      </div>
      <h3>Residuals</h3>
      <p className="small muted">
        Log-centred residuals (observed minus fitted log share, each period centred). A pattern over
        time or one rival far from zero means the ratio form misses something there.
      </p>
      <LineSeriesChart
        rows={residuals}
        xKey="x"
        series={c.rivals.map((name, i) => ({ key: residualKey(i), name, colour: seriesColour(i) }))}
        xLabel="period"
        yLabel="residual (log share)"
        formatX={periodLabel}
        formatY={(v) => formatNumber(v, 2)}
        height={260}
        testId="calibrate-residual-chart"
        slide={{
          title: "Fit residuals by period",
          caption:
            "Observed minus fitted log share, centred per period. A pattern over time or one rival far from zero means the ratio form misses something there.",
        }}
      />
      <details>
        <summary className="small">Residuals as a table</summary>
        <DataTable
          rows={residuals}
          columns={[
            { key: "period", label: "Period" },
            ...c.rivals.map((name, i) => ({
              key: residualKey(i),
              label: name,
              format: (v: number) => formatNumber(v, 3),
            })),
          ]}
          caption="Log-centred residual per period and rival (blank: no usable row)"
          testId="calibrate-residual-table"
        />
      </details>
    </div>
  );
}
