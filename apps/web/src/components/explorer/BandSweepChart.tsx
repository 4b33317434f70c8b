"use client";

import { useRef } from "react";
import {
  Area,
  CartesianGrid,
  ComposedChart,
  Legend,
  Line,
  ResponsiveContainer,
  Tooltip,
  XAxis,
  YAxis,
} from "recharts";
import { bandMidKey, bandPairKey } from "../../lib/bandRows";
import type { BandRows } from "../../lib/bandRows";
import {
  axesUnits,
  CAPTIONED_MARGIN,
  numberXAxis,
  seriesLine,
  valueYAxis,
} from "../../lib/chartAxes";
import { chartInk, seriesColour } from "../../lib/palette";
import { ChartWithSlide } from "../ChartSlideDownload";
import type { SlideText } from "../ChartSlideDownload";

/**
 * A sweep with bands: per rival, a shaded area from P10 to P90 over the draws and a line at the
 * median (P50), against the swept value. Fixed height, no animation.
 */
export function BandSweepChart({
  rows,
  names,
  xLabel,
  yLabel,
  formatX,
  formatY,
  testId,
  slide,
}: {
  rows: BandRows["chart"];
  names: readonly string[];
  xLabel: string;
  yLabel: string;
  formatX: (v: number) => string;
  formatY: (v: number) => string;
  testId: string;
  /** when given: buttons that save the chart as a 1920 x 1080 slide (SVG, PNG) */
  slide?: SlideText;
}) {
  const ref = useRef<HTMLDivElement>(null);
  const { axis, grid } = chartInk();
  // `staged`: the copy drawn off screen at slide proportions, for ChartSlideDownload.
  const draw = (staged: boolean) => (
    <div
      ref={staged ? undefined : ref}
      className="chart"
      style={{ height: staged ? "100%" : 300 }}
      data-testid={staged ? undefined : testId}
      role="img"
      aria-label={`Chart: ${yLabel} against ${xLabel}, for ${names.join(", ")}: a band from the 10th to the 90th percentile over the draws and a line at the median. The table below lists the same numbers.`}
    >
      <ResponsiveContainer width="100%" height="100%">
        <ComposedChart data={rows} margin={CAPTIONED_MARGIN}>
          <CartesianGrid stroke={grid} />
          <XAxis {...numberXAxis(xLabel, formatX, axis)} dataKey="x" />
          <YAxis {...valueYAxis(yLabel, formatY, axis)} />
          <Tooltip
            formatter={(v) =>
              Array.isArray(v)
                ? `${formatY(Number(v[0]))} to ${formatY(Number(v[1]))}`
                : typeof v === "number"
                  ? formatY(v)
                  : String(v)
            }
            labelFormatter={(v) => `${xLabel}: ${typeof v === "number" ? formatX(v) : String(v)}`}
          />
          <Legend verticalAlign="top" wrapperStyle={{ paddingBottom: 6 }} />
          {names.map((n, i) => (
            <Area
              key={`band-${i}`}
              dataKey={bandPairKey(i)}
              name={`${n} P10-P90`}
              stroke="none"
              fill={seriesColour(i)}
              fillOpacity={0.2}
              isAnimationActive={false}
              type="linear"
            />
          ))}
          {names.map((n, i) => (
            <Line
              key={`mid-${i}`}
              dataKey={bandMidKey(i)}
              name={`${n} median`}
              stroke={seriesColour(i)}
              {...seriesLine(rows.length)}
            />
          ))}
        </ComposedChart>
      </ResponsiveContainer>
    </div>
  );
  return (
    <ChartWithSlide
      draw={draw}
      chartRef={ref}
      slide={slide}
      units={axesUnits(yLabel, xLabel)}
      legend={names.map((n, i) => ({
        name: `${n}: median, shaded P10-P90`,
        colour: seriesColour(i),
      }))}
      testId={testId}
    />
  );
}
