"use client";

import { useMemo } from "react";
import type { Credentials, RoleView } from "@contend/protocol";
import { useSession } from "../../hooks/useSession";
import { formatMoney, formatPercent } from "../../lib/format";
import { seatNames, STATUS_TEXT } from "../../lib/live";
import { ConnectionBanner } from "./ConnectionBanner";
import { ShockBanner } from "./ShockBanner";
import { RoomHistory } from "./History";
import { RoundClock } from "./RoundClock";
import { RoundResults } from "./RoundResults";
import { FigureTable, numCol, textCol } from "../FigureTable";

export function BigScreen({
  sessionId,
  spectatorKey,
}: {
  sessionId: string;
  spectatorKey: string;
}) {
  const credentials = useMemo<Credentials | null>(
    () => (spectatorKey ? { role: "spectator", sessionId, key: spectatorKey } : null),
    [sessionId, spectatorKey],
  );
  const { connection, view, clockOffsetMs } = useSession(credentials);
  return (
    <div className="big-screen" data-testid="big-screen">
      {spectatorKey ? (
        <ConnectionBanner connection={connection} dark />
      ) : (
        <p className="notice error">This big-screen link has no key.</p>
      )}
      {view ? (
        <ScreenBody view={view} clockOffsetMs={clockOffsetMs} />
      ) : (
        <p className="muted" style={{ minHeight: "60vh" }}>
          {connection.status === "failed" ? "This link does not open the session." : "Loading…"}
        </p>
      )}
    </div>
  );
}

function ScreenBody({ view, clockOffsetMs }: { view: RoleView; clockOffsetMs: number }) {
  const names = seatNames(view);
  const currency = view.scenario.currency ?? null;
  const last = view.rounds[view.rounds.length - 1];
  const standings = view.seats
    .map((s) => ({
      index: s.index,
      name: s.name,
      total: view.totals[s.index] ?? 0,
      active: s.active,
    }))
    .sort((a, b) => b.total - a.total);
  return (
    <>
      <div className="panel">
        <div className="row" style={{ justifyContent: "space-between", alignItems: "flex-end" }}>
          <div>
            <h1 style={{ marginBottom: "0.2rem" }}>{view.title}</h1>
            <p className="muted" style={{ margin: 0 }} data-testid="screen-status">
              {STATUS_TEXT[view.status]}
              {view.paused ? " · paused" : ""} · prize {formatMoney(view.scenario.prize, currency)}
            </p>
          </div>
          <RoundClock view={view} clockOffsetMs={clockOffsetMs} big />
        </div>
      </div>
      <ShockBanner view={view} large />
      <div className="panel" style={{ minHeight: "8rem" }}>
        <h2>{view.status === "open" ? `Round ${view.round}: who has sealed` : "Seats"}</h2>
        <div className="row" data-testid="screen-seats">
          {view.seats
            .filter((s) => s.active)
            .map((s) => (
              <span
                key={s.index}
                className={view.status === "open" && s.sealed ? "badge accent" : "badge"}
                data-testid={`screen-seat-${s.index}`}
                data-sealed={s.sealed ? "yes" : "no"}
                style={{ fontSize: "1.2rem", padding: "0.3rem 0.9rem" }}
              >
                {s.name}
                {view.status === "open" ? (s.sealed ? " · sealed" : " · thinking") : ""}
              </span>
            ))}
        </div>
      </div>
      {last && view.status !== "open" ? (
        <div className="panel">
          <h2>Round {last.round} revealed</h2>
          <p className="muted" style={{ margin: 0 }}>
            Dissipation {formatPercent(last.dissipation)} of the prize (equilibrium{" "}
            {formatPercent(last.equilibrium.dissipation)})
          </p>
          <RoundResults
            round={last}
            names={names}
            currency={currency}
            dark
            testPrefix="screen-round"
          />
        </div>
      ) : null}
      <div className="panel">
        <h2>Running totals</h2>
        <FigureTable
          head={[textCol("Rival"), numCol("Total payoff")]}
          wrap={null}
          testId="screen-totals"
        >
          {standings.map((s) => (
            <tr key={s.index}>
              <td>
                {s.name}
                {s.active ? "" : " (retired)"}
              </td>
              <td className="num">{formatMoney(s.total, currency)}</td>
            </tr>
          ))}
        </FigureTable>
      </div>
      {view.rounds.length > 1 && (
        <div className="panel">
          <RoomHistory
            rounds={view.rounds}
            names={names}
            currency={currency}
            dark
            testPrefix="screen-history"
          />
        </div>
      )}
    </>
  );
}
