"use client";

import { useEffect, useMemo } from "react";
import type { Credentials, RoleView } from "@contend/protocol";
import { useConsoleCommands } from "../../hooks/useConsoleCommands";
import { useSession } from "../../hooks/useSession";
import type { SessionHandle } from "../../hooks/useSession";
import { keyedPath } from "../../lib/api";
import { rememberFacilitatorKey } from "../../lib/keyring";
import { formatMoney } from "../../lib/format";
import { STATUS_TEXT } from "../../lib/live";
import { NextStep } from "../console/NextStep";
import { ComingRound, LatestResult, ResultsPanel } from "../console/RoundPanels";
import { SeatsPanel } from "../console/SeatsPanel";
import { ShockPanel } from "../console/ShockPanel";
import { ConnectionBanner } from "./ConnectionBanner";
import { InviteLinks } from "./InviteLinks";
import { LiveAnnouncer } from "./LiveAnnouncer";
import { ShockBanner } from "./ShockBanner";
import { RoundClock } from "./RoundClock";
import { ExportDownload } from "../ExportDownload";
import { PrivateReview } from "./PrivateReview";
import {
  FrontsComingRound,
  FrontsLatest,
  FrontsResultsPanel,
} from "../liveFronts/FrontsConsolePanels";

/**
 * The facilitator's console, ordered by the flow of a workshop: the next step and the latest
 * result at the top, then the seats (who is online, who sealed) beside the equilibrium of the
 * coming round, then shocks, invitations and exports, then every result.
 */
export function FacilitatorConsole({
  sessionId,
  facilitatorKey,
}: {
  sessionId: string;
  facilitatorKey: string;
}) {
  const credentials = useMemo<Credentials | null>(
    () => (facilitatorKey ? { role: "facilitator", sessionId, key: facilitatorKey } : null),
    [sessionId, facilitatorKey],
  );
  const session = useSession(credentials);
  const { connection, view } = session;
  // Once the key has opened the console, this browser lists the session among its replays.
  const opened = view !== null;
  useEffect(() => {
    if (opened) rememberFacilitatorKey(sessionId, facilitatorKey);
  }, [opened, sessionId, facilitatorKey]);
  if (!facilitatorKey) return <p className="notice error">This facilitator link has no key.</p>;
  return (
    <div>
      <ConnectionBanner connection={connection} />
      {view === null ? (
        <p className="muted" style={{ minHeight: "40vh" }}>
          {connection.status === "failed"
            ? "This link does not open the facilitator console."
            : "Loading the session…"}
        </p>
      ) : (
        <ConsoleBody
          view={view}
          session={session}
          sessionId={sessionId}
          facilitatorKey={facilitatorKey}
        />
      )}
    </div>
  );
}

function ConsoleBody({
  view,
  session,
  sessionId,
  facilitatorKey,
}: {
  view: RoleView;
  session: SessionHandle;
  sessionId: string;
  facilitatorKey: string;
}) {
  const { busy, notice, setNotice, run } = useConsoleCommands(session.send);
  const currency = view.scenario.currency ?? null;
  return (
    <>
      <LiveAnnouncer view={view} />
      <ShockBanner view={view} />
      <header className="console-head">
        <div>
          <h1 style={{ marginBottom: 0 }}>{view.title}</h1>
          <p className="small muted" style={{ margin: 0 }}>
            Facilitator console ·{" "}
            <span data-testid="session-status">{STATUS_TEXT[view.status]}</span>
            {view.paused ? " · paused" : ""} ·{" "}
            {view.fronts
              ? `${view.fronts.fronts.length} fronts, prizes ${formatMoney(view.scenario.prize, currency)} in total · each front shared`
              : `prize ${formatMoney(view.scenario.prize, currency)} · ${view.settings.outcome === "winner" ? "one winner drawn" : "prize shared"}`}
          </p>
        </div>
        <RoundClock view={view} clockOffsetMs={session.clockOffsetMs} />
      </header>

      <div className="grid-2 console-top">
        <NextStep view={view} busy={busy} run={run} notice={notice} />
        {view.fronts ? <FrontsLatest view={view} /> : <LatestResult view={view} />}
      </div>

      <div className="grid-2">
        <SeatsPanel view={view} presence={session.presence} busy={busy} run={run} />
        {view.fronts ? <FrontsComingRound view={view} /> : <ComingRound view={view} />}
      </div>

      <PrivateReview view={view} testId="console-private" />

      {/* R50: no shocks with fronts */}
      {!view.fronts && <ShockPanel view={view} busy={busy} run={run} />}

      <section className="card" aria-labelledby="invite-title">
        <h2 id="invite-title">Invitations and exports</h2>
        <InviteLinks view={view} sessionId={sessionId} send={session.send} onNotice={setNotice} />
        <p className="small" style={{ marginTop: "0.75rem" }}>
          Download the session:{" "}
          <ExportDownload
            sessionId={sessionId}
            accessKey={facilitatorKey}
            format="json"
            label="JSON"
            className="link-button"
            testId="console-export-json"
          />{" "}
          ·{" "}
          <ExportDownload
            sessionId={sessionId}
            accessKey={facilitatorKey}
            format="csv"
            label="CSV"
            className="link-button"
            testId="console-export-csv"
          />{" "}
          ·{" "}
          <a href={keyedPath("replays", sessionId, facilitatorKey)}>replay and printable debrief</a>
        </p>
      </section>

      {view.fronts ? (
        <FrontsResultsPanel view={view} send={session.send} />
      ) : (
        <ResultsPanel view={view} send={session.send} />
      )}
    </>
  );
}
