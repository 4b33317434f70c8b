"use client";

import { Bar, BarChart, CartesianGrid, ResponsiveContainer, XAxis, YAxis } from "recharts";
import type { RoleView, RoundResult } from "@contend/protocol";
import { spendPlacement } from "@contend/session";
import { formatMoney, formatPercent } from "../../lib/format";
import { SCREEN } from "../../lib/palette";
import { sealProgress, sessionSummary, standings } from "../../lib/roomState";

/** Open round (or lobby): one tile per rival saying whether it has sealed. */
export function SeatTiles({ view }: { view: RoleView }) {
  const open = view.status === "open";
  const playing = new Set(view.roundSeats ?? view.seats.map((s) => s.index));
  const { sealed, playing: count } = sealProgress(view);
  return (
    <section className="screen-panel" aria-labelledby="tiles-title">
      <h2 id="tiles-title" className="screen-panel-title">
        {open ? `Sealed: ${sealed} of ${count}` : "Rivals"}
      </h2>
      <ul className="screen-tiles" data-testid="screen-seats">
        {view.seats
          .filter((s) => s.active && playing.has(s.index))
          .map((s) => {
            const state = open
              ? s.sealed
                ? "sealed"
                : "thinking"
              : s.kind === "computer"
                ? "computer"
                : s.claimed
                  ? "ready"
                  : "empty";
            return (
              <li
                key={s.index}
                className={`screen-tile ${state}`}
                data-testid={`screen-seat-${s.index}`}
                data-sealed={s.sealed ? "yes" : "no"}
              >
                <span className="tile-name">{s.name}</span>
                <span className="tile-state">
                  {state === "sealed" ? (
                    <>
                      <TickIcon /> Sealed
                    </>
                  ) : state === "thinking" ? (
                    "Deciding…"
                  ) : state === "computer" ? (
                    "Computer player"
                  ) : state === "ready" ? (
                    "Joined"
                  ) : (
                    "Not joined yet"
                  )}
                </span>
              </li>
            );
          })}
      </ul>
    </section>
  );
}

function TickIcon() {
  return (
    <svg viewBox="0 0 16 16" width="0.9em" height="0.9em" aria-hidden="true" focusable="false">
      <path d="M2 8.5 6 12.5 14 3.5" fill="none" stroke="currentColor" strokeWidth="2.4" />
    </svg>
  );
}

