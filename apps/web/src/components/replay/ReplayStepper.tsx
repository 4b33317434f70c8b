"use client";

import { useMemo, useState } from "react";
import type { SessionEvent } from "@contend/protocol";
import { formatDateTime, formatMoney } from "../../lib/format";
import { STATUS_TEXT } from "../../lib/live";
import { describeEvent, viewAfter } from "../../lib/replay";
import { RoundResults } from "../live/RoundResults";

/** Step through the event log: the state after any event, the event list, the last round revealed. */
export function ReplayStepper({
  events,
  names,
  currency,
}: {
  events: readonly SessionEvent[];
  names: readonly string[];
  currency: string | null;
}) {
  const [step, setStep] = useState(events.length);
  const at = useMemo(() => viewAfter(events, step), [events, step]);
  const current = events[step - 1];
  const money = (v: number) => formatMoney(v, currency);
  return (
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
          slides
        />
      )}
    </section>
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
