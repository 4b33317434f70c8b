import type { RoleView, RoundResult } from "@contend/protocol";
import { formatMoney, formatPercent } from "../../lib/format";
import { screenSeriesColour } from "../../lib/palette";

/**
 * The big screen's reveal of a fronts round (R48): one small chart per front, each rival's
 * money there as a bar (its share won beside it) with a thin mark at its equilibrium spend.
 * Bars are scaled to the largest amount on any front, so fronts compare at a glance.
 */
export function FrontsReveal({ round, view }: { round: RoundResult; view: RoleView }) {
  const f = round.fronts;
  const fronts = view.fronts?.fronts;
  if (!f || !fronts) return null;
  const currency = view.scenario.currency ?? null;
  const money = (v: number | undefined) => formatMoney(v ?? NaN, currency);
  const seats = round.seatIndices;
  const eq = f.equilibrium.spends;
  const top = Math.max(1, ...seats.flatMap((s) => [...(f.spends[s] ?? []), ...(eq?.[s] ?? [])]));
  const pct = (x: number | undefined) => `${Math.max(0, Math.min(100, ((x ?? 0) / top) * 100))}%`;
  return (
    <section className="screen-panel reveal" aria-labelledby="reveal-title">
      <h2 id="reveal-title" className="screen-panel-title">
        Round {round.round}: each front, spent against equilibrium
      </h2>
      <p className="screen-kpis">
        <span>
          Prizes spent <b>{formatPercent(round.dissipation)}</b> (equilibrium{" "}
          {formatPercent(round.equilibrium.dissipation)})
        </span>
      </p>
      <div className="fronts-screen-grid" data-testid="screen-fronts">
        {fronts.map((front, k) => (
          <figure
            className="fronts-screen-front"
            key={front.name}
            data-testid={`screen-front-${k}`}
          >
            <figcaption>
              <b>{front.name}</b> <span>prize {money(front.prize)}</span>
            </figcaption>
            <ul
              aria-label={`${front.name}: ${seats
                .map(
                  (s) =>
                    `${view.seats[s]?.name ?? s} spent ${money(f.spends[s]?.[k])}, won ${formatPercent(f.shares[s]?.[k] ?? NaN)}${eq ? `, equilibrium ${money(eq[s]?.[k])}` : ""}`,
                )
                .join("; ")}`}
            >
              {seats.map((s, i) => (
                <li key={s}>
                  <span className="fronts-bar-name">{view.seats[s]?.name ?? `Seat ${s + 1}`}</span>
                  <span className="fronts-bar-track" aria-hidden="true">
                    <span
                      className="fronts-bar"
                      style={{ width: pct(f.spends[s]?.[k]), background: screenSeriesColour(i) }}
                    />
                    {eq ? (
                      <span className="fronts-eq-mark" style={{ left: pct(eq[s]?.[k]) }} />
                    ) : null}
                  </span>
                  <span className="fronts-bar-value">
                    {money(f.spends[s]?.[k])} · {formatPercent(f.shares[s]?.[k] ?? NaN)}
                  </span>
                </li>
              ))}
            </ul>
          </figure>
        ))}
      </div>
      <p className="screen-legend" aria-hidden="true">
        Bar: money spent on the front · percentage: share of the front won ·{" "}
        <span className="fronts-eq-key" /> equilibrium spend
      </p>
    </section>
  );
}
