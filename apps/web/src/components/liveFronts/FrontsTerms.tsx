import type { RoleView } from "@contend/protocol";
import { formatMoney, formatPlain } from "../../lib/format";
import { seatFrontsTerms } from "../../lib/frontsLive";
import { Kpi } from "../Kpi";

function formText(csf: { kind: string; decisiveness?: number; scale?: number }): string {
  if (csf.kind === "ratio") return `ratio, r = ${formatPlain(csf.decisiveness ?? 1)}`;
  if (csf.kind === "logit") return `logit, k = ${formatPlain(csf.scale ?? 1)}`;
  return "all-pay";
}

/** What this seat plays for on each front (prize, worth to it, cost, head start) and its budget. */
export function FrontsTerms({ view }: { view: RoleView }) {
  const seat = view.you!.seatIndex;
  const terms = seatFrontsTerms(view, seat)!;
  const currency = view.scenario.currency ?? null;
  const money = (v: number) => formatMoney(v, currency);
  const fronts = view.fronts!.fronts;
  return (
    <section className="card" aria-labelledby="seat-title">
      <h1 id="seat-title" style={{ marginBottom: 0 }}>
        {view.seats[seat]?.name ?? `Seat ${seat + 1}`}
      </h1>
      <p className="muted small" data-testid="seat-session-title">
        {view.title}
      </p>
      <div className="kpis">
        <Kpi label="Fronts">{fronts.length}</Kpi>
        <Kpi label="Prizes in total" testId="seat-prize">
          {money(view.scenario.prize)}
        </Kpi>
        <Kpi label="Your budget over all fronts" testId="seat-budget">
          {terms.budget === null ? "no cap" : money(terms.budget)}
        </Kpi>
      </div>
      <div className="table-wrap" style={{ marginTop: "0.5rem" }}>
        <table data-testid="seat-fronts-terms">
          <caption className="small muted" style={{ textAlign: "left" }}>
            Your terms on each front
          </caption>
          <thead>
            <tr>
              <th scope="col">Front</th>
              <th scope="col" className="num">
                Prize
              </th>
              <th scope="col" className="num">
                Worth to you
              </th>
              <th scope="col" className="num">
                Cost per unit of effort
              </th>
              <th scope="col" className="num">
                Head start
              </th>
              <th scope="col">Contest form</th>
            </tr>
          </thead>
          <tbody>
            {fronts.map((f, k) => (
              <tr key={f.name}>
                <th scope="row">{f.name}</th>
                <td className="num">{money(f.prize)}</td>
                <td className="num">{money(terms.value[k]!)}</td>
                <td className="num">{money(terms.cost[k]!)}</td>
                <td className="num">× {formatPlain(terms.weight[k]!)}</td>
                <td>{formText(f.csf)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <p className="small muted" style={{ marginBottom: 0 }}>
        Each front is its own contest; your payoff is the value you win on every front
        {terms.sunk
          ? ". Your budget is already committed, so money you leave unplaced is simply lost"
          : " minus the money you spend"}
        . A model to aid discussion, not advice; never share plans with real competitors.
      </p>
    </section>
  );
}
