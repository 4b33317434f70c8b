"use client";

import { useRef } from "react";
import type { TornadoRow } from "@contend/solver";
import { PAPER, seriesColour } from "../../lib/palette";
import { ChartSlideDownload } from "../ChartSlideDownload";
import { isNum } from "./BandChart";
import styles from "./UncertainCharts.module.css";

const UP = seriesColour(0);
const DOWN = seriesColour(1);

/**
 * The tornado for one rival: each uncertain parameter's payoff swing (payoff with the parameter
 * at its P90 minus at its P10, the others at their medians), largest swing first, drawn from a
 * zero line (teal: the payoff rises with the parameter, orange: it falls).
 */
export function TornadoChart({
  rows,
  rival,
  label,
  format,
  formatParam,
  rivalName,
  unit,
}: {
  rows: TornadoRow[];
  rival: number;
  label: (path: string) => string;
  format: (x: number) => string;
  formatParam: (path: string, x: number) => string;
  /** for the slide: whose payoff, and its unit */
  rivalName: string;
  unit: string;
}) {
  const ref = useRef<HTMLDivElement>(null);
  const max = Math.max(1e-300, ...rows.map((r) => Math.abs(r.payoffSwing[rival] ?? 0)));
  const named = (r: TornadoRow) =>
    `${label(r.parameter)} (${formatParam(r.parameter, r.low)} .. ${formatParam(r.parameter, r.high)})`;
  return (
    <div>
      <div ref={ref} className={styles.rows} data-testid="tornado-chart">
        {rows.map((r) => {
          const x = r.payoffSwing[rival];
          const w = !isNum(x) ? 0 : (50 * Math.abs(x)) / max;
          return [
            <div key={`n${r.parameter}`} className={styles.name}>
              {label(r.parameter)}{" "}
              <span className="small muted">
                ({formatParam(r.parameter, r.low)} .. {formatParam(r.parameter, r.high)})
              </span>
            </div>,
            <div key={`t${r.parameter}`} className={styles.track}>
              <div className={styles.zero} style={{ left: "50%" }} />
              {isNum(x) && (
                <div
                  className={styles.bar}
                  style={{
                    left: x >= 0 ? "50%" : `${50 - w}%`,
                    width: `max(2px, ${w}%)`,
                    background: x >= 0 ? UP : DOWN,
                  }}
                />
              )}
            </div>,
            <div key={`f${r.parameter}`} className={styles.figures}>
              {!isNum(x)
                ? "no pure equilibrium at one end"
                : `payoff swing ${x >= 0 ? "+" : ""}${format(x)}`}
            </div>,
          ];
        })}
      </div>
      <ChartSlideDownload
        chartRef={ref}
        drawForSlide={() => (
          <TornadoDrawing rows={rows} rival={rival} max={max} named={named} format={format} />
        )}
        slide={{
          title: `Which unknown moves the payoff of ${rivalName} most`,
          caption: `Equilibrium payoff of ${rivalName} with each uncertain input at its 90th percentile minus at its 10th (range in brackets), the others at their medians; largest swing first. A model's sensitivity, not a forecast.`,
        }}
        units={`Across: payoff swing (${unit}), from zero`}
        legend={[
          { name: "payoff rises with the input", colour: UP },
          { name: "payoff falls with the input", colour: DOWN },
        ]}
        testId="tornado-chart"
      />
    </div>
  );
}

const TORNADO = { width: 980, label: 430, row: 44, pad: 90 };

/** The tornado as SVG, for its slide: the same bars from a zero line, the swing beside each. */
function TornadoDrawing({
  rows,
  rival,
  max,
  named,
  format,
}: {
  rows: TornadoRow[];
  rival: number;
  max: number;
  named: (r: TornadoRow) => string;
  format: (x: number) => string;
}) {
  const zero = TORNADO.label + (TORNADO.width - TORNADO.label) / 2;
  const half = (TORNADO.width - TORNADO.label) / 2 - TORNADO.pad;
  const height = rows.length * TORNADO.row + 8;
  return (
    <svg
      data-slide-chart
      width={TORNADO.width}
      height={height}
      viewBox={`0 0 ${TORNADO.width} ${height}`}
      fontSize={14}
    >
      <line x1={zero} x2={zero} y1={0} y2={height} stroke="#8a94a3" />
      {rows.map((r, k) => {
        const x = r.payoffSwing[rival];
        const mid = k * TORNADO.row + TORNADO.row / 2;
        const name = named(r);
        const w = isNum(x) ? Math.max(2, (half * Math.abs(x)) / max) : 0;
        return (
          <g key={r.parameter}>
            <text x={0} y={mid + 5} fill="#14202c">
              {name.length > 52 ? `${name.slice(0, 51)}…` : name}
            </text>
            {isNum(x) ? (
              <>
                <rect
                  x={x >= 0 ? zero : zero - w}
                  y={mid - 12}
                  width={w}
                  height={24}
                  fill={x >= 0 ? UP : DOWN}
                />
                <text
                  x={x >= 0 ? zero + w + 6 : zero - w - 6}
                  y={mid + 5}
                  fill="#14202c"
                  textAnchor={x >= 0 ? "start" : "end"}
                >
                  {`${x >= 0 ? "+" : ""}${format(x)}`}
                </text>
              </>
            ) : (
              <text x={zero + 6} y={mid + 5} fill={PAPER.axis}>
                no pure equilibrium at one end
              </text>
            )}
          </g>
        );
      })}
    </svg>
  );
}
