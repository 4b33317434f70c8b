"use client";

import { useMemo } from "react";
import type { Credentials, RoleView, RoundResult } from "@contend/protocol";
import { useSession } from "../../hooks/useSession";
import { formatMoney } from "../../lib/format";
import { headline } from "../../lib/roomState";
import { ConnectionBanner } from "./ConnectionBanner";
import { LiveAnnouncer } from "./LiveAnnouncer";
import { PrivateNumbers } from "./PrivateNumbers";
import { ShockBanner } from "./ShockBanner";
import { RoundClock } from "./RoundClock";
import { FinalSummary, RevealPanel, SeatTiles, StandingsPanel } from "../screen/ScreenPanels";
import { FrontsReveal } from "../liveFronts/FrontsReveal";

/**
 * The room's shared screen (projector or TV): no site chrome, one viewport with no scrolling at
 * 1366x768 and up, type sized from the viewport height so it reads from the back of the room.
 */
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
      {view ? (
        <ScreenBody view={view} clockOffsetMs={clockOffsetMs} />
      ) : (
        <div className="screen-empty">
          {spectatorKey
            ? connection.status === "failed"
              ? "This big-screen link does not open the session."
              : "Connecting to the session…"
            : "This big-screen link has no key."}
        </div>
      )}
      <footer className="screen-foot">
        <ConnectionBanner connection={connection} dark />
        <span>A model to aid discussion, not advice. Never share plans with real competitors.</span>
      </footer>
    </div>
  );
}

function ScreenBody({ view, clockOffsetMs }: { view: RoleView; clockOffsetMs: number }) {
  const currency = view.scenario.currency ?? null;
  const head = headline(view);
  const last = view.rounds[view.rounds.length - 1];
  return (
    <>
      <LiveAnnouncer view={view} />
      <header className="screen-head">
        <div className="screen-title">
          <h1>{view.title}</h1>
          <p>
            {view.fronts
              ? `${view.fronts.fronts.length} fronts · prizes ${formatMoney(view.scenario.prize, currency)} in total`
              : `Prize ${formatMoney(view.scenario.prize, currency)}`}
          </p>
        </div>
        <div className={`screen-state ${head.tone}`} data-testid="screen-status">
          <h2 data-testid="screen-headline">{head.title}</h2>
          <span data-testid="screen-detail">{head.detail}</span>
        </div>
        {view.status === "open" ? (
          <RoundClock view={view} clockOffsetMs={clockOffsetMs} big />
        ) : (
          <span />
        )}
      </header>
      <ShockBanner view={view} large />
      <div className="screen-main">
        {view.status === "ended" ? (
          <>
            {last ? <Reveal round={last} view={view} /> : <SeatTiles view={view} />}
            <div className="screen-column">
              <StandingsPanel view={view} final />
              <FinalSummary view={view} />
            </div>
          </>
        ) : (
          <>
            {view.status === "open" || !last ? (
              <SeatTiles view={view} />
            ) : (
              <Reveal round={last} view={view} />
            )}
            {/* R41: standings need payoffs, which private numbers keep until the end */}
            {view.hidden?.withheld ? (
              <PrivateNumbers view={view} screen />
            ) : (
              <StandingsPanel view={view} />
            )}
          </>
        )}
      </div>
    </>
  );
}

/** The reveal of a round: per front with fronts (R48), else the single contest's. */
function Reveal({ round, view }: { round: RoundResult; view: RoleView }) {
  return view.fronts ? (
    <FrontsReveal round={round} view={view} />
  ) : (
    <RevealPanel round={round} view={view} />
  );
}
