import type { RoleView } from "@contend/protocol";
import { formatMoney, formatPercent } from "../../lib/format";
import { total } from "../../lib/frontsLive";
import { Kpi } from "../Kpi";
import { Term } from "../Glossary";
import { FrontsRoundTable } from "./FrontsRoundTable";

/**
 * The seat's own numbers for the last revealed round of a session with fronts, per front and
 * in total, with its best reply as a whole allocation and what it would have added; then
 * everyone's.
 */
export function FrontsSeatResult({ view }: { view: RoleView }) {
  const seat = view.you!.seatIndex;
  const currency = view.scenario.currency ?? null;
  const money = (v: number | null | undefined) => formatMoney(v ?? NaN, currency);
  const last = view.rounds.at(-1);
  const f = last?.fronts;
  const show = last !== undefined && f !== undefined && view.status !== "open";
  const fronts = view.fronts?.fronts ?? [];
  return (
    <section className="card" aria-labelledby="result-title" style={{ minHeight: "12rem" }}>
      <h2 id="result-title">{show ? `Round ${last.round} result` : "Results"}</h2>
      {show && f ? (
        <>
          <div className="kpis" data-testid="seat-result">
            <Kpi label="Your payoff" testId="seat-payoff">
              {money(last.payoffs[seat])}
            </Kpi>
            <Kpi label="You spent" testId="seat-spend">
              {money(last.spends[seat])}
            </Kpi>
            <Kpi label="Value won" testId="seat-won">
              {money(total(f.won[seat]))}
            </Kpi>
            <Kpi label={<Term id="regret">Best reply would have added</Term>} testId="seat-regret">
              {money(last.regrets[seat])}
            </Kpi>
            <Kpi label="Running total" testId="seat-total">
              {money(view.totals[seat])}
            </Kpi>
          </div>
          <div className="table-wrap" style={{ marginTop: "0.75rem" }}>
            <table data-testid="seat-fronts-result">
              <caption className="small muted" style={{ textAlign: "left" }}>
                Your split beside your best reply to what the others did, and the equilibrium
              </caption>
              <thead>
                <tr>
                  <th scope="col">Front</th>
                  <th scope="col" className="num">
                    You spent
                  </th>
                  <th scope="col" className="num">
                    Your share
                  </th>
                  <th scope="col" className="num">
                    Value won
                  </th>
                  <th scope="col" className="num">
                    <Term id="best-reply">Best reply</Term>
                  </th>
                  <th scope="col" className="num">
                    <Term id="equilibrium">Equilibrium</Term>
                  </th>
                </tr>
              </thead>
              <tbody>
                {fronts.map((front, k) => (
                  <tr key={front.name}>
                    <th scope="row">{front.name}</th>
                    <td className="num">{money(f.spends[seat]?.[k])}</td>
                    <td className="num">{formatPercent(f.shares[seat]?.[k] ?? NaN)}</td>
                    <td className="num">{money(f.won[seat]?.[k])}</td>
                    <td className="num">{money(f.bestSpends[seat]?.[k])}</td>
                    <td className="num">
                      {f.equilibrium.spends ? money(f.equilibrium.spends[seat]?.[k]) : "–"}
                    </td>
                  </tr>
                ))}
                <tr>
                  <th scope="row">All fronts</th>
                  <td className="num">{money(last.spends[seat])}</td>
                  <td className="num">{formatPercent(last.shares[seat] ?? NaN)} of prizes</td>
                  <td className="num">{money(total(f.won[seat]))}</td>
                  <td className="num" data-testid="seat-best-reply">
                    {money(total(f.bestSpends[seat]))}
                  </td>
                  <td className="num">
                    {f.equilibrium.spends ? money(total(f.equilibrium.spends[seat])) : "–"}
                  </td>
                </tr>
              </tbody>
            </table>
          </div>
          <p className="small muted" data-testid="seat-result-text">
            {last.defaulted[seat]
              ? "You did not seal in time; the missing-move rule applied. "
              : ""}
            Against what the others actually did, the best reply split would have paid{" "}
            {money(f.bestPayoffs[seat])}, {money(last.regrets[seat])} more than your{" "}
            {money(last.payoffs[seat])}.
            {f.equilibrium.payoffs
              ? ` At equilibrium your payoff would be ${money(f.equilibrium.payoffs[seat])}.`
              : " No equilibrium was found for comparison."}
          </p>
          <h3 style={{ marginTop: "1rem" }}>Everyone, round {last.round}</h3>
          <FrontsRoundTable
            round={last}
            view={view}
            highlightSeat={seat}
            testPrefix="seat-round"
            compact
          />
        </>
      ) : (
        <p className="muted">
          Results appear here when the round is revealed. Others&apos; splits stay hidden until
          then.
        </p>
      )}
    </section>
  );
}
