"use client";

import { useMemo } from "react";
import type { RoleView } from "@contend/protocol";
import { normalizeFronts, solveFronts } from "@contend/solver";
import type { useSession } from "../../hooks/useSession";
import { formatMoney, formatPercent } from "../../lib/format";
import { total } from "../../lib/frontsLive";
import { Kpi } from "../Kpi";
import { Term } from "../Glossary";
import { FrontsRoundTable } from "./FrontsRoundTable";
import { ResultsPanel } from "../console/RoundPanels";

/** Beside the next step: the latest revealed round of a fronts session in a few figures. */
export function FrontsLatest({ view }: { view: RoleView }) {
  const last = view.rounds.at(-1);
  const currency = view.scenario.currency ?? null;
  return (
    <section className="card" aria-labelledby="latest-title" data-testid="latest-result">
      <h2 id="latest-title">{last ? `Latest result: round ${last.round}` : "Latest result"}</h2>
      {last ? (
        <>
          <div className="kpis">
            <Kpi label="Prizes spent">{formatPercent(last.dissipation)}</Kpi>
            <Kpi label="At equilibrium">{formatPercent(last.equilibrium.dissipation)}</Kpi>
            <Kpi label="Largest regret">{formatMoney(last.nashGap, currency)}</Kpi>
          </div>
          <p className="small muted" style={{ marginTop: "0.5rem" }}>
            <Term id="dissipation">Prizes spent</Term> is what all rivals spent on every front
            together as a share of all the prizes; the <Term id="regret">largest regret</Term> is
            the most any one rival could have gained with a different split of its budget. Every
            front is under <a href="#results-title">Results</a>.
          </p>
        </>
      ) : (
        <p className="muted">No round revealed yet. Results appear here after each reveal.</p>
      )}
    </section>
  );
}

/** The fronts equilibrium every round is compared with (the fronts do not change: R50). */
export function FrontsComingRound({ view }: { view: RoleView }) {
  const fronts = view.fronts!;
  const eq = useMemo(() => solveFronts(normalizeFronts(fronts)).equilibrium, [fronts]);
  const currency = view.scenario.currency ?? null;
  const money = (v: number | undefined) => formatMoney(v ?? NaN, currency);
  return (
    <section className="card" aria-labelledby="coming-title" data-testid="coming-round">
      <h2 id="coming-title">
        <Term id="equilibrium">Equilibrium</Term> split
      </h2>
      <p className="small muted">
        How rivals who all reason perfectly would split their budgets over the fronts. Keep it to
        yourself until the reveal if you do not want to steer the room.
      </p>
      {eq.spends ? (
        <div className="table-wrap">
          <table className="fronts-table" data-testid="console-eq-fronts">
            <thead>
              <tr>
                <th scope="col">Front</th>
                {fronts.rivals.map((r) => (
                  <th scope="col" className="num" key={r.name}>
                    {r.name}
                  </th>
                ))}
              </tr>
            </thead>
            <tbody>
              {fronts.fronts.map((f, k) => (
                <tr key={f.name}>
                  <th scope="row">{f.name}</th>
                  {fronts.rivals.map((r, i) => (
                    <td className="num" key={r.name}>
                      {money(eq.spends![i]![k])}
                    </td>
                  ))}
                </tr>
              ))}
              <tr>
                <th scope="row">All fronts</th>
                {fronts.rivals.map((r, i) => (
                  <td className="num" key={r.name}>
                    <strong>{money(total(eq.spends![i]))}</strong>
                  </td>
                ))}
              </tr>
              <tr>
                <th scope="row">Payoff</th>
                {fronts.rivals.map((r, i) => (
                  <td className="num" key={r.name}>
                    {money(eq.payoffs![i])}
                  </td>
                ))}
              </tr>
            </tbody>
          </table>
        </div>
      ) : (
        <p className="notice">No equilibrium found: {eq.note ?? "the search did not settle"}.</p>
      )}
    </section>
  );
}

/** Every revealed round of a fronts session, per front, and the totals over the rounds. */
export function FrontsResultsPanel({
  view,
  send,
}: {
  view: RoleView;
  send?: ReturnType<typeof useSession>["send"];
}) {
  return (
    <ResultsPanel
      view={view}
      send={send}
      renderRound={(round) => (
        <FrontsRoundTable round={round} view={view} testPrefix="console-round" />
      )}
    />
  );
}
