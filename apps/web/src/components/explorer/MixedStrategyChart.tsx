"use client";

import { useRef } from "react";
import type { Contest, Equilibrium, MixedStrategy } from "@contend/solver";
import { formatMoney, formatPercent } from "../../lib/format";
import { PAPER, seriesColour } from "../../lib/palette";
import { ChartSlideDownload } from "../ChartSlideDownload";
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
  const ref = useRef<HTMLDivElement>(null);
  const strategies = equilibrium.strategies;
  if (equilibrium.kind !== "mixed" || !strategies) return null;
  const money = (x: number) => formatMoney(x, currency);
  const top = Math.max(1e-300, ...strategies.map((s, i) => contest.rivals[i]!.cost * s.high));
  const x = (spend: number) => `${Math.min(100, (100 * spend) / top)}%`;
  return (
    <div ref={ref} data-testid="mixed-chart">
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
      <ChartSlideDownload
        chartRef={ref}
        drawForSlide={() => (
          <MixedDrawing contest={contest} strategies={strategies} top={top} money={money} />
        )}
        slide={{
          title: "How likely each spend is: the mixed equilibrium",
          caption:
            "No rival has one best spend: each draws its spend at random with these chances. Bar height is a spend's chance relative to that rival's likeliest spend (a shaded band: spread evenly over that range); the dashed line is the expected spend.",
        }}
        units={`Across: spend (${currency ?? "money"}) · one row per rival`}
        legend={contest.rivals.map((r, i) => ({ name: r.name, colour: seriesColour(i) }))}
        testId="mixed-chart"
      />
    </div>
  );
}

const MIX = { width: 980, left: 200, right: 24, row: 72, axis: 36 };

/** The mixed equilibrium as SVG, for its slide: the same bars, bands and expected spends as the rows. */
function MixedDrawing({
  contest,
  strategies,
  top,
  money,
}: {
  contest: Contest;
  strategies: readonly MixedStrategy[];
  top: number;
  money: (x: number) => string;
}) {
  const track = MIX.width - MIX.left - MIX.right;
  const sx = (spend: number) => MIX.left + track * Math.min(1, spend / top);
  const base = strategies.length * MIX.row;
  const height = base + MIX.axis;
  return (
    <svg
      data-slide-chart
      width={MIX.width}
      height={height}
      viewBox={`0 0 ${MIX.width} ${height}`}
      fontSize={14}
    >
      {strategies.map((s, i) => {
        const rv = contest.rivals[i]!;
        const colour = seriesColour(i);
        const floor = (i + 1) * MIX.row - 8;
        const tall = MIX.row - 20;
        const maxP = Math.max(s.atomAtZero, ...(s.points ?? []).map((p) => p.probability));
        const bar = (spend: number, p: number, key: string) => {
          const h = Math.max(2, (tall * p) / maxP);
          return (
            <rect key={key} x={sx(spend) - 2} y={floor - h} width={4} height={h} fill={colour} />
          );
        };
        return (
          <g key={i}>
            <text x={0} y={floor - tall / 2} fill="#14202c">
              {rv.name.length > 22 ? `${rv.name.slice(0, 21)}…` : rv.name}
            </text>
            <line x1={MIX.left} x2={MIX.left + track} y1={floor} y2={floor} stroke={PAPER.grid} />
            {s.points
              ? s.points
                  .filter((p) => p.probability > 0)
                  .map((p, k) => bar(rv.cost * p.effort, p.probability, `p${k}`))
              : [
                  s.atomAtZero > 0 ? bar(0, s.atomAtZero, "atom") : null,
                  <rect
                    key="band"
                    x={sx(rv.cost * s.low)}
                    y={floor - tall / 2}
                    width={Math.max(2, sx(rv.cost * s.high) - sx(rv.cost * s.low))}
                    height={tall / 2}
                    fill={colour}
                    fillOpacity={0.3}
                  />,
                ]}
            <line
              x1={sx(rv.cost * s.mean)}
              x2={sx(rv.cost * s.mean)}
              y1={floor - tall}
              y2={floor}
              stroke="#14202c"
              strokeWidth={2}
              strokeDasharray="5 4"
            />
          </g>
        );
      })}
      <line x1={MIX.left} x2={MIX.left + track} y1={base} y2={base} stroke={PAPER.axis} />
      {[0, top / 2, top].map((t, k) => (
        <text
          key={k}
          x={sx(t)}
          y={base + 24}
          fill={PAPER.axis}
          textAnchor={k === 0 ? "start" : k === 1 ? "middle" : "end"}
        >
          {money(t)}
        </text>
      ))}
    </svg>
  );
}
