"use client";

import { useRef } from "react";
import {
  Bar,
  BarChart,
  CartesianGrid,
  Legend,
  ResponsiveContainer,
  Tooltip,
  XAxis,
  YAxis,
} from "recharts";
import { formatMoney, formatNumber } from "../../lib/format";
import { yAxisCaption } from "../../lib/chartAxes";
import { PAPER, seriesColour } from "../../lib/palette";
import { ChartWithSlide } from "../ChartSlideDownload";
import type { FrontsView } from "./FrontsResults";

/** Each rival's money as one bar, stacked by front. */
export function AllocationChart({ fc, eq, currency }: FrontsView) {
  const ref = useRef<HTMLDivElement>(null);
  if (!eq.spends) return null;
  const rows = fc.rivals.map((r, i) => {
    const row: Record<string, string | number> = { name: r.name };
    fc.fronts.forEach((_, k) => (row[`f${k}`] = eq.spends![i]![k]!));
    return row;
  });
  // `staged`: the copy drawn off screen at slide proportions, for ChartSlideDownload.
  const draw = (staged: boolean) => (
    <div
      ref={staged ? undefined : ref}
      className="chart"
      style={{ height: staged ? "100%" : 300 }}
      role="img"
      aria-label={`Money each rival spends (${currency ?? "money"}), stacked by front; the numbers are in the table above`}
      data-testid={staged ? undefined : "fronts-allocation-chart"}
    >
      <ResponsiveContainer width="100%" height="100%">
        <BarChart data={rows} margin={{ top: 8, right: 8, bottom: 8, left: 8 }}>
          <CartesianGrid stroke={PAPER.grid} vertical={false} />
          <XAxis
            dataKey="name"
            interval={0}
            tick={{ fontSize: 12 }}
            // a slide has room for whole names
            tickFormatter={(v: string) => (!staged && v.length > 14 ? `${v.slice(0, 13)}…` : v)}
          />
          <YAxis
            tickFormatter={(v: number) => formatNumber(v)}
            width={72}
            label={yAxisCaption(`Spend (${currency ?? "money"})`)}
          />
          <Tooltip
            formatter={(v) => (typeof v === "number" ? formatMoney(v, currency) : String(v))}
          />
          <Legend />
          {fc.fronts.map((f, k) => (
            <Bar
              key={k}
              dataKey={`f${k}`}
              name={f.name}
              stackId="money"
              fill={seriesColour(k)}
              isAnimationActive={false}
            />
          ))}
        </BarChart>
      </ResponsiveContainer>
    </div>
  );
  return (
    <section className="card" aria-labelledby="fronts-chart-title">
      <h2 id="fronts-chart-title">Allocation by rival, stacked by front</h2>
      <ChartWithSlide
        draw={draw}
        chartRef={ref}
        slide={{
          title: "Equilibrium allocation by rival, stacked by front",
          caption: `The money each rival puts on each front at the pure equilibrium of the fronts contest, in ${currency ?? "money"}; a bar's height is the rival's total spend.`,
        }}
        units={`Vertical: spend (${currency ?? "money"}) · across: rival`}
        legend={fc.fronts.map((f, k) => ({ name: f.name, colour: seriesColour(k) }))}
        testId="fronts-allocation-chart"
      />
    </section>
  );
}
