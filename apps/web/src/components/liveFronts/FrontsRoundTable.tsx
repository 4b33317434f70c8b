import type { RoleView, RoundResult } from "@contend/protocol";
import { formatMoney, formatPercent } from "../../lib/format";
import { total } from "../../lib/frontsLive";
import { Term } from "../Glossary";

/**
 * Everyone's numbers of one resolved round of a session with fronts (R48): money and share on
 * each front, then each seat's totals beside its best reply and the equilibrium.
 */
export function FrontsRoundTable({
  round,
  view,
  highlightSeat,
  testPrefix,
  compact,
}: {
  round: RoundResult;
  view: RoleView;
  highlightSeat?: number;
  testPrefix: string;
  /** a narrow card (the seat's page): no column of all rivals' money, no value won */
  compact?: boolean;
}) {
  const f = round.fronts;
  const fronts = view.fronts?.fronts;
  if (!f || !fronts) return null;
  const currency = view.scenario.currency ?? null;
  const money = (v: number | null | undefined) => formatMoney(v ?? NaN, currency);
  const seats = round.seatIndices;
  const name = (seat: number) => view.seats[seat]?.name ?? `Seat ${seat + 1}`;
  const mark = (seat: number) => (seat === highlightSeat ? "highlight" : undefined);
  return (
    <>
      <div className="table-wrap">
        <table className="fronts-table" data-testid={`${testPrefix}-per-front`}>
          <caption className="small muted" style={{ textAlign: "left" }}>
            Round {round.round} on each front: money spent, and the share won
          </caption>
          <thead>
            <tr>
              <th scope="col">Front</th>
              {seats.map((seat) => (
                <th scope="col" className={`num ${mark(seat) ?? ""}`} key={seat}>
                  {name(seat)}
                </th>
              ))}
              {compact ? null : (
                <th scope="col" className="num">
                  All rivals
                </th>
              )}
            </tr>
          </thead>
          <tbody>
            {fronts.map((front, k) => (
              <tr key={front.name}>
                <th scope="row">
                  {front.name}
                  <span className="small muted" style={{ display: "block", fontWeight: 400 }}>
                    prize {money(front.prize)}
                  </span>
                </th>
                {seats.map((seat) => (
                  <td className={`num ${mark(seat) ?? ""}`} key={seat}>
                    {money(f.spends[seat]?.[k])}
                    <span className="small muted" style={{ display: "block" }}>
                      won {formatPercent(f.shares[seat]?.[k] ?? NaN)}
                    </span>
                  </td>
                ))}
                {compact ? null : <td className="num">{money(f.frontTotals[k])}</td>}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <div className="table-wrap" style={{ marginTop: "0.75rem" }}>
        <table className="fronts-table" data-testid={`${testPrefix}-totals`}>
          <caption className="small muted" style={{ textAlign: "left" }}>
            Round {round.round} in total over the fronts
          </caption>
          <thead>
            <tr>
              <th scope="col">Rival</th>
              <th scope="col" className="num">
                Spent
              </th>
              {compact ? null : (
                <th scope="col" className="num">
                  Value won
                </th>
              )}
              <th scope="col" className="num">
                Payoff
              </th>
              <th scope="col" className="num">
                <Term id="best-reply">Best reply</Term> (spend)
              </th>
              <th scope="col" className="num">
                <Term id="regret">Would have added</Term>
              </th>
              <th scope="col" className="num">
                <Term id="equilibrium">Equilibrium</Term> spend
              </th>
            </tr>
          </thead>
          <tbody>
            {seats.map((seat) => (
              <tr key={seat} className={mark(seat)}>
                <th scope="row">
                  {name(seat)}
                  {round.defaulted[seat] ? <span className="small muted"> (no move)</span> : null}
                </th>
                <td className="num">{money(round.spends[seat])}</td>
                {compact ? null : <td className="num">{money(total(f.won[seat]))}</td>}
                <td className="num">{money(round.payoffs[seat])}</td>
                <td className="num">{money(total(f.bestSpends[seat]))}</td>
                <td className="num">{money(round.regrets[seat])}</td>
                <td className="num">
                  {f.equilibrium.spends ? money(total(f.equilibrium.spends[seat])) : "–"}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </>
  );
}
