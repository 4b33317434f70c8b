import type { RoleView } from "@contend/protocol";
import { placementText, spendPlacement } from "@contend/session";
import { equilibriumPayoffOf } from "../../lib/chartData";
import { formatMoney, formatPercent } from "../../lib/format";
import { seatNames } from "../../lib/live";
import { Kpi } from "../Kpi";
import { RoundResults } from "./RoundResults";
import { Term } from "../Glossary";

/** The seat's own numbers for the last revealed round, in money, then everyone's. */
export function SeatRoundResult({ view }: { view: RoleView }) {
  const seat = view.you!.seatIndex;
  const currency = view.scenario.currency ?? null;
  const money = (v: number | null | undefined) => formatMoney(v ?? NaN, currency);
  const names = seatNames(view);
  const last = view.rounds.length > 0 ? view.rounds[view.rounds.length - 1] : undefined;
  const show = last !== undefined && view.status !== "open";
  const eqPay = last ? equilibriumPayoffOf(last, seat) : null;
  const placed = last ? spendPlacement(last, seat) : null;
  return (
    <section className="card" aria-labelledby="result-title" style={{ minHeight: "12rem" }}>
      <h2 id="result-title">{show ? `Round ${last.round} result` : "Results"}</h2>
      {show && last ? (
        <>
          <div className="kpis" data-testid="seat-result">
            <Kpi label="Your payoff" testId="seat-payoff">
              {money(last.payoffs[seat])}
            </Kpi>
            <Kpi label="Your share" testId="seat-share">
              {formatPercent(last.shares[seat] ?? NaN)}
            </Kpi>
            <Kpi label="You spent" testId="seat-spend">
              {money(last.spends[seat])}
            </Kpi>
            <Kpi
              label={
                placed ? (
                  <Term id="mixed-equilibrium">Equilibrium spend (expected)</Term>
                ) : (
                  <Term id="equilibrium">Equilibrium spend</Term>
                )
              }
              testId="seat-eq-spend"
            >
              {money(last.equilibriumSpends[seat])}
            </Kpi>
            {placed ? (
              <Kpi label="Chance equilibrium spends less" testId="seat-eq-below">
                {formatPercent(placed.probabilityLess)}
              </Kpi>
            ) : null}
            <Kpi
              label={<Term id="best-reply">Best reply to the others (spend)</Term>}
              testId="seat-best-reply"
            >
              {money(last.bestResponseSpends[seat])}
            </Kpi>
            <Kpi label={<Term id="regret">It would have added (regret)</Term>} testId="seat-regret">
              {money(last.regrets[seat])}
            </Kpi>
            <Kpi label="Running total" testId="seat-total">
              {money(view.totals[seat])}
            </Kpi>
          </div>
          <p className="small muted" style={{ marginTop: "0.5rem" }} data-testid="seat-result-text">
            You spent {money(last.spends[seat])}.{" "}
            {last.defaulted[seat]
              ? "You did not seal in time; the missing-move rule applied. "
              : ""}
            {last.winner !== null ? `Winner drawn: ${names[last.winner] ?? "?"}. ` : ""}
            {eqPay !== null ? `At equilibrium your expected payoff would be ${money(eqPay)}.` : ""}
          </p>
          {placed ? (
            <p className="small" data-testid="seat-placement" style={{ marginTop: "0.25rem" }}>
              {placementText(placed, (v) => money(v), formatPercent, "your strategy")}
            </p>
          ) : null}
          <h3 style={{ marginTop: "1rem" }}>Everyone, round {last.round}</h3>
          <RoundResults
            round={last}
            names={names}
            currency={currency}
            highlightSeat={seat}
            testPrefix="seat-round"
          />
        </>
      ) : (
        <p className="muted">
          Results appear here when the round is revealed. Others&apos; spends stay hidden until
          then.
        </p>
      )}
    </section>
  );
}