/** A revealed round: what each rival spent against its equilibrium spend, as bars and figures. */
export function RevealPanel({ round, view }: { round: RoundResult; view: RoleView }) {
  const currency = view.scenario.currency ?? null;
  const money = (v: number | null) => (v === null ? "\u2013" : formatMoney(v, currency));
  const mixed = round.equilibrium.kind === "mixed";
  const rows = round.seatIndices.map((seat) => {
    return {
      below: mixed ? (spendPlacement(round, seat)?.probabilityLess ?? null) : null,
      seat,
      name: view.seats[seat]?.name ?? `Seat ${seat + 1}`,
      spent: round.spends[seat] ?? null,
      equilibrium: round.equilibriumSpends[seat] ?? null,
      share: round.shares[seat] ?? null,
      payoff: round.payoffs[seat] ?? null,
    };
  });
  const winner = round.winner === null ? null : (view.seats[round.winner]?.name ?? null);
  return (
    <section className="screen-panel reveal" aria-labelledby="reveal-title">
      <h2 id="reveal-title" className="screen-panel-title">
        Round {round.round}: spent against equilibrium
      </h2>
      <p className="screen-kpis">
        <span>
          Prize spent <b>{formatPercent(round.dissipation)}</b> (equilibrium{" "}
          {formatPercent(round.equilibrium.dissipation)})
        </span>
        {winner ? (
          <span>
            Winner drawn <b>{winner}</b>
          </span>
        ) : null}
      </p>
      <div
        className="screen-chart"
        role="img"
        aria-label={`Round ${round.round}: each rival's spend (solid bar) beside its equilibrium spend (light bar). ${rows
          .map((r) => `${r.name} ${money(r.spent)} against ${money(r.equilibrium)}`)
          .join("; ")}.`}
        data-testid="screen-reveal-chart"
      >
        <ResponsiveContainer width="100%" height="100%">
          <BarChart data={rows} margin={{ top: 4, right: 8, bottom: 0, left: 8 }} barGap={2}>
            <CartesianGrid stroke={SCREEN.grid} vertical={false} />
            <XAxis
              dataKey="name"
              stroke={SCREEN.axis}
              tick={{ fill: SCREEN.axis, fontSize: "2.2vh" }}
              interval={0}
              tickFormatter={(v: string) => (v.length > 14 ? `${v.slice(0, 13)}…` : v)}
            />
            <YAxis
              stroke={SCREEN.axis}
              tick={{ fill: SCREEN.axis, fontSize: "2vh" }}
              tickFormatter={(v: number) => formatMoney(v, currency)}
              width={90}
            />
            <Bar dataKey="spent" name="Spent" fill={SCREEN.series[0]} isAnimationActive={false} />
            <Bar
              dataKey="equilibrium"
              name={mixed ? "Expected equilibrium spend" : "Equilibrium spend"}
              fill={SCREEN.equilibrium}
              isAnimationActive={false}
            />
          </BarChart>
        </ResponsiveContainer>
      </div>
      <p className="screen-legend" aria-hidden="true">
        <span className="swatch" style={{ background: SCREEN.series[0] }} /> Spent
        <span className="swatch" style={{ background: SCREEN.equilibrium }} />{" "}
        {mixed ? "Expected equilibrium spend" : "Equilibrium spend"}
      </p>
      <table className="screen-table" data-testid="screen-round-table">
        <thead>
          <tr>
            <th scope="col">Rival</th>
            <th scope="col" className="num">
              Spent
            </th>
            <th scope="col" className="num">
              {mixed ? "Equilibrium (expected)" : "Equilibrium"}
            </th>
            {mixed ? (
              <th scope="col" className="num">
                Equilibrium spends less
              </th>
            ) : null}
            <th scope="col" className="num">
              Winning chance
            </th>
            <th scope="col" className="num">
              Payoff
            </th>
          </tr>
        </thead>
        <tbody>
          {rows.map((r) => (
            <tr key={r.seat}>
              <th scope="row">{r.name}</th>
              <td className="num">{money(r.spent)}</td>
              <td className="num">{money(r.equilibrium)}</td>
              {mixed ? (
                <td className="num" data-testid={`screen-below-${r.seat}`}>
                  {r.below === null ? "\u2013" : formatPercent(r.below)}
                </td>
              ) : null}
              <td className="num">{r.share === null ? "\u2013" : formatPercent(r.share)}</td>
              <td className="num">{money(r.payoff)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </section>
  );
}

/** Running totals (or, after the end, the final standings with ranks). */
export function StandingsPanel({ view, final }: { view: RoleView; final?: boolean }) {
  const currency = view.scenario.currency ?? null;
  const rows = standings(view);
  return (
    <section className={`screen-panel${final ? " final" : ""}`} aria-labelledby="standings-title">
      <h2 id="standings-title" className="screen-panel-title">
        {final ? "Ranked by total payoff" : "Running totals"}
      </h2>
      <table className="screen-table standings" data-testid="screen-totals">
        <thead>
          <tr>
            <th scope="col" className="num">
              Rank
            </th>
            <th scope="col">Rival</th>
            <th scope="col" className="num">
              Total payoff
            </th>
          </tr>
        </thead>
        <tbody>
          {rows.map((r) => (
            <tr key={r.seat} data-testid={`screen-standing-${r.seat}`}>
              <td className="num">{r.rank}</td>
              <th scope="row">
                {r.name}
                {r.retired ? " (retired)" : ""}
              </th>
              <td className="num">{formatMoney(r.total, currency)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </section>
  );
}

/** After the end: a few lines the room can talk about. */
export function FinalSummary({ view }: { view: RoleView }) {
  const currency = view.scenario.currency ?? null;
  const s = sessionSummary(view.rounds);
  const top = standings(view)[0];
  return (
    <section className="screen-panel" aria-labelledby="summary-title" data-testid="screen-summary">
      <h2 id="summary-title" className="screen-panel-title">
        The session in short
      </h2>
      <ul className="screen-summary">
        <li>
          {s.rounds} round{s.rounds === 1 ? "" : "s"} played
          {top ? (
            <>
              ; <b>{top.name}</b> finished first with {formatMoney(top.total, currency)}
            </>
          ) : null}
          .
        </li>
        {s.meanDissipation !== null && s.meanEquilibriumDissipation !== null ? (
          <li>
            On average the room spent <b>{formatPercent(s.meanDissipation)}</b> of the prize; at
            equilibrium it would have spent {formatPercent(s.meanEquilibriumDissipation)}.
          </li>
        ) : null}
        {s.widestGap ? (
          <li>
            Furthest from equilibrium in round {s.widestGap.round}: one rival could have gained{" "}
            <b>{formatMoney(s.widestGap.gap, currency)}</b> by choosing differently.
          </li>
        ) : null}
      </ul>
    </section>
  );
}
