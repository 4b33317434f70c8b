"use client";

import { useEffect, useMemo, useState } from "react";
import type { SessionExport } from "@contend/protocol";
import { exportSession } from "../../lib/api";
import { formatDateTime, formatMoney, formatPercent } from "../../lib/format";
import { seatNames, STATUS_TEXT } from "../../lib/live";
import { describeEvent, parseExport, seatSummary, viewAfter } from "../../lib/replay";
import { CAUTION_LINES } from "../Cautions";
import { ExportDownload } from "../ExportDownload";
import { RoomHistory } from "../live/History";
import { RoundResults } from "../live/RoundResults";
import { FigureTable, numCol, textCol } from "../FigureTable";
import { ProvenanceNote } from "../ProvenanceNote";
import { AboutTheMaths } from "../AboutTheMaths";
import { DeleteSession } from "./DeleteSession";
import { Term } from "../Glossary";

export function ReplayViewer({ sessionId, accessKey }: { sessionId: string; accessKey: string }) {
  const [data, setData] = useState<SessionExport | null>(null);
  const [error, setError] = useState<string | null>(null);
  useEffect(() => {
    let live = true;
    if (!accessKey) return;
    void exportSession(sessionId, accessKey || undefined).then((r) => {
      if (!live) return;
      if (!r.ok) return setError(r.message);
      const parsed = parseExport(r.data);
      if (parsed.ok) setData(parsed.value);
      else setError(parsed.message);
    });
    return () => {
      live = false;
    };
  }, [sessionId, accessKey]);

  if (!accessKey) {
    return (
      <p className="notice error" data-testid="replay-error">
        This replay link has no key. Open it from the facilitator console or from the replays list.
      </p>
    );
  }
  if (error)
    return (
      <p className="notice error" data-testid="replay-error">
        Could not load this session: {error}
      </p>
    );
  if (!data) return <p className="muted">Loading the session log…</p>;
  if (data.events.length === 0) return <p className="notice">This session has no events.</p>;
  return <ReplayBody data={data} sessionId={sessionId} accessKey={accessKey} />;
}

