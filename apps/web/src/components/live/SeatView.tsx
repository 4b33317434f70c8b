"use client";

import { useEffect, useMemo, useRef, useState } from "react";
import type { Credentials, RoleView } from "@contend/protocol";
import { useSession } from "../../hooks/useSession";
import {
  formatEffort,
  formatMoney,
  formatNumber,
  formatPercent,
  formatPlain,
} from "../../lib/format";
import { equilibriumEffortOf, equilibriumPayoffOf } from "../../lib/chart-data";
import { isOnStep, newClientMoveId, seatNames, snapToStep } from "../../lib/live";
import { ConnectionBanner } from "./ConnectionBanner";
import { SeatHistory } from "./History";
import { RoundClock } from "./RoundClock";
import { RoundResults } from "./RoundResults";
import { Kpi } from "../Kpi";

function csfText(view: RoleView): string {
  const c = view.scenario.csf;
  if (c.kind === "ratio") return `ratio form, decisiveness r = ${formatPlain(c.decisiveness)}`;
  if (c.kind === "logit") return `logit form, scale k = ${c.scale}`;
  return "all-pay: the highest effort wins";
}

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
  const you = view.you!;
  const seat = you.seatIndex;
  const rival = view.scenario.rivals[seat];
  const currency = view.scenario.currency ?? null;
  const step = view.settings.effortStep;
  const money = (v: number) => formatMoney(v, currency);
  const names = seatNames(view);
  const playing = view.status === "open" && (view.roundSeats?.includes(seat) ?? false);
  const canSeal = playing && !view.paused && connected;
  const last = view.rounds.length > 0 ? view.rounds[view.rounds.length - 1] : undefined;
  const showResult = last !== undefined && view.status !== "open";

  const [text, setText] = useState("");
  const [confirming, setConfirming] = useState<number | null>(null);
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const pending = useRef<{ round: number; effort: number; id: string } | null>(null);

  // A new round clears the input and any half-finished confirmation.
  useEffect(() => {
    setConfirming(null);
    setError(null);
  }, [view.round, view.status]);

  const value = Number(text.replace(/,/g, ""));
  const typed = text.trim() !== "";
  const budget = rival?.budget ?? null;
  let problem: string | null = null;
  if (typed) {
    if (!Number.isFinite(value) || value < 0) problem = "Enter an amount of zero or more.";
    else if (!isOnStep(value, step))
      problem = `Efforts go in steps of ${formatEffort(step, currency, step)}; nearest is ${formatEffort(snapToStep(value, step), currency, step)}.`;
    else if (budget !== null && budget !== undefined && value > budget)
      problem = `Your budget is ${money(budget)}.`;
  }

  async function seal(effort: number) {
    setBusy(true);
    setError(null);
    // Same amount again in the same round (e.g. after a timeout) reuses the id: the server then
    // answers with the original ack instead of recording a second move.
    const p = pending.current;
    const id = p && p.round === view.round && p.effort === effort ? p.id : newClientMoveId();
    pending.current = { round: view.round, effort, id };
    const ack = await send({ type: "sealMove", clientMoveId: id, effort, round: view.round });
    setBusy(false);
    if (ack.ok) {
      setConfirming(null);
      setText("");
    } else {
      setError(ack.message);
    }
  }

  const lastEq = last ? equilibriumEffortOf(last, seat) : null;
  const lastEqPay = last ? equilibriumPayoffOf(last, seat) : null;

  return (
    <>
      <section className="card" aria-labelledby="seat-title">
        <h1 id="seat-title" style={{ marginBottom: 0 }}>
          {rival?.name ?? `Seat ${seat + 1}`}
        </h1>
        <p className="muted small" data-testid="seat-session-title">
          {view.title}
        </p>
        <div className="kpis">
          <Kpi label="Prize" testId="seat-prize">
            {money(view.scenario.prize)}
          </Kpi>
          <Kpi label="Worth to you" testId="seat-value">
            {money(rival?.value ?? view.scenario.prize)}
          </Kpi>
          <Kpi label="Cost per unit of effort" testId="seat-cost">
            {formatPlain(rival?.cost ?? NaN)}
          </Kpi>
          <Kpi label="Head start (weight)">{formatPlain(rival?.weight ?? 1)}</Kpi>
          <Kpi label="Budget" testId="seat-budget">
            {rival?.budget === null || rival?.budget === undefined ? "no cap" : money(rival.budget)}
          </Kpi>
        </div>
        <p className="small muted" style={{ marginTop: "0.5rem" }}>
          Contest: {csfText(view)}.{" "}
          {view.settings.outcome === "winner"
            ? "One winner is drawn by winning chance."
            : "The prize is shared by winning chance."}{" "}
          Your payoff each round: value × share − cost × effort.
        </p>
      </section>

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
          {playing && (
            <>
              <p className="small" data-testid="seat-sealed-state" aria-live="polite">
                {you.sealedEffort !== null ? (
                  <>
                    <span className="badge accent">sealed</span> You sealed{" "}
                    <strong data-testid="seat-sealed-amount">
                      {formatEffort(you.sealedEffort, currency, step)}
                    </strong>
                    . You can replace it until the round closes.
                  </>
                ) : (
                  <span className="badge warn">not sealed yet</span>
                )}
                {view.paused ? (
                  <span className="badge" style={{ marginLeft: 6 }}>
                    paused
                  </span>
                ) : null}
              </p>
              {confirming === null ? (
                <form
                  noValidate
                  onSubmit={(e) => {
                    e.preventDefault();
                    if (typed && problem === null) setConfirming(value);
                  }}
                  className="row"
                  style={{ alignItems: "flex-start" }}
                >
                  <div className="field" style={{ flex: "1 1 12rem" }}>
                    <label htmlFor="effort-input">
                      Effort this round ({currency ?? "money"}, steps of {formatPlain(step)})
                    </label>
                    <input
                      id="effort-input"
                      type="number"
                      inputMode="decimal"
                      min={0}
                      step={step}
                      max={budget ?? undefined}
                      value={text}
                      onChange={(e) => setText(e.target.value)}
                      aria-invalid={problem ? true : undefined}
                      aria-describedby="effort-error"
                      disabled={!canSeal}
                      data-testid="effort-input"
                    />
                    <span className="field-error" id="effort-error">
                      {problem ?? ""}
                      {problem && Number.isFinite(value) && value >= 0 && !isOnStep(value, step) ? (
                        <button
                          type="button"
                          className="small"
                          style={{ marginLeft: 6 }}
                          onClick={() => setText(String(snapToStep(value, step)))}
                        >
                          Use {formatNumber(snapToStep(value, step))}
                        </button>
                      ) : null}
                    </span>
                  </div>
                  <div className="field">
                    <span aria-hidden="true">&nbsp;</span>
                    <button
                      type="submit"
                      className="primary"
                      disabled={!canSeal || !typed || problem !== null}
                      data-testid="seal-button"
                    >
                      {you.sealedEffort !== null ? "Replace sealed effort" : "Seal effort"}
                    </button>
                  </div>
                </form>
              ) : (
                <div
                  className="notice"
                  role="alertdialog"
                  aria-labelledby="confirm-text"
                  data-testid="seal-confirm"
                >
                  <p id="confirm-text">
                    Seal <strong>{formatEffort(confirming, currency, step)}</strong> for round{" "}
                    {view.round}? That costs you {money(confirming * (rival?.cost ?? 1))}.
                  </p>
                  <div className="row">
                    <button
                      type="button"
                      className="primary"
                      onClick={() => seal(confirming)}
                      disabled={busy || !canSeal}
                      data-testid="seal-confirm-button"
                      autoFocus
                    >
                      {busy ? "Sealing…" : "Confirm"}
                    </button>
                    <button
                      type="button"
                      onClick={() => setConfirming(null)}
                      disabled={busy}
                      data-testid="seal-cancel-button"
                    >
                      Change amount
                    </button>
                  </div>
                </div>
              )}
              <p
                className="field-error"
                role={error ? "alert" : undefined}
                data-testid="seal-error"
              >
                {error ?? ""}
              </p>
            </>
          )}
        </div>
      </section>

      <section className="card" aria-labelledby="result-title" style={{ minHeight: "12rem" }}>
        <h2 id="result-title">{showResult ? `Round ${last.round} result` : "Results"}</h2>
        {showResult && last ? (
          <>
            <div className="kpis" data-testid="seat-result">
              <Kpi label="Your payoff" testId="seat-payoff">
                {money(last.payoffs[seat] ?? NaN)}
              </Kpi>
              <Kpi label="Your share" testId="seat-share">
                {formatPercent(last.shares[seat] ?? NaN)}
              </Kpi>
              <Kpi label="You spent (effort)" testId="seat-effort">
                {money(last.efforts[seat] ?? NaN)}
              </Kpi>
              <Kpi label="Equilibrium effort" testId="seat-eq-effort">
                {lastEq === null ? "\u2013" : money(lastEq)}
              </Kpi>
              <Kpi label="Best reply to the others" testId="seat-best-reply">
                {money(last.bestResponses[seat] ?? NaN)}
              </Kpi>
              <Kpi label="It would have added" testId="seat-regret">
                {money(last.regrets[seat] ?? NaN)}
              </Kpi>
              <Kpi label="Running total" testId="seat-total">
                {money(view.totals[seat] ?? NaN)}
              </Kpi>
            </div>
            <p className="small muted" style={{ marginTop: "0.5rem" }}>
              {last.defaulted[seat]
                ? "You did not seal in time; the missing-move rule applied. "
                : ""}
              {last.winner !== null ? `Winner drawn: ${names[last.winner] ?? "?"}. ` : ""}
              {lastEqPay !== null
                ? `At equilibrium your expected payoff would be ${money(lastEqPay)}.`
                : ""}
            </p>
            <h3 style={{ marginTop: "1rem" }}>Everyone, round {last.round}</h3>
            <RoundResults
              round={last}
              names={names}
              currency={currency}
              highlightSeat={seat}
              testPrefix="seat-round"
            />
          </>
        ) : (
          <p className="muted">
            Results appear here when the round is revealed. Others&apos; efforts stay hidden until
            then.
          </p>
        )}
      </section>

      {view.rounds.length > 0 && (
        <section className="card" aria-labelledby="history-title">
          <h2 id="history-title">Your rounds</h2>
          <SeatHistory rounds={view.rounds} seat={seat} currency={currency} />
        </section>
      )}
    </>
  );
}
