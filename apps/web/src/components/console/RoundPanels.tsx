"use client";

import { useMemo, useState } from "react";
import type { ReactNode } from "react";
import type { RoleView, RoundResult } from "@contend/protocol";
import { activeContest } from "@contend/session";
import { formatMoney, formatPercent } from "../../lib/format";
import { seatNames } from "../../lib/live";
import { solveForView } from "../../lib/solveView";
import { SolvedEquilibrium } from "../EquilibriumTable";
import { Kpi } from "../Kpi";
import { Term } from "../Glossary";
import { RoomHistory } from "../live/History";
import { RoundResults } from "../live/RoundResults";
import type { useSession } from "../../hooks/useSession";
import { RoundNoteForm } from "./RoundNoteForm";
import { SelectField } from "../Field";

/** Beside the next step: the latest revealed round in a few figures. */
export function LatestResult({ view }: { view: RoleView }) {
  const last = view.rounds[view.rounds.length - 1];
  const currency = view.scenario.currency ?? null;
  return (
    <section className="card" aria-labelledby="latest-title" data-testid="latest-result">
      <h2 id="latest-title">{last ? `Latest result: round ${last.round}` : "Latest result"}</h2>
      {last ? (
        <>
          <div className="kpis">
            <Kpi label="Share of the prize spent">{formatPercent(last.dissipation)}</Kpi>
            <Kpi label="At equilibrium">{formatPercent(last.equilibrium.dissipation)}</Kpi>
            <Kpi label="Largest regret">{formatMoney(last.nashGap, currency)}</Kpi>
            {last.winner !== null && (
              <Kpi label="Winner drawn">{view.seats[last.winner]?.name ?? "–"}</Kpi>
            )}
          </div>
          <p className="small muted" style={{ marginTop: "0.5rem" }}>
            <Term id="dissipation">Share of the prize spent</Term> is what all rivals spent together
            as a share of the prize; the <Term id="regret">largest regret</Term> is the most any one
            rival could have gained by choosing differently. Every seat&apos;s figures are under{" "}
            <a href="#results-title">Results</a>.
          </p>
        </>
      ) : (
        <p className="muted">No round revealed yet. Results appear here after each reveal.</p>
      )}
    </section>
  );
}

/** What the solver predicts for the round about to open (or the open one): the same contest the engine will resolve. */
export function ComingRound({ view }: { view: RoleView }) {
  const { scenario, seatIndices } = useMemo(() => activeContest(view), [view]);
  const solved = useMemo(() => solveForView(scenario), [scenario]);
  const currency = view.scenario.currency ?? null;
  const which =
    view.status === "open"
      ? `round ${view.round}`
      : view.round < view.roundsTotal
        ? `round ${view.round + 1}`
        : "this contest";
  return (
    <section className="card" aria-labelledby="coming-title" data-testid="coming-round">
      <h2 id="coming-title">
        <Term id="equilibrium">Equilibrium</Term> for {which}
      </h2>
      <p className="small muted">
        What rivals who all reason perfectly would spend, for the {seatIndices.length} active rivals
        with today&apos;s costs and prize (after any shock). Keep it to yourself until the reveal if
        you do not want to steer the room.
      </p>
      <SolvedEquilibrium solved={solved} currency={currency} testPrefix="console-eq" />
    </section>
  );
}

/** Every revealed round, one at a time, and the whole session's history. */
export function ResultsPanel({
  view,
  send,
  renderRound,
}: {
  view: RoleView;
  send?: ReturnType<typeof useSession>["send"];
  /** the shown round's results (default: RoundResults; a fronts session shows each front) */
  renderRound?: (round: RoundResult) => ReactNode;
}) {
  const [shownRound, setShownRound] = useState<number | null>(null);
  const names = seatNames(view);
  const currency = view.scenario.currency ?? null;
  const roundToShow =
    shownRound === null
      ? view.rounds[view.rounds.length - 1]
      : view.rounds.find((r) => r.round === shownRound);
  return (
    <section className="card" aria-labelledby="results-title" style={{ minHeight: "14rem" }}>
      <div className="row" style={{ justifyContent: "space-between" }}>
        <h2 id="results-title">Results</h2>
        {view.rounds.length > 1 && (
          <SelectField
            label="Show round"
            value={String(roundToShow?.round ?? "")}
            options={view.rounds.map((r) => ({
              value: String(r.round),
              label: `Round ${r.round}`,
            }))}
            onChange={(v) => setShownRound(Number(v))}
            testId="results-round"
          />
        )}
      </div>
      {roundToShow && renderRound ? (
        renderRound(roundToShow)
      ) : roundToShow ? (
        <RoundResults
          round={roundToShow}
          names={names}
          currency={currency}
          testPrefix="console-round"
        />
      ) : (
        <p className="muted">No round revealed yet.</p>
      )}
      {roundToShow && send ? (
        <RoundNoteForm round={roundToShow.round} note={roundToShow.note} send={send} />
      ) : null}
      {view.rounds.length > 0 && (
        <div style={{ marginTop: "1rem" }}>
          <RoomHistory
            rounds={view.rounds}
            names={names}
            currency={currency}
            testPrefix="console-history"
          />
        </div>
      )}
    </section>
  );
}
