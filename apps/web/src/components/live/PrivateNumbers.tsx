import type { RoleView } from "@contend/protocol";
import { formatMoney, formatPercent } from "../../lib/format";
import { seatNames } from "../../lib/live";
import { PRIVATE_FIELD_LABEL, rangeText, truthOf } from "../../lib/privateText";
import { PrivateDebrief } from "./PrivateDebrief";

/**
 * Sessions with private numbers (docs/protocol.md R40-R44): the ranges this seat plays
 * against, its rounds with both best replies, and after the end the robust plans beside play.
 */
export function PrivateNumbers({
  view,
  screen = false,
}: {
  view: RoleView;
  /** styled as a big-screen panel */
  screen?: boolean;
}) {
  const hidden = view.hidden;
  if (!hidden) return null;
  const seat = view.you?.seatIndex ?? null;
  const currency = view.scenario.currency ?? null;
  const money = (v: number | null | undefined) => formatMoney(v ?? NaN, currency);
  const names = seatNames(view);
  const others = hidden.entries.filter((e) => e.seatIndex !== seat);
  const mine = hidden.withheld
    ? hidden.rounds.filter((r) => r.you !== null).map((r) => ({ round: r.round, ...r.you! }))
    : seat === null
      ? []
      : view.rounds
          .filter((r) => r.seatIndices.includes(seat))
          .map((r) => ({
            round: r.round,
            spend: r.spends[seat]!,
            share: r.shares[seat]!,
            payoff: r.payoffs[seat]!,
            truthReplySpend: r.bestResponseSpends[seat]!,
            beliefReplySpend: r.beliefReplySpends?.[seat] ?? null,
          }));
  return (
    <section
      className={screen ? "screen-panel" : "card"}
      aria-labelledby="private-title"
      data-testid="private-numbers"
    >
      <h2 id="private-title" className={screen ? "screen-panel-title" : undefined}>
        {seat === null ? "Private numbers" : "What you do not know"}
      </h2>
      {others.length === 0 ? (
        <p className="muted small">Every rival&apos;s numbers are known to you.</p>
      ) : (
        <ul className={screen ? undefined : "small"} data-testid="private-ranges">
          {others.map((e) => (
            <li key={`${e.seatIndex}-${e.field}`}>
              {names[e.seatIndex]}: {PRIVATE_FIELD_LABEL[e.field]} {rangeText(e.range, money)}
              {hidden.withheld ? "" : `; the truth: ${money(truthOf(view, e.seatIndex, e.field))}`}
            </li>
          ))}
        </ul>
      )}
      <p className="muted small">
        {hidden.withheld
          ? "The true numbers are revealed when the session ends. Until then results show spends and shares only."
          : "The session has ended: every number is revealed."}{" "}
        A model, not advice; never share plans with real competitors.
      </p>
      {hidden.withheld && seat === null && (
        <PublicRound view={view} money={money} screen={screen} />
      )}
      {mine.length > 0 && (
        <div className="table-wrap">
          <table className="small" data-testid="private-rounds">
            <caption className="muted">Your rounds (money)</caption>
            <thead>
              <tr>
                <th scope="col">Round</th>
                <th scope="col">You spent</th>
                <th scope="col">Your share</th>
                <th scope="col">Your payoff</th>
                <th scope="col">Best reply, true numbers</th>
                <th scope="col">Best reply, your beliefs</th>
              </tr>
            </thead>
            <tbody>
              {mine.map((r) => (
                <tr key={r.round}>
                  <td>{r.round}</td>
                  <td className="num">{money(r.spend)}</td>
                  <td className="num">{formatPercent(r.share)}</td>
                  <td className="num">{money(r.payoff)}</td>
                  <td className="num">{money(r.truthReplySpend)}</td>
                  <td className="num">{money(r.beliefReplySpend)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
      {mine.length > 0 && (
        <p className="muted small">
          Best reply: the spend that would have earned most against what the others actually spent.
          Under your beliefs, each unknown number is spread over its range and the expected payoff
          is maximised.
        </p>
      )}
      {hidden.robustPlans.length > 0 && <PrivateDebrief view={view} money={money} />}
    </section>
  );
}

/** Withheld views without a seat: the last round's spends and shares, which are public. */
function PublicRound({
  view,
  money,
  screen,
}: {
  view: RoleView;
  money: (v: number | null) => string;
  screen: boolean;
}) {
  const last = view.hidden!.rounds.at(-1);
  if (!last) return null;
  const names = seatNames(view);
  return (
    <div className="table-wrap">
      <table className={screen ? "screen-table" : "small"} data-testid="private-public-round">
        <caption className="muted">Round {last.round}: spends and shares</caption>
        <thead>
          <tr>
            <th scope="col">Rival</th>
            <th scope="col">Spend</th>
            <th scope="col">Share</th>
          </tr>
        </thead>
        <tbody>
          {names.map((name, i) =>
            last.played[i] ? (
              <tr key={i}>
                <th scope="row">{name}</th>
                <td className="num">{money(last.spends[i] ?? null)}</td>
                <td className="num">{formatPercent(last.shares[i] ?? NaN)}</td>
              </tr>
            ) : null,
          )}
        </tbody>
      </table>
    </div>
  );
}
