"use client";

import { useMemo } from "react";
import type { Credentials, RoleView } from "@contend/protocol";
import { useSession } from "../../hooks/useSession";
import { ConnectionBanner } from "./ConnectionBanner";
import { LiveAnnouncer } from "./LiveAnnouncer";
import { SeatHistory } from "./History";
import { RoundClock } from "./RoundClock";
import { SeatMoveForm } from "./SeatMoveForm";
import { PrivateNumbers } from "./PrivateNumbers";
import { SeatRoundResult } from "./SeatRoundResult";
import { SeatTerms } from "./SeatTerms";
import { ShockBanner } from "./ShockBanner";
import { FrontsMoveForm } from "../liveFronts/FrontsMoveForm";
import { FrontsSeatResult } from "../liveFronts/FrontsSeatResult";
import { FrontsTerms } from "../liveFronts/FrontsTerms";

export function SeatView({ sessionId, seatKey }: { sessionId: string; seatKey: string }) {
  const credentials = useMemo<Credentials | null>(
    () => (seatKey ? { role: "seat", sessionId, key: seatKey } : null),
    [sessionId, seatKey],
  );
  const { connection, view, send, clockOffsetMs } = useSession(credentials);

  if (!seatKey) {
    return (
      <p className="notice error">
        This seat link has no key. Ask the facilitator for your link, or join with the session code.
      </p>
    );
  }
  return (
    <div style={{ maxWidth: 760, margin: "0 auto" }}>
      <ConnectionBanner connection={connection} />
      {view === null || view.you === undefined ? (
        <p className="muted" style={{ minHeight: "40vh" }}>
          {connection.status === "failed"
            ? "This link does not open a seat."
            : "Loading your seat…"}
        </p>
      ) : (
        <SeatBody
          view={view}
          send={send}
          clockOffsetMs={clockOffsetMs}
          connected={connection.status === "live" || connection.status === "resynced"}
        />
      )}
    </div>
  );
}

function SeatBody({
  view,
  send,
  clockOffsetMs,
  connected,
}: {
  view: RoleView;
  send: ReturnType<typeof useSession>["send"];
  clockOffsetMs: number;
  connected: boolean;
}) {
  const seat = view.you!.seatIndex;
  const currency = view.scenario.currency ?? null;
  const playing = view.status === "open" && (view.roundSeats?.includes(seat) ?? false);
  // While a round is open the move comes first (on a phone it is then above the fold).
  const move = (
    <section className="card" aria-labelledby="move-title">
      <div className="row" style={{ justifyContent: "space-between" }}>
        <h2 id="move-title">Your move</h2>
        <RoundClock view={view} clockOffsetMs={clockOffsetMs} />
      </div>
      <div style={{ minHeight: "9.5rem" }}>
        {view.status === "lobby" && (
          <p data-testid="seat-waiting">Waiting for the facilitator to open round 1.</p>
        )}
        {view.status === "ended" && (
          <p data-testid="seat-ended">The session has ended. Thank you for playing.</p>
        )}
        {view.status === "review" && (
          <p data-testid="seat-waiting">
            Round {view.round} is revealed below. The next round opens soon.
          </p>
        )}
        {view.status === "open" && !playing && <p>Your rival sits this round out.</p>}
        {playing &&
          (view.fronts ? (
            <FrontsMoveForm view={view} send={send} canSeal={!view.paused && connected} />
          ) : (
            <SeatMoveForm view={view} send={send} canSeal={!view.paused && connected} />
          ))}
      </div>
    </section>
  );
  return (
    <>
      <LiveAnnouncer view={view} />
      <ShockBanner view={view} />
      {view.status === "open" && move}
      {view.fronts ? <FrontsTerms view={view} /> : <SeatTerms view={view} />}
      {view.status !== "open" && move}
      {view.fronts ? (
        <FrontsSeatResult view={view} />
      ) : (
        !view.hidden?.withheld && <SeatRoundResult view={view} />
      )}
      <PrivateNumbers view={view} />
      {view.rounds.length > 0 && (
        <section className="card" aria-labelledby="history-title">
          <h2 id="history-title">Your rounds</h2>
          <SeatHistory rounds={view.rounds} seat={seat} currency={currency} />
        </section>
      )}
    </>
  );
}