function ReplayBody({
  data,
  sessionId,
  accessKey,
}: {
  data: SessionExport;
  sessionId: string;
  accessKey: string;
}) {
  const events = data.events;
  const [step, setStep] = useState(events.length);
  const at = useMemo(() => viewAfter(events, step), [events, step]);
  const finalView = useMemo(() => viewAfter(events, events.length), [events]);
  const names = finalView.ok ? seatNames(finalView.view) : [];
  const currency = finalView.ok ? (finalView.view.scenario.currency ?? null) : null;
  const current = events[step - 1];
  const money = (v: number) => formatMoney(v, currency);

  return (
    <div>
      <div className="row" style={{ justifyContent: "space-between" }}>
        <div>
          <h1 style={{ marginBottom: 0 }}>{data.session.title}</h1>
          <p className="muted small">
            {STATUS_TEXT[data.session.status]} · {data.session.rounds} round
            {data.session.rounds === 1 ? "" : "s"} played · created{" "}
            {formatDateTime(data.session.createdAt)}
          </p>
        </div>
        <div className="row no-print">
          <ExportDownload
            sessionId={sessionId}
            accessKey={accessKey}
            format="json"
            label="Download JSON"
            testId="download-json"
          />
          <ExportDownload
            sessionId={sessionId}
            accessKey={accessKey}
            format="csv"
            label="Download CSV"
            testId="download-csv"
          />
          <button type="button" onClick={() => window.print()} data-testid="print-debrief">
            Print debrief
          </button>
          <DeleteSession sessionId={sessionId} accessKey={accessKey} />
        </div>
      </div>

      <section className="card no-print" aria-labelledby="step-title">
        <h2 id="step-title">Step through the log</h2>
        <div className="row">
          <button
            type="button"
            onClick={() => setStep(1)}
            disabled={step <= 1}
            aria-label="First event"
            data-testid="replay-first"
          >
            <StepIcon to="first" />
          </button>
          <button
            type="button"
            onClick={() => setStep((s) => Math.max(1, s - 1))}
            disabled={step <= 1}
            data-testid="replay-prev"
          >
            Previous
          </button>
          <input
            type="range"
            min={1}
            max={events.length}
            value={step}
            onChange={(e) => setStep(Number(e.target.value))}
            aria-label="Event number"
            style={{ flex: "1 1 12rem" }}
            data-testid="replay-slider"
          />
          <button
            type="button"
            onClick={() => setStep((s) => Math.min(events.length, s + 1))}
            disabled={step >= events.length}
            data-testid="replay-next"
          >
            Next
          </button>
          <button
            type="button"
            onClick={() => setStep(events.length)}
            disabled={step >= events.length}
            aria-label="Last event"
            data-testid="replay-last"
          >
            <StepIcon to="last" />
          </button>
        </div>
        <p data-testid="replay-position" style={{ minHeight: "1.5em" }}>
          Event {step} of {events.length}
          {current ? `: ${describeEvent(current, names)} · ${formatDateTime(current.at)}` : ""}
        </p>
        {at.ok ? (
          <div className="grid-2">
            <div>
              <h3>State after this event</h3>
              <p className="small" data-testid="replay-state">
                {STATUS_TEXT[at.view.status]} · round {at.view.round} of {at.view.roundsTotal}
                {at.view.paused ? " · paused" : ""}
              </p>
              <ul className="seat-list">
                {at.view.seats.map((s) => (
                  <li key={s.index}>
                    <span className="name">{s.name}</span>
                    <span className="badge">{s.kind}</span>
                    {!s.active && <span className="badge off">retired</span>}
                    {at.view.status === "open" && (
                      <span className={s.sealed ? "badge accent" : "badge"}>
                        {s.sealed ? "sealed" : "waiting"}
                      </span>
                    )}
                    <span className="small num">{money(at.view.totals[s.index] ?? 0)}</span>
                  </li>
                ))}
              </ul>
            </div>
            <div>
              <h3>Events</h3>
              <ol
                className="small"
                style={{ maxHeight: 260, overflow: "auto", paddingLeft: "1.6rem" }}
                data-testid="replay-events"
              >
                {events.map((e, k) => (
                  <li key={e.seq} style={{ fontWeight: k === step - 1 ? 700 : 400 }}>
                    <button
                      type="button"
                      className="small"
                      style={{ border: 0, padding: 0, background: "none", color: "var(--accent)" }}
                      onClick={() => setStep(k + 1)}
                    >
                      {describeEvent(e, names)}
                    </button>
                  </li>
                ))}
              </ol>
            </div>
          </div>
        ) : (
          <p className="notice error">{at.message}</p>
        )}
        {at.ok && at.view.rounds.length > 0 && at.view.status !== "open" && (
          <RoundResults
            round={at.view.rounds[at.view.rounds.length - 1]!}
            names={names}
            currency={currency}
            testPrefix="replay-round"
          />
        )}
      </section>

      <section className="card debrief" aria-labelledby="debrief-title">
        <h2 id="debrief-title">Debrief</h2>
        {finalView.ok && (
          <p>
            Contest: {finalView.view.scenario.rivals.length} rivals, prize{" "}
            {money(finalView.view.scenario.prize)},{" "}
            {finalView.view.settings.outcome === "winner"
              ? "one winner drawn each round"
              : "prize shared by winning chance"}
            .
          </p>
        )}
        {finalView.ok && finalView.view.scenario.provenance && (
          <ProvenanceNote
            provenance={finalView.view.scenario.provenance}
            currency={currency}
            testId="debrief-provenance"
          />
        )}
        {data.rounds.length === 0 ? (
          <p className="muted">No round was revealed.</p>
        ) : (
          <>
            <FigureTable
              head={[
                textCol("Round"),
                numCol("Total spend"),
                numCol(<Term id="dissipation">Share of the prize spent</Term>, "Dissipation"),
                numCol(<Term id="equilibrium">At equilibrium</Term>, "At equilibrium"),
                numCol(<Term id="regret">Largest regret</Term>, "Largest regret"),
              ]}
              caption="Rounds: share of the prize spent, played and at equilibrium, and the largest regret"
              testId="debrief-rounds"
            >
              {data.rounds.map((r) => (
                <tr key={r.round}>
                  <td>{r.round}</td>
                  <td className="num">{money(r.spends.reduce((a, b) => a + b, 0))}</td>
                  <td className="num">{formatPercent(r.dissipation)}</td>
                  <td className="num">{formatPercent(r.equilibrium.dissipation)}</td>
                  <td className="num">{money(r.nashGap)}</td>
                </tr>
              ))}
            </FigureTable>
            <FigureTable
              head={[
                textCol("Rival"),
                numCol("Rounds"),
                numCol("Mean spend"),
                numCol(
                  <Term id="equilibrium">Mean equilibrium spend</Term>,
                  "Mean equilibrium spend",
                ),
                numCol(<Term id="regret">Total regret</Term>, "Total regret"),
                numCol("Total payoff"),
              ]}
              caption="Seats: what each spent against equilibrium, and what it left on the table"
              testId="debrief-seats"
              wrapStyle={{ marginTop: "1rem" }}
            >
              {seatSummary(data, names.length).map((r) => (
                <tr key={r.seat}>
                  <td>{names[r.seat] ?? `Seat ${r.seat + 1}`}</td>
                  <td className="num">{r.rounds}</td>
                  <td className="num">{money(r.meanSpend)}</td>
                  <td className="num">
                    {r.meanEqSpend === null ? "\u2013" : money(r.meanEqSpend)}
                  </td>
                  <td className="num">{money(r.regret)}</td>
                  <td className="num">{money(r.total)}</td>
                </tr>
              ))}
            </FigureTable>
            <div style={{ marginTop: "1rem" }}>
              <RoomHistory
                rounds={data.rounds}
                names={names}
                currency={currency}
                testPrefix="replay-history"
              />
            </div>
          </>
        )}
        <AboutTheMaths />
        <div className="caution" style={{ marginTop: "1rem" }}>
          <strong>Cautions</strong>
          <ul>
            {CAUTION_LINES.map((l) => (
              <li key={l}>{l}</li>
            ))}
          </ul>
        </div>
      </section>
    </div>
  );
}

/** "Go to the first / last event" as a drawn icon (a bar and a triangle), not a font glyph. */
function StepIcon({ to }: { to: "first" | "last" }) {
  return (
    <svg
      viewBox="0 0 16 16"
      width="1em"
      height="1em"
      aria-hidden="true"
      focusable="false"
      style={{ verticalAlign: "-0.125em", transform: to === "last" ? "scaleX(-1)" : undefined }}
    >
      <rect x="2" y="2.5" width="2" height="11" fill="currentColor" />
      <path d="M14 2.5v11L5.5 8z" fill="currentColor" />
    </svg>
  );
}
