"use client";

import type { Band } from "@contend/solver";
import { seriesColour } from "../../lib/palette";
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
  const [lo, hi] = spreadDomain([...band.p10, ...band.p90, ...band.mean]);
  return (
    <figure style={{ margin: 0 }} data-testid={testId}>
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
    </figure>
  );
}
