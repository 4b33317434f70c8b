"use client";

import { downloadFileName } from "@contend/protocol";
import {
  changedRounds,
  cohortCsv,
  compareEvents,
  compareMarks,
  roundRows,
  sessionKey,
  sessionLabels,
} from "../../lib/compare";
import type { Compared } from "../../lib/compare";
import { formatDateTime, formatPercent, formatPlain } from "../../lib/format";
import { EQUILIBRIUM_COLOUR, seriesColour } from "../../lib/palette";
import { saveBlob } from "../../lib/saveFile";
import { DebriefCautions } from "../Cautions";
import { FigureTable, numCol, textCol } from "../FigureTable";
import { Term } from "../Glossary";
import { DataTable } from "../DataTable";
import { LineSeriesChart } from "../LineSeriesChart";
import { CompareSeats } from "./CompareSeats";
import { SessionNumber } from "./SessionNumber";

/** What the marks on the round axis mean (the number before each label names the session). */
const MARKS_CAPTION =
  "Dashed vertical lines mark shocks (changed, \u26a1) and facilitator's notes, each led by its session's number.";

const times = (v: number) => `${formatPlain(v, 2)}\u00d7`;

/** Two or more sessions side by side: by-round charts, seats, shocks and notes, the cohort file. */
export function CompareView({ sessions }: { sessions: readonly Compared[] }) {
  const labels = sessionLabels(sessions);
  // On screen a line is named by its session's number (the table above gives the title); a
  // slide stands alone, so its legend carries the full names.
  const series = sessions.map((_, k) => ({
    key: sessionKey(k),
    name: `Session ${k + 1}`,
    colour: seriesColour(k),
  }));
  const slideLegend = series.map((s, k) => ({ ...s, name: labels[k]! }));
  const eqLine = { key: "eq", name: "Equilibrium (1×)", colour: EQUILIBRIUM_COLOUR, dashed: true };
  const overspend = roundRows(sessions, (r) => r.overspend).map((row) => ({ ...row, eq: 1 }));
  const gap = roundRows(sessions, (r) => r.nashGapShare);
  const marks = compareMarks(sessions);
  const columns = (format: (v: number) => string) => [
    { key: "round", label: "Round" },
    ...series.map((s) => ({ key: s.key, label: s.name, format })),
  ];
  const changed = changedRounds(sessions);
  const roundTick = (v: number) => `${formatPlain(v, 0)}${changed.has(v) ? " \u26a1" : ""}`;
  const events = compareEvents(sessions);
  const currencies = new Set(sessions.map((s) => s.summary.session.currency ?? ""));

  function downloadCohort() {
    const blob = new Blob([cohortCsv(sessions)], { type: "text/csv;charset=utf-8" });
    saveBlob(blob, downloadFileName(`cohort of ${sessions.length} sessions`, "csv", new Date()));
  }

  return (
    <section className="card debrief" aria-labelledby="compare-title" data-testid="compare-view">
      <div className="row" style={{ justifyContent: "space-between" }}>
        <h2 id="compare-title">Side by side</h2>
        <div className="row no-print">
          <button type="button" onClick={downloadCohort} data-testid="compare-csv">
            Download cohort CSV
          </button>
          <button type="button" onClick={() => window.print()} data-testid="compare-print">
            Print
          </button>
        </div>
      </div>
      <div className="caution" data-testid="compare-caution">
        <strong>Read with care.</strong> A model, not advice: equilibrium is the benchmark of rivals
        who all reason perfectly, not a target. Sessions of different scenarios differ in prize,
        rivals and rules, so compare the shape of play (ratios and shares), not the amounts.
        {currencies.size > 1 &&
          " These sessions use different currencies: money is not comparable across them."}
      </div>
      <FigureTable
        head={[textCol("No."), textCol("Session"), numCol("Rounds"), textCol("Created")]}
        caption="Sessions compared (the number names each line in the charts)"
        testId="compare-sessions"
        wrapStyle={{ marginTop: "1rem" }}
      >
        {sessions.map((s, k) => (
          <tr key={s.id}>
            <td>
              <SessionNumber index={k} />
            </td>
            <td>{s.summary.session.title}</td>
            <td className="num">{s.summary.rounds.length}</td>
            <td>{formatDateTime(s.summary.session.createdAt)}</td>
          </tr>
        ))}
      </FigureTable>
      <div className="grid-2" style={{ marginTop: "1rem" }}>
        <div>
          <h3>Overspend index by round</h3>
          <p className="small muted">
            Money all rivals spent divided by the money they would spend at{" "}
            <Term id="equilibrium">equilibrium</Term>. Above 1: the room overspent.
          </p>
          <LineSeriesChart
            rows={overspend}
            xKey="round"
            xLabel="Round"
            yLabel="Spend ÷ equilibrium spend (×)"
            formatY={times}
            formatX={roundTick}
            marks={marks}
            testId="compare-overspend-chart"
            slide={{
              title: "Overspend index by round",
              legend: [...slideLegend, eqLine],
              caption: `Money all rivals spent divided by the money they would spend at equilibrium; above 1\u00d7 the room overspent. ${MARKS_CAPTION}`,
            }}
            height={340}
            series={[...series, eqLine]}
          />
          <DataTable
            rows={overspend}
            columns={columns(times)}
            caption="Overspend index by round (spend ÷ equilibrium spend)"
            testId="compare-overspend-table"
          />
        </div>
        <div>
          <h3>Distance from equilibrium by round</h3>
          <p className="small muted">
            The round&apos;s largest <Term id="regret">regret</Term> as a share of its prize (the
            Nash gap). A line falling towards 0 means play converged on equilibrium.
          </p>
          <LineSeriesChart
            rows={gap}
            xKey="round"
            xLabel="Round"
            yLabel="Largest regret (% of the prize)"
            formatY={formatPercent}
            formatX={roundTick}
            marks={marks}
            testId="compare-gap-chart"
            height={340}
            slide={{
              title: "Distance from equilibrium by round",
              legend: slideLegend,
              caption: `The round's largest regret as a share of its prize (the Nash gap); a line falling towards 0 means play converged. ${MARKS_CAPTION}`,
            }}
            series={series}
          />
          <DataTable
            rows={gap}
            columns={columns(formatPercent)}
            caption="Largest regret by round, as a share of the prize"
            testId="compare-gap-table"
          />
        </div>
      </div>
      {events.length > 0 && (
        <div data-testid="compare-marks" style={{ marginTop: "1rem" }}>
          <h3>Shocks and notes (marked on the round axis)</h3>
          <ul>
            {events.map((e) => (
              <li key={`${e.session}-${e.round}-${e.kind}`}>
                Session {e.session + 1}, round {e.round}:{" "}
                {e.kind === "changed" ? `contest changed (${e.text})` : `note: ${e.text}`}
              </li>
            ))}
          </ul>
        </div>
      )}
      <CompareSeats sessions={sessions} />
      <DebriefCautions />
    </section>
  );
}
