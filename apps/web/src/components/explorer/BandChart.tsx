"use client";

import { useRef } from "react";
import type { Band } from "@contend/solver";
import { PAPER, seriesColour } from "../../lib/palette";
import { ChartSlideDownload } from "../ChartSlideDownload";
import styles from "./UncertainCharts.module.css";

export function isNum(x: number | null | undefined): x is number {
  return typeof x === "number";
}

/** Where x sits on [lo, hi], in percent of the track. */
export function pos(x: number, lo: number, hi: number): string {
  return `${(100 * (x - lo)) / (hi - lo)}%`;
}

/** A domain zoomed on the values with a little room either side, so narrow bands stay visible. */
export function spreadDomain(values: (number | null)[]): [number, number] {
  const xs = values.filter((x): x is number => x !== null && Number.isFinite(x));
  if (xs.length === 0) return [0, 1];
  const lo = Math.min(...xs);
  const hi = Math.max(...xs);
  const pad = hi > lo ? 0.08 * (hi - lo) : Math.max(1e-9, 0.05 * Math.abs(lo));
  return [lo - pad, hi + pad];
}

/**
 * A fan chart per rival: the P10–P90 band, the median as a bar and the mean as a ring, on one
 * axis shared by all rivals; the three figures are written under each row.
 */
export function BandChart({
  title,
  names,
  band,
  format,
  testId,
}: {
  title: string;
  names: string[];
  band: Band;
  format: (x: number) => string;
  testId: string;
}) {
  const ref = useRef<HTMLElement>(null);
  const [lo, hi] = spreadDomain([...band.p10, ...band.p90, ...band.mean]);
  return (
    <figure ref={ref} style={{ margin: 0 }} data-testid={testId}>
      <figcaption>
        <strong>{title}</strong>
      </figcaption>
      <div className={styles.rows}>
        {names.map((name, i) => {
          const p10 = band.p10[i];
          const p50 = band.p50[i];
          const p90 = band.p90[i];
          const mean = band.mean[i];
          const colour = seriesColour(i);
          return [
            <div key={`n${i}`} className={styles.name}>
              {name}
            </div>,
            <div key={`t${i}`} className={styles.track} style={{ color: colour }}>
              {lo < 0 && hi > 0 && <div className={styles.zero} style={{ left: pos(0, lo, hi) }} />}
              {isNum(p10) && isNum(p90) && (
                <div
                  className={styles.band}
                  style={{
                    left: pos(p10, lo, hi),
                    width: `max(2px, ${pos(p90 - p10 + lo, lo, hi)})`,
                    background: colour,
                  }}
                />
              )}
              {isNum(p50) && (
                <div
                  className={styles.median}
                  style={{ left: pos(p50, lo, hi), background: colour }}
                />
              )}
              {isNum(mean) && <div className={styles.mean} style={{ left: pos(mean, lo, hi) }} />}
            </div>,
            <div key={`f${i}`} className={styles.figures}>
              {!isNum(p50) || !isNum(p10) || !isNum(p90)
                ? "no draw with a pure equilibrium"
                : `P10 ${format(p10)} · P50 ${format(p50)} · P90 ${format(p90)}${!isNum(mean) ? "" : ` · mean ${format(mean)}`}`}
            </div>,
          ];
        })}
        <div className={styles.axis} aria-hidden="true">
          <span>{format(lo)}</span>
          <span>{format((lo + hi) / 2)}</span>
          <span>{format(hi)}</span>
        </div>
      </div>
      <ChartSlideDownload
        chartRef={ref}
        drawForSlide={() => <FanDrawing names={names} band={band} format={format} />}
        slide={{
          title: `${title} at equilibrium: the range over the draws`,
          caption:
            "Per rival, the band runs from the 10th to the 90th percentile of its equilibrium value over the Monte Carlo draws of the uncertain inputs; the bar is the median, the ring the mean. A model's spread, not a forecast.",
        }}
        units={`Across: ${title} · one row per rival`}
        legend={names.map((n, i) => ({ name: n, colour: seriesColour(i) }))}
        testId={testId}
      />
    </figure>
  );
}

const FAN = { width: 980, left: 200, right: 24, row: 56, axis: 36 };

/** The fan chart as SVG, for its slide: the same bands, bars and rings as the page's rows. */
function FanDrawing({
  names,
  band,
  format,
}: {
  names: string[];
  band: Band;
  format: (x: number) => string;
}) {
  const [lo, hi] = spreadDomain([...band.p10, ...band.p90, ...band.mean]);
  const track = FAN.width - FAN.left - FAN.right;
  const sx = (x: number) => FAN.left + (track * (x - lo)) / (hi - lo);
  const height = names.length * FAN.row + FAN.axis;
  const ticks = [lo, (lo + hi) / 2, hi];
  return (
    <svg
      data-slide-chart
      width={FAN.width}
      height={height}
      viewBox={`0 0 ${FAN.width} ${height}`}
      fontSize={14}
    >
      {lo < 0 && hi > 0 && (
        <line x1={sx(0)} x2={sx(0)} y1={0} y2={names.length * FAN.row} stroke="#8a94a3" />
      )}
      {names.map((name, i) => {
        const [p10, p50, p90, mean] = [band.p10[i], band.p50[i], band.p90[i], band.mean[i]];
        const mid = i * FAN.row + FAN.row / 2;
        const colour = seriesColour(i);
        return (
          <g key={i}>
            <text x={0} y={mid + 5} fill="#14202c">
              {name.length > 22 ? `${name.slice(0, 21)}…` : name}
            </text>
            <line x1={FAN.left} x2={FAN.left + track} y1={mid} y2={mid} stroke={PAPER.grid} />
            {isNum(p10) && isNum(p90) && (
              <rect
                x={sx(p10)}
                y={mid - 12}
                width={Math.max(2, sx(p90) - sx(p10))}
                height={24}
                fill={colour}
                fillOpacity={0.3}
              />
            )}
            {isNum(p50) && (
              <rect x={sx(p50) - 2} y={mid - 16} width={4} height={32} fill={colour} />
            )}
            {isNum(mean) && (
              <circle cx={sx(mean)} cy={mid} r={7} fill="none" stroke="#14202c" strokeWidth={2} />
            )}
          </g>
        );
      })}
      <line
        x1={FAN.left}
        x2={FAN.left + track}
        y1={names.length * FAN.row}
        y2={names.length * FAN.row}
        stroke={PAPER.axis}
      />
      {ticks.map((t, k) => (
        <text
          key={k}
          x={sx(t)}
          y={names.length * FAN.row + 24}
          fill={PAPER.axis}
          textAnchor={k === 0 ? "start" : k === 1 ? "middle" : "end"}
        >
          {format(t)}
        </text>
      ))}
    </svg>
  );
}
