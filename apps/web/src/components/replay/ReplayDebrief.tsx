"use client";

import { useMemo } from "react";
import type { RoleView, SessionExport } from "@contend/protocol";
import { summarizeSession } from "@contend/session";
import { formatMoney, formatPercent } from "../../lib/format";
import { DebriefCautions } from "../Cautions";
import { RoomHistory } from "../live/History";
import { FigureTable, numCol, textCol } from "../FigureTable";
import { ProvenanceNote } from "../ProvenanceNote";
import { AboutTheMaths } from "../AboutTheMaths";
import { Term } from "../Glossary";
import { PrivateReview } from "../live/PrivateReview";

/**
 * The printable debrief: the contest, rounds and seats (the seat figures are the session
 * summary's, `summarizeSession`, the same numbers GET /api/sessions/:id/summary answers), the
 * history charts and the cautions.
 */
export function ReplayDebrief({
  data,
  finalView,
  names,
  currency,
}: {
  data: SessionExport;
  finalView: RoleView | null;
  names: readonly string[];
  currency: string | null;
}) {
  const money = (v: number) => formatMoney(v, currency);
  const dash = (v: number | null) => (v === null ? "\u2013" : money(v));
  const seats = useMemo(
    () => (summarizeSession(data.events)?.seats ?? []).filter((s) => s.rounds > 0),
    [data.events],
  );
  return (
    <section className="card debrief" aria-labelledby="debrief-title">
      <h2 id="debrief-title">Debrief</h2>
      {finalView?.fronts && (
        <p data-testid="debrief-fronts">
          {finalView.scenario.rivals.length} rivals over {finalView.fronts.fronts.length} fronts (
          {finalView.fronts.fronts.map((f) => `${f.name} ${money(f.prize)}`).join(", ")}), one
          budget each, every front shared by winning chance. Figures below are totals over the
          fronts; each front&apos;s numbers are in the console&apos;s results and the JSON export.
        </p>
      )}
      {finalView && !finalView.fronts && (
        <p>
          Contest: {finalView.scenario.rivals.length} rivals, prize{" "}
          {money(finalView.scenario.prize)},{" "}
          {finalView.settings.outcome === "winner"
            ? "one winner drawn each round"
            : "prize shared by winning chance"}
          .
        </p>
      )}
      {finalView?.scenario.provenance && (
        <ProvenanceNote
          provenance={finalView.scenario.provenance}
          currency={currency}
          testId="debrief-provenance"
        />
      )}
      {data.rounds.length === 0 ? (
        <p className="muted">No round was revealed.</p>
      ) : (
        <>
          <FigureTable
            head={[
              textCol("Round"),
              numCol("Total spend"),
              numCol(<Term id="dissipation">Share of the prize spent</Term>, "Dissipation"),
              numCol(<Term id="equilibrium">At equilibrium</Term>, "At equilibrium"),
              numCol(<Term id="regret">Largest regret</Term>, "Largest regret"),
            ]}
            caption="Rounds: share of the prize spent, played and at equilibrium, and the largest regret"
            testId="debrief-rounds"
          >
            {data.rounds.map((r) => (
              <tr key={r.round}>
                <td>{r.round}</td>
                <td className="num">{money(r.spends.reduce((a, b) => a + b, 0))}</td>
                <td className="num">{formatPercent(r.dissipation)}</td>
                <td className="num">{formatPercent(r.equilibrium.dissipation)}</td>
                <td className="num">{money(r.nashGap)}</td>
              </tr>
            ))}
          </FigureTable>
          <FigureTable
            head={[
              textCol("Rival"),
              numCol("Rounds"),
              numCol("Mean spend"),
              numCol(
                <Term id="equilibrium">Mean equilibrium spend</Term>,
                "Mean equilibrium spend",
              ),
              numCol(<Term id="regret">Total regret</Term>, "Total regret"),
              numCol("Total payoff"),
            ]}
            caption="Seats: what each spent against equilibrium, and what it left on the table"
            testId="debrief-seats"
            wrapStyle={{ marginTop: "1rem" }}
          >
            {seats.map((s) => (
              <tr key={s.seat}>
                <td>{names[s.seat] ?? s.rival}</td>
                <td className="num">{s.rounds}</td>
                <td className="num">{dash(s.meanSpend)}</td>
                <td className="num">{dash(s.meanEquilibriumSpend)}</td>
                <td className="num">{money(s.totalRegret)}</td>
                <td className="num">{money(s.totalPayoff)}</td>
              </tr>
            ))}
          </FigureTable>
          <div style={{ marginTop: "1rem" }}>
            <RoomHistory
              rounds={data.rounds}
              names={names}
              currency={currency}
              testPrefix="replay-history"
              slideTitle={data.session.title}
            />
          </div>
        </>
      )}
      {finalView && <PrivateReview view={finalView} testId="debrief-private" />}
      <AboutTheMaths />
      <DebriefCautions />
    </section>
  );
}
