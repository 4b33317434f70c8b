"use client";

import type { Contest, Equilibrium, MixedStrategy } from "@contend/solver";
import { formatMoney, formatPercent } from "../../lib/format";
import styles from "./MixedStrategyChart.module.css";

/** The heaviest points of a finite mix, in spend, for the caption and screen readers. */
function heaviest(s: MixedStrategy, cost: number, money: (x: number) => string): string {
  if (!s.points) {
    const range = `spread over ${money(cost * s.low)} to ${money(cost * s.high)}`;
    return s.atomAtZero > 0 ? `nothing ${formatPercent(s.atomAtZero)}, else ${range}` : range;
  }
  return s.points
    .filter((p) => p.probability >= 0.01)
    .sort((a, b) => b.probability - a.probability)
    .slice(0, 3)
    .sort((a, b) => a.effort - b.effort)
    .map((p) => `${money(cost * p.effort)} (${formatPercent(p.probability)})`)
    .join(", ");
}

/**
 * A mixed equilibrium, one row per rival: how likely each spend is (bars for a finite mix,
 * a band for a continuous one, a bar at zero for the chance of spending nothing), with the
 * expected spend dashed. Spends share one axis, from 0 to the largest spend any rival plays.
 */
export function MixedStrategyChart({
  contest,
  equilibrium,
  currency,
}: {
  contest: Contest;
  equilibrium: Equilibrium;
  currency: string | null;
}) {
  const strategies = equilibrium.strategies;
  if (equilibrium.kind !== "mixed" || !strategies) return null;
  const money = (x: number) => formatMoney(x, currency);
  const top = Math.max(1e-300, ...strategies.map((s, i) => contest.rivals[i]!.cost * s.high));
  const x = (spend: number) => `${Math.min(100, (100 * spend) / top)}%`;
  return (
    <div data-testid="mixed-chart">
      <h3>How likely each spend is</h3>
      <p className="small muted">
        No rival has one best spend here: each draws its spend at random with these chances (dashed:
        the expected spend).
      </p>
      <div className={styles.rows}>
        {strategies.map((s, i) => {
          const rv = contest.rivals[i]!;
          const maxP = Math.max(s.atomAtZero, ...(s.points ?? []).map((p) => p.probability));
          const summary = heaviest(s, rv.cost, money);
          return [
            <div key={`n${i}`} className={styles.name}>
              {rv.name}
            </div>,
            <div
              key={`t${i}`}
              className={styles.track}
              role="img"
              aria-label={`${rv.name}: ${summary}; expected spend ${money(rv.cost * s.mean)}`}
              data-testid={`mixed-chart-${i}`}
            >
              {s.points
                ? s.points
                    .filter((p) => p.probability > 0)
                    .map((p, k) => (
                      <div
                        key={k}
                        className={styles.bar}
                        style={{
                          left: x(rv.cost * p.effort),
                          height: `${Math.max(2, (100 * p.probability) / maxP)}%`,
                        }}
                      />
                    ))
                : [
                    s.atomAtZero > 0 ? (
                      <div key="atom" className={styles.bar} style={{ left: 0, height: "100%" }} />
                    ) : null,
                    <div
                      key="band"
                      className={styles.band}
                      style={{
                        left: x(rv.cost * s.low),
                        width: `calc(${x(rv.cost * (s.high - s.low))})`,
                        height: "50%",
                      }}
                    />,
                  ]}
              <div className={styles.mean} style={{ left: x(rv.cost * s.mean) }} />
            </div>,
            <div key={`f${i}`} className={styles.figures}>
              {summary} · expected spend {money(rv.cost * s.mean)}
            </div>,
          ];
        })}
        <div className={styles.axis} aria-hidden="true">
          <span>{money(0)}</span>
          <span>spend</span>
          <span>{money(top)}</span>
        </div>
      </div>
    </div>
  );
}
