"use client";

import type { RoundResult } from "@contend/protocol";
import { perSeatOverRounds, roundMarks, seatHistoryRows } from "../../lib/chartData";
import { changesBetweenRounds, shockLineText } from "../../lib/shockText";
import { formatMoney, formatPlain } from "../../lib/format";
import { EQUILIBRIUM_COLOUR, seriesColour } from "../../lib/palette";
import { DataTable } from "../DataTable";
import { LineSeriesChart } from "../LineSeriesChart";
import type { Series } from "../LineSeriesChart";
import type { Row } from "../../lib/chartData";
import type { SlideText } from "../ChartSlideDownload";

/** How a round axis reads on a slide: what the marks and the sign on a round number mean. */
const MARKS_CAPTION =
  "A dashed vertical line marks a round whose contest changed (\u26a1) or that the facilitator noted.";

/** A chart of money per round (rounds on x, whole numbers; y in the session's currency). */
function RoundsChart({
  rows,
  yLabel,
  series,
  testId,
  currency,
  changed,
  notes = [],
  dark,
  height,
  slide,
}: {
  rows: readonly Row[];
  yLabel: string;
  series: readonly Series[];
  testId: string;
  currency: string | null | undefined;
  /** rounds whose contest changed from the round before: marked on the round axis */
  changed: ReadonlySet<number>;
  /** rounds with a facilitator's note: also marked */
  notes?: readonly RoundResult[];
  dark?: boolean;
  height?: number;
  slide?: SlideText;
}) {
  return (
    <LineSeriesChart
      slide={slide}
      rows={rows}
      xKey="round"
      xLabel="Round"
      yLabel={`${yLabel} (${currency ?? "money"})`}
      formatY={(v) => formatMoney(v, currency)}
      formatX={(v) => `${formatPlain(v, 0)}${changed.has(v) ? " \u26a1" : ""}`}
      marks={roundMarks(changed, notes)}
      testId={testId}
      dark={dark}
      height={height}
      series={series}
    />
  );
}

/** One seat across rounds, in money: its spend, the equilibrium spend, its best reply; regrets. */
export function SeatHistory({
  rounds,
  seat,
  currency,
}: {
  rounds: readonly RoundResult[];
  seat: number;
  currency: string | null | undefined;
}) {
  const rows = seatHistoryRows(rounds, seat);
  const money = (v: number) => formatMoney(v, currency);
  const changes = changesBetweenRounds(rounds, currency ?? null);
  const changed = new Set(changes.map((c) => c.round));
  return (
    <div>
      <RoundsChart
        rows={rows}
        yLabel="Spend"
        testId="seat-history-chart"
        currency={currency}
        changed={changed}
        height={240}
        series={[
          { key: "spend", name: "Your spend", colour: seriesColour(0) },
          {
            key: "equilibrium",
            name: "Equilibrium spend",
            colour: EQUILIBRIUM_COLOUR,
            dashed: true,
          },
          { key: "bestResponse", name: "Best reply", colour: seriesColour(1), dashed: true },
        ]}
      />
      <DataTable
        caption="Your rounds"
        testId="seat-history-table"
        rows={rows}
        columns={[
          { key: "round", label: "Round" },
          { key: "spend", label: "Spend", format: money },
          { key: "equilibrium", label: "Equilibrium spend", format: money },
          { key: "bestResponse", label: "Best reply (spend)", format: money },
          { key: "regret", label: "Regret", format: money },
          { key: "payoff", label: "Payoff", format: money },
          { key: "total", label: "Running total", format: money },
        ]}
      />
    </div>
  );
}

