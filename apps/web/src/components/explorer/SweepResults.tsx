"use client";

import { effortKey, payoffKey, turningPoints } from "../../lib/chartData";
import type { Row } from "../../lib/chartData";
import { formatNumber, formatPlain } from "../../lib/format";
import { seriesColour } from "../../lib/palette";
import { DataTable } from "../DataTable";
import { LineSeriesChart } from "../LineSeriesChart";

const exact = (v: number) => String(Number(v.toPrecision(8)));

/** Where each rival's equilibrium effort turns over the swept range, in one sentence. */
function turnsSentence(rows: Row[], names: string[]): string {
  if (rows.length === 0) return "";
  return (
    names
      .map((n, i) => {
        const turns = turningPoints(rows.map((r) => r[effortKey(i)] as number | null));
        return turns.length === 0
          ? null
          : `${n}'s effort turns at ${turns.map((k) => formatNumber(rows[k]?.x as number)).join(", ")}`;
      })
      .filter((x) => x !== null)
      .join(" · ") || "No rival's effort turns in this range."
  );
}

/** A finished sweep: equilibrium effort and payoff charts, turning points, and the table. */
export function SweepResults({
  rows,
  names,
  paramLabel,
}: {
  rows: Row[];
  names: string[];
  paramLabel: string;
}) {
  const chart = (key: (i: number) => string, yLabel: string, testId: string) => (
    <LineSeriesChart
      rows={rows}
      xKey="x"
      series={names.map((n, i) => ({ key: key(i), name: n, colour: seriesColour(i) }))}
      xLabel={paramLabel}
      yLabel={yLabel}
      formatY={(v) => formatPlain(v, 2)}
      formatX={(v) => formatPlain(v, 3)}
      testId={testId}
      slide={{
        title: `Equilibrium ${yLabel.toLowerCase()} as ${paramLabel} varies`,
        caption: `Each rival's equilibrium ${yLabel.toLowerCase()} (model units) at each value of ${paramLabel}, the other inputs held fixed. A model's comparative statics, not a forecast.`,
      }}
    />
  );
  return (
    <>
      <div className="grid-2">
        <div>
          <h3>Equilibrium effort</h3>
          {chart(effortKey, "Effort", "sweep-chart")}
        </div>
        <div>
          <h3>Equilibrium payoff</h3>
          {chart(payoffKey, "Payoff", "sweep-payoff-chart")}
        </div>
      </div>
      <p className="small" data-testid="sweep-turns" style={{ minHeight: "1.5em" }}>
        {turnsSentence(rows, names)}
      </p>
      <DataTable
        caption={`Equilibrium effort and payoff against ${paramLabel}`}
        testId="sweep-table"
        rows={rows}
        columns={[
          { key: "x", label: paramLabel, format: exact },
          ...names.map((n, i) => ({ key: effortKey(i), label: `Effort ${n}`, format: exact })),
          ...names.map((n, i) => ({ key: payoffKey(i), label: `Payoff ${n}`, format: exact })),
          { key: "total", label: "Total effort", format: exact },
        ]}
      />
    </>
  );
}
