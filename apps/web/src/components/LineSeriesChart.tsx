"use client";

import {
  CartesianGrid,
  Legend,
  Line,
  LineChart,
  ReferenceLine,
  ResponsiveContainer,
  Tooltip,
  XAxis,
  YAxis,
} from "recharts";
import { useRef } from "react";
import { axesUnits, CAPTIONED_MARGIN, numberXAxis, seriesLine, valueYAxis } from "../lib/chartAxes";
import { wholeNumberTicks } from "../lib/chartData";
import { chartInk } from "../lib/palette";
import { ChartWithSlide } from "./ChartSlideDownload";
import type { SlideText } from "./ChartSlideDownload";
import type { AxisMark, Row } from "../lib/chartData";

export interface Series {
  key: string;
  name: string;
  colour: string;
  dashed?: boolean;
}

/** A line chart with fixed height (no layout jump) and no animation (stable for reading). */
export function LineSeriesChart({
  rows,
  xKey,
  series,
  xLabel,
  yLabel,
  formatY,
  formatX,
  marks = [],
  testId,
  dark,
  height = 300,
  slide,
  maxXTicks,
}: {
  rows: readonly Row[];
  xKey: string;
  series: readonly Series[];
  xLabel: string;
  yLabel: string;
  formatY?: (v: number) => string;
  formatX?: (v: number) => string;
  /** vertical marks on the x axis (every shocked round, a chosen point), each with a short label */
  marks?: readonly AxisMark[];
  testId?: string;
  dark?: boolean;
  height?: number;
  /** when given: buttons that save the chart as a 1920 x 1080 slide (SVG, PNG) */
  slide?: SlideText;
  /** at most this many ticks on a whole-number x axis (default MAX_WHOLE_TICKS) */
  maxXTicks?: number;
}) {
  const ref = useRef<HTMLDivElement>(null);
  const { axis, grid } = chartInk(dark);
  // Rounds (every x a whole number) get one tick per round, never "1, 2, 2, 3".
  const ticks = wholeNumberTicks(rows, xKey, maxXTicks);
  // `staged`: the copy drawn off screen at slide proportions, for ChartSlideDownload.
  const draw = (staged: boolean) => (
    <div
      ref={staged ? undefined : ref}
      className="chart"
      style={{ height: staged ? "100%" : height }}
      data-testid={staged ? undefined : testId}
      role="img"
      aria-label={`Chart: ${yLabel} against ${xLabel}, one line each for ${series
        .map((s) => s.name)
        .join(", ")}.${
        marks.length > 0
          ? ` Marked: ${marks.map((m) => `${xLabel} ${m.x} (${m.label})`).join("; ")}.`
          : ""
      }`}
    >
      <ResponsiveContainer width="100%" height="100%">
        <LineChart data={rows as Row[]} margin={CAPTIONED_MARGIN}>
          <CartesianGrid stroke={grid} />
          <XAxis
            {...numberXAxis(xLabel, formatX, axis)}
            dataKey={xKey}
            ticks={ticks ?? undefined}
            allowDecimals={ticks === null}
            interval={ticks === null ? undefined : 0}
          />
          <YAxis {...valueYAxis(yLabel, formatY, axis)} />
          <Tooltip
            formatter={(v) => (typeof v === "number" && formatY ? formatY(v) : String(v))}
            labelFormatter={(v) =>
              typeof v === "number" && formatX
                ? `${xLabel}: ${formatX(v)}`
                : `${xLabel}: ${String(v)}`
            }
          />
          <Legend verticalAlign="top" wrapperStyle={{ paddingBottom: 6 }} />
          {marks.map((m) => (
            <ReferenceLine
              key={m.x}
              x={m.x}
              stroke={axis}
              strokeDasharray="4 3"
              label={{
                value: m.label,
                // left of the line, except at the first x, where that would cover the y axis
                position:
                  ticks !== null && m.x <= (ticks[0] ?? m.x) ? "insideTopLeft" : "insideTopRight",
                fill: axis,
                fontSize: 11,
              }}
            />
          ))}
          {series.map((s) => (
            <Line
              key={s.key}
              dataKey={s.key}
              name={s.name}
              stroke={s.colour}
              strokeDasharray={s.dashed ? "6 4" : undefined}
              {...seriesLine(rows.length)}
            />
          ))}
        </LineChart>
      </ResponsiveContainer>
    </div>
  );
  return (
    <ChartWithSlide
      draw={draw}
      chartRef={ref}
      slide={slide}
      units={axesUnits(yLabel, xLabel)}
      legend={series}
      testId={testId}
    />
  );
}
