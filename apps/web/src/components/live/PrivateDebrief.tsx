import type { RoleView } from "@contend/protocol";
import { seatNames } from "../../lib/live";

/**
 * After the end of a session with private numbers (docs/protocol.md R44): each seat's play beside
 * the equilibrium under the true numbers and its robust plan (the spend that does best on
 * average over what the seat did not know).
 */
export function PrivateDebrief({
  view,
  money,
}: {
  view: RoleView;
  money: (v: number | null) => string;
}) {
  const names = seatNames(view);
  const plans = view.hidden?.robustPlans ?? [];
  if (plans.length === 0) return null;
  const last = view.rounds.at(-1);
  const mean = (i: number, pick: (r: RoleView["rounds"][number]) => number | undefined) => {
    const rs = view.rounds.filter((r) => r.seatIndices.includes(i));
    return rs.length ? rs.reduce((s, r) => s + (pick(r) ?? 0), 0) / rs.length : null;
  };
  return (
    <div className="table-wrap">
      <table className="small" data-testid="private-debrief">
        <caption className="muted">Debrief: play, equilibrium under the truth, robust plan</caption>
        <thead>
          <tr>
            <th scope="col">Rival</th>
            <th scope="col">Average spend</th>
            <th scope="col">Average payoff</th>
            <th scope="col">Equilibrium spend (truth, last round)</th>
            <th scope="col">Robust plan spend</th>
            <th scope="col">Plan&apos;s expected payoff</th>
            <th scope="col">Plan&apos;s P10 payoff</th>
          </tr>
        </thead>
        <tbody>
          {plans.map((p) => (
            <tr key={p.seatIndex}>
              <th scope="row">{names[p.seatIndex]}</th>
              <td className="num">{money(mean(p.seatIndex, (r) => r.spends[p.seatIndex]))}</td>
              <td className="num">{money(mean(p.seatIndex, (r) => r.payoffs[p.seatIndex]))}</td>
              <td className="num">{money(last?.equilibriumSpends[p.seatIndex] ?? null)}</td>
              <td className="num">{money(p.spend)}</td>
              <td className="num">{money(p.expectedPayoff)}</td>
              <td className="num">{money(p.p10Payoff)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
