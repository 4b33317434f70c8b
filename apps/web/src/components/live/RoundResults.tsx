"use client";

import {
  Bar,
  BarChart,
  CartesianGrid,
  Legend,
  ResponsiveContainer,
  Tooltip,
  XAxis,
  YAxis,
} from "recharts";
import { useRef } from "react";
import type { RoundResult } from "@contend/protocol";
import { spendPlacement } from "@contend/session";
import { roundSeatRows, type Row } from "../../lib/chartData";
import { formatMoney, formatPercent } from "../../lib/format";
import { chartInk, EQUILIBRIUM_COLOUR, seriesColour } from "../../lib/palette";
import { DataTable } from "../DataTable";
import { Kpi } from "../Kpi";
import { Term } from "../Glossary";
import { ChartSlideDownload } from "../ChartSlideDownload";

/** One revealed round, in money: spends against equilibrium spends, shares, payoffs, regrets. */
export function RoundResults({
  round,
  names,
  currency,
  dark,
  highlightSeat,
  testPrefix = "round",
  slides,
}: {
  round: RoundResult;
  names: readonly string[];
  currency: string | null | undefined;
  dark?: boolean;
  highlightSeat?: number;
  testPrefix?: string;
  /** offer the chart as a slide (SVG, PNG) */
  slides?: boolean;
}) {
  const chartRef = useRef<HTMLDivElement>(null);
  const mixed = round.equilibrium.kind === "mixed";
  const rows: Row[] = roundSeatRows(round, names).map((r) => ({
    ...r,
    below: mixed ? (spendPlacement(round, Number(r.seat))?.probabilityLess ?? null) : null,
  }));
  const money = (v: number) => formatMoney(v, currency);
  const { axis, grid } = chartInk(dark);
  const eqKind = round.equilibrium.kind;
  const reasons = round.moveReasons ?? null;
  return (
    <div data-testid={`${testPrefix}-results`}>
      <div className="kpis" style={{ marginBottom: "0.75rem" }}>
        <Kpi label="Round">{round.round}</Kpi>
        <Kpi
          label={<Term id="dissipation">Share of the prize spent by all</Term>}
          testId={`${testPrefix}-dissipation`}
        >
          {formatPercent(round.dissipation)}
        </Kpi>
        <Kpi label={<Term id="equilibrium">… at equilibrium</Term>}>
          {formatPercent(round.equilibrium.dissipation)}
        </Kpi>
        <Kpi
          label={<Term id="regret">Largest regret (distance from equilibrium)</Term>}
          testId={`${testPrefix}-gap`}
        >
          {money(round.nashGap)}
        </Kpi>
        {round.winner !== null && (
          <Kpi label="Winner drawn" testId={`${testPrefix}-winner`}>
            {names[round.winner] ?? `Seat ${round.winner + 1}`}
          </Kpi>
        )}
      </div>
      <div
        ref={chartRef}
        className="chart"
        style={{ height: 260 }}
        data-testid={`${testPrefix}-chart`}
        role="img"
        aria-label={`Spends played against equilibrium spends, round ${round.round}, in ${currency ?? "money"}`}
      >
        <ResponsiveContainer width="100%" height="100%">
          <BarChart data={rows} margin={{ top: 8, right: 8, bottom: 8, left: 8 }}>
            <CartesianGrid stroke={grid} vertical={false} />
            <XAxis
              dataKey="name"
              stroke={axis}
              interval={0}
              tick={{ fontSize: dark ? 16 : 12 }}
              tickFormatter={(v: string) => (v.length > 16 ? `${v.slice(0, 15)}…` : v)}
            />
            <YAxis stroke={axis} tickFormatter={(v: number) => money(v)} width={72} />
            <Tooltip formatter={(v) => (typeof v === "number" ? money(v) : String(v))} />
            <Legend />
            <Bar
              dataKey="spend"
              name="Spend played"
              fill={seriesColour(0)}
              isAnimationActive={false}
            />
            <Bar
              dataKey="equilibrium"
              name={eqKind === "mixed" ? "Equilibrium spend (expected)" : "Equilibrium spend"}
              fill={EQUILIBRIUM_COLOUR}
              isAnimationActive={false}
            />
          </BarChart>
        </ResponsiveContainer>
      </div>
      {slides && (
        <ChartSlideDownload
          chartRef={chartRef}
          slide={{
            title: `Round ${round.round}: spends against equilibrium`,
            caption: `What each rival spent in round ${round.round} beside its equilibrium spend${eqKind === "mixed" ? " (expected, the equilibrium is mixed)" : ""}, in ${currency ?? "money"}.`,
          }}
          units={`Vertical: spend (${currency ?? "money"}) · across: rival`}
          legend={[
            { name: "Spend played", colour: seriesColour(0) },
            {
              name: eqKind === "mixed" ? "Equilibrium spend (expected)" : "Equilibrium spend",
              colour: EQUILIBRIUM_COLOUR,
            },
          ]}
          testId={`${testPrefix}-chart`}
        />
      )}
      {mixed ? (
        <p className="small muted" data-testid={`${testPrefix}-mixed-note`}>
          The <Term id="mixed-equilibrium">equilibrium is mixed</Term>: each rival draws its spend
          at random. &ldquo;Equilibrium spend&rdquo; is the expected spend; the chance column says
          how often the equilibrium would have spent less than the spend played.
        </p>
      ) : null}
      <DataTable
        caption={`Round ${round.round}: per seat`}
        testId={`${testPrefix}-table`}
        maxHeight={dark ? 600 : 320}
        rows={rows.map((r) => ({
          ...r,
          name: r.seat === highlightSeat ? `${String(r.name)} (you)` : (r.name ?? null),
        }))}
        columns={[
          { key: "name", label: "Rival" },
          { key: "spend", label: "Spend", format: money },
          {
            key: "equilibrium",
            label: mixed ? "Equilibrium spend (expected)" : "Equilibrium spend",
            format: money,
          },
          ...(mixed
            ? [
                {
                  key: "below",
                  label: "Chance equilibrium spends less",
                  format: (v: number) => formatPercent(v),
                },
              ]
            : []),
          { key: "share", label: "Share", format: (v) => formatPercent(v) },
          { key: "payoff", label: "Payoff", format: money },
          { key: "bestResponse", label: "Best reply (spend)", format: money },
          { key: "regret", label: "Regret", format: money },
          { key: "total", label: "Running total", format: money },
          { key: "defaulted", label: "Missed" },
        ]}
      />
      {round.note ? (
        <p
          className="notice small"
          data-testid={`${testPrefix}-note`}
          style={{ marginTop: "0.75rem" }}
        >
          <strong>Facilitator&apos;s note:</strong> {round.note}
        </p>
      ) : null}
      {reasons ? (
        <div data-testid={`${testPrefix}-reasons`} style={{ marginTop: "0.75rem" }}>
          <h4 style={{ margin: "0 0 0.25rem" }}>Reasons given with the moves</h4>
          <ul className="small" style={{ margin: 0, paddingLeft: "1.2rem" }}>
            {reasons.map((text, seat) =>
              text === null ? null : (
                <li key={seat} data-seat={seat}>
                  <strong>{names[seat] ?? `Seat ${seat + 1}`}</strong>: {text}
                </li>
              ),
            )}
          </ul>
        </div>
      ) : null}
    </div>
  );
}
