/**
 * The axes and lines of the charts that plot a value against a number (sweeps, rounds, bands),
 * and the y-axis caption every Recharts chart writes along its left edge.
 */
import type { XAxisProps, YAxisProps } from "recharts";

/** Room for the captions under the x axis and along the y axis. */
export const CAPTIONED_MARGIN = { top: 8, right: 16, bottom: 24, left: 8 };

/** The caption along the y axis, turned a quarter and centred; in `fill` when given. */
export function yAxisCaption(value: string, fill?: string) {
  return {
    value,
    angle: -90,
    position: "insideLeft" as const,
    ...(fill === undefined ? {} : { fill }),
    style: { textAnchor: "middle" as const },
  };
}

/** A number x axis over the data's range, ticks in `format`, its caption under it. */
export function numberXAxis(
  caption: string,
  format: ((v: number) => string) | undefined,
  axis: string,
): XAxisProps {
  return {
    type: "number",
    domain: ["dataMin", "dataMax"],
    tickFormatter: format,
    stroke: axis,
    label: { value: caption, position: "insideBottom", offset: -12, fill: axis },
  };
}

/** The value axis: ticks in `format`, 72 px wide for money, its caption along it. */
export function valueYAxis(
  caption: string,
  format: ((v: number) => string) | undefined,
  axis: string,
): YAxisProps {
  return { tickFormatter: format, stroke: axis, width: 72, label: yAxisCaption(caption, axis) };
}

/** How a series line is drawn: 2 px, dots only when there are few points, gaps left open. */
export function seriesLine(points: number) {
  return {
    strokeWidth: 2,
    dot: points <= 20,
    connectNulls: false,
    isAnimationActive: false,
    type: "linear" as const,
  };
}

/** What a chart's slide says of its axes. */
export function axesUnits(yCaption: string, xCaption: string): string {
  return `Vertical: ${yCaption} · across: ${xCaption}`;
}