/** Every seat across rounds, in money: spends against each seat's equilibrium spend, and regrets. */
export function RoomHistory({
  rounds,
  names,
  currency,
  dark,
  testPrefix = "history",
  slideTitle,
}: {
  rounds: readonly RoundResult[];
  names: readonly string[];
  currency: string | null | undefined;
  dark?: boolean;
  testPrefix?: string;
  /** when given (the session's title): each chart can be saved as a slide */
  slideTitle?: string;
}) {
  const seats = names.map((_, i) => i).filter((s) => rounds.some((r) => r.seatIndices.includes(s)));
  const effort = perSeatOverRounds(rounds, seats, (r, s) => r.spends[s] ?? null);
  const eq = perSeatOverRounds(rounds, seats, (r, s) => r.equilibriumSpends[s] ?? null);
  const regret = perSeatOverRounds(rounds, seats, (r, s) => r.regrets[s] ?? null);
  const merged = effort.map((row, k) => {
    const out = { ...row };
    for (const s of seats) out[`eq${s}`] = eq[k]?.[`s${s}`] ?? null;
    return out;
  });
  const money = (v: number) => formatMoney(v, currency);
  const nameOf = (s: number) => names[s] ?? `Seat ${s + 1}`;
  const changes = changesBetweenRounds(rounds, currency ?? null);
  const changed = new Set(changes.map((c) => c.round));
  return (
    <div className="grid-2">
      <div>
        <h3>Spends against equilibrium</h3>
        <RoundsChart
          rows={merged}
          yLabel="Spend"
          currency={currency}
          changed={changed}
          notes={rounds}
          testId={`${testPrefix}-effort-chart`}
          dark={dark}
          slide={
            slideTitle === undefined
              ? undefined
              : {
                  title: `${slideTitle}: spends against equilibrium`,
                  caption: `Each rival's spend per round (solid) and its equilibrium spend (dashed), in ${currency ?? "money"}. ${MARKS_CAPTION}`,
                }
          }
          series={seats.flatMap((s) => [
            { key: `s${s}`, name: nameOf(s), colour: seriesColour(s) },
            {
              key: `eq${s}`,
              name: `${nameOf(s)} (equilibrium)`,
              colour: seriesColour(s),
              dashed: true,
            },
          ])}
        />
        <DataTable
          caption="Spends by round (equilibrium spend in brackets)"
          testId={`${testPrefix}-effort-table`}
          rows={merged.map((row) => {
            const out: Record<string, string | number | null> = { round: row.round ?? null };
            for (const s of seats) {
              const e = row[`s${s}`];
              const q = row[`eq${s}`];
              out[`s${s}`] =
                typeof e === "number"
                  ? `${money(e)} (${typeof q === "number" ? money(q) : "\u2013"})`
                  : null;
            }
            return out;
          })}
          columns={[
            { key: "round", label: "Round" },
            ...seats.map((s) => ({ key: `s${s}`, label: nameOf(s) })),
          ]}
        />
      </div>
      <div>
        <h3>Regret per seat</h3>
        <RoundsChart
          rows={regret}
          yLabel="Regret"
          currency={currency}
          changed={changed}
          notes={rounds}
          testId={`${testPrefix}-regret-chart`}
          dark={dark}
          slide={
            slideTitle === undefined
              ? undefined
              : {
                  title: `${slideTitle}: regret per seat`,
                  caption: `Money each rival left on the table per round, given what the others spent (${currency ?? "money"}); 0 means it played its best reply. ${MARKS_CAPTION}`,
                }
          }
          series={seats.map((s) => ({ key: `s${s}`, name: nameOf(s), colour: seriesColour(s) }))}
        />
        <DataTable
          caption="Regret by round: money left on the table given the others' spends"
          testId={`${testPrefix}-regret-table`}
          rows={regret}
          columns={[
            { key: "round", label: "Round" },
            ...seats.map((s) => ({ key: `s${s}`, label: nameOf(s), format: money })),
          ]}
        />
      </div>
      <RoundChanges changes={changes} testId={`${testPrefix}-changes`} />
    </div>
  );
}

/** What changed between played rounds (shocks), from what to what; nothing when nothing changed. */
export function RoundChanges({
  changes,
  testId,
}: {
  changes: ReturnType<typeof changesBetweenRounds>;
  testId: string;
}) {
  if (changes.length === 0) return null;
  return (
    <div data-testid={testId}>
      <h3>Changes between rounds</h3>
      <ul>
        {changes.map((c) => (
          <li key={c.round}>
            From round {c.round}: {c.lines.map(shockLineText).join("; ")}
          </li>
        ))}
      </ul>
    </div>
  );
}
