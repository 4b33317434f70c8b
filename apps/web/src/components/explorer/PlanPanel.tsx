"use client";

import type { RobustPlan } from "@contend/solver";
import { formatNumber } from "../../lib/format";
import { FigureTable, numCol, RowHeader, textCol } from "../FigureTable";
import { pos } from "./BandChart";
import styles from "./UncertainCharts.module.css";

const BINS = 24;

function histogram(xs: number[], lo: number, hi: number): number[] {
  const counts = new Array<number>(BINS).fill(0);
  for (const x of xs) {
    const k = Math.min(BINS - 1, Math.max(0, Math.floor(((x - lo) / (hi - lo)) * BINS)));
    counts[k]!++;
  }
  return counts;
}

/**
 * The robust plan of one rival: the spend that does best on average over the draws, its payoff
 * distribution, and the same figures for simply spending the median scenario's equilibrium
 * amount.
 */
export function PlanPanel({ plan, money }: { plan: RobustPlan; money: (x: number) => string }) {
  if (plan.drawsUsed === 0) {
    return <p className="muted">No draw has a pure-strategy equilibrium, so there is no plan.</p>;
  }
  let lo = Infinity;
  let hi = -Infinity;
  for (const x of plan.payoffByDraw) {
    if (x < lo) lo = x;
    if (x > hi) hi = x;
  }
  const [a, b] = hi > lo ? [lo, hi] : [lo, lo + 1];
  const counts = histogram(plan.payoffByDraw, a, b);
  const top = Math.max(...counts);
  const m = plan.atMedianEquilibrium;
  const row = (name: string, spend: number | null, s: typeof m) =>
    s && (
      <tr>
        <RowHeader>{name}</RowHeader>
        <td className="num">{spend === null ? "–" : money(spend)}</td>
        <td className="num">{money(s.expectedPayoff)}</td>
        <td className="num">{money(s.p10Payoff)}</td>
        <td className="num">{money(s.p90Payoff)}</td>
        <td className="num">{money(s.meanRegret)}</td>
      </tr>
    );
  return (
    <div data-testid="robust-plan">
      <p>
        <strong>
          {plan.rival}: spend {money(plan.spend)}
        </strong>{" "}
        — the spend with the best average payoff over {formatNumber(plan.drawsUsed, 0)} draws when
        the others play each draw&apos;s equilibrium.
      </p>
      <FigureTable
        head={[
          textCol("Play"),
          numCol("Spend"),
          numCol("Expected payoff"),
          numCol("P10 payoff"),
          numCol("P90 payoff"),
          numCol("Mean regret"),
        ]}
        testId="plan-table"
      >
        {row("Robust plan", plan.spend, plan)}
        {row("Median scenario's equilibrium", plan.equilibriumSpendAtMedians, m)}
      </FigureTable>
      <p className="small muted">
        Regret: money left on the table in a draw against that draw&apos;s best reply.
      </p>
      <figure style={{ margin: "0.5rem 0 0" }}>
        <figcaption className="small">
          Payoff of the plan across the draws (count per bin; dashed: P10, P50, P90)
        </figcaption>
        <div className={styles.hist} data-testid="plan-histogram">
          {counts.map((c, k) => (
            <div
              key={k}
              style={{ height: `${(100 * c) / Math.max(1, top)}%` }}
              title={`${c} draws`}
            />
          ))}
          {(
            [
              ["P10", plan.p10Payoff],
              ["P50", plan.p50Payoff],
              ["P90", plan.p90Payoff],
            ] as const
          ).map(([name, x]) => (
            <div key={name} className={styles.marker} style={{ left: pos(x, a, b) }}>
              <span className={styles.markerLabel}>{name}</span>
            </div>
          ))}
        </div>
        <div className={styles.axis} style={{ gridColumn: "auto" }}>
          <span>{money(a)}</span>
          <span>{money(b)}</span>
        </div>
      </figure>
    </div>
  );
}
