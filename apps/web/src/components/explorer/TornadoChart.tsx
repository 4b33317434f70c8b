"use client";

import type { TornadoRow } from "@contend/solver";
import { seriesColour } from "../../lib/palette";
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
}: {
  rows: TornadoRow[];
  rival: number;
  label: (path: string) => string;
  format: (x: number) => string;
  formatParam: (path: string, x: number) => string;
}) {
  const max = Math.max(1e-300, ...rows.map((r) => Math.abs(r.payoffSwing[rival] ?? 0)));
  return (
    <div className={styles.rows} data-testid="tornado-chart">
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
  );
}
