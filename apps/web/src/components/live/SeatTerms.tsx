import type { RoleView } from "@contend/protocol";
import { formatMoney, formatPlain } from "../../lib/format";
import { Kpi } from "../Kpi";

function csfText(view: RoleView): string {
  const c = view.scenario.csf;
  if (c.kind === "ratio") return `ratio form, decisiveness r = ${formatPlain(c.decisiveness)}`;
  if (c.kind === "logit") return `logit form, scale k = ${formatPlain(c.scale)}`;
  return "all-pay: the highest spender in effort terms wins";
}

/** What this seat plays for: prize, its value, its cost, head start and budget, and the rule. */
export function SeatTerms({ view }: { view: RoleView }) {
  const seat = view.you!.seatIndex;
  const rival = view.scenario.rivals[seat];
  const currency = view.scenario.currency ?? null;
  const money = (v: number) => formatMoney(v, currency);
  return (
    <section className="card" aria-labelledby="seat-title">
      <h1 id="seat-title" style={{ marginBottom: 0 }}>
        {rival?.name ?? `Seat ${seat + 1}`}
      </h1>
      <p className="muted small" data-testid="seat-session-title">
        {view.title}
      </p>
      <div className="kpis">
        <Kpi label="Prize" testId="seat-prize">
          {money(view.scenario.prize)}
        </Kpi>
        <Kpi label="Worth to you" testId="seat-value">
          {money(rival?.value ?? view.scenario.prize)}
        </Kpi>
        <Kpi label="Your cost per unit of effort" testId="seat-cost">
          {money(rival?.cost ?? NaN)}
        </Kpi>
        <Kpi label="Head start (weight)">{`× ${formatPlain(rival?.weight ?? 1)}`}</Kpi>
        <Kpi label="Budget (spend cap)" testId="seat-budget">
          {rival?.budget === null || rival?.budget === undefined ? "no cap" : money(rival.budget)}
        </Kpi>
      </div>
      <p className="small muted" style={{ marginTop: "0.5rem" }} data-testid="seat-rules">
        Contest: {csfText(view)}.{" "}
        {view.settings.outcome === "winner"
          ? "One winner is drawn by winning chance."
          : "The prize is shared by winning chance."}{" "}
        You decide how much money to spend. Your effort is that spend divided by your cost per unit
        of effort: a higher cost buys less effort for the same money. Your payoff each round: worth
        × share − spend.
      </p>
    </section>
  );
}
