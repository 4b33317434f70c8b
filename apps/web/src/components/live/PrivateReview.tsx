import type { RoleView } from "@contend/protocol";
import { formatMoney } from "../../lib/format";
import { seatNames } from "../../lib/live";
import { PRIVATE_FIELD_LABEL, rangeText, truthOf } from "../../lib/privateText";
import { PrivateDebrief } from "./PrivateDebrief";

/**
 * Private numbers as the facilitator (and, after the end, a replay) sees them
 * (docs/protocol.md R40-R44): each private number's public range beside its truth, how each seat
 * played the last round against its best reply under the truth and under its beliefs, and after
 * the end the debrief with the robust plans. Renders nothing for a view that withholds the truth.
 */
export function PrivateReview({ view, testId }: { view: RoleView; testId: string }) {
  const hidden = view.hidden;
  if (!hidden || hidden.withheld) return null;
  const currency = view.scenario.currency ?? null;
  const money = (v: number | null | undefined) => formatMoney(v ?? NaN, currency);
  const names = seatNames(view);
  const last = view.rounds.at(-1);
  const ended = view.status === "ended";
  return (
    <section
      className="card"
      style={{ marginTop: "1rem" }}
      aria-labelledby={`${testId}-title`}
      data-testid={testId}
    >
      <h2 id={`${testId}-title`}>Private numbers</h2>
      <p className="small muted">
        {ended
          ? "The session has ended: every seat now sees the true numbers."
          : "Only you see the true numbers. Each seat sees its own numbers and only these ranges for the others until the session ends."}{" "}
        The truth was{" "}
        {hidden.truth === "draw"
          ? "drawn from each range when the session started"
          : "set in the scenario"}
        .
      </p>
      <ul className="small" data-testid={`${testId}-truth`}>
        {hidden.entries.map((e) => (
          <li key={`${e.seatIndex}-${e.field}`}>
            {names[e.seatIndex]}: {PRIVATE_FIELD_LABEL[e.field]} {rangeText(e.range, money)};{" "}
            <strong>the truth: {money(truthOf(view, e.seatIndex, e.field))}</strong>
          </li>
        ))}
      </ul>
      {last && (
        <div className="table-wrap">
          <table className="small" data-testid={`${testId}-compare`}>
            <caption className="muted">
              Round {last.round}: each seat&apos;s spend against its best reply (money)
            </caption>
            <thead>
              <tr>
                <th scope="col">Rival</th>
                <th scope="col">Spent</th>
                <th scope="col">Best reply, true numbers</th>
                <th scope="col">Best reply, its beliefs</th>
              </tr>
            </thead>
            <tbody>
              {last.seatIndices.map((i) => (
                <tr key={i}>
                  <th scope="row">{names[i]}</th>
                  <td className="num">{money(last.spends[i])}</td>
                  <td className="num">{money(last.bestResponseSpends[i])}</td>
                  <td className="num">{money(last.beliefReplySpends?.[i] ?? null)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
      {last && (
        <p className="muted small">
          Best reply: the spend that would have earned most against what the others actually spent.
          Under a seat&apos;s beliefs, each number it does not know is spread over its range. A
          model, not advice; never share plans with real competitors.
        </p>
      )}
      <PrivateDebrief view={view} money={money} />
    </section>
  );
}
