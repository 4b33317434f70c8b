"use client";

import { useMemo, useState } from "react";
import { POLICY_LABELS } from "@contend/solver";
import type { PolicyKind, PolicySpec } from "@contend/solver";
import type { Command, Credentials, RoleView, Shock } from "@contend/protocol";
import { useSession } from "../../hooks/useSession";
import { exportCsvUrl, exportJsonUrl } from "../../lib/api";
import { parseNumberField } from "../../lib/editor-form";
import { formatMoney } from "../../lib/format";
import { seatNames, STATUS_TEXT } from "../../lib/live";
import {
  blankDraft,
  describeShock,
  draftToShock,
  SHOCK_FIELDS,
  SHOCK_TARGETS,
} from "../../lib/shock-form";
import type { ShockDraft } from "../../lib/shock-form";
import { SelectField, TextField } from "../Field";
import { ConnectionBanner } from "./ConnectionBanner";
import { ShockBanner } from "./ShockBanner";
import { InviteLinks } from "./InviteLinks";
import { RoomHistory } from "./History";
import { RoundClock } from "./RoundClock";
import { RoundResults } from "./RoundResults";

const POLICY_OPTIONS: readonly { value: "human" | PolicyKind; label: string }[] = [
  { value: "human", label: "Person" },
  ...(Object.keys(POLICY_LABELS) as PolicyKind[])
    .filter((k) => k !== "fixed")
    .map((k) => ({ value: k, label: POLICY_LABELS[k].label })),
];

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
  const { connection, view, send, clockOffsetMs } = useSession(credentials);
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
          send={send}
          clockOffsetMs={clockOffsetMs}
          sessionId={sessionId}
          facilitatorKey={facilitatorKey}
        />
      )}
    </div>
  );
}

function ConsoleBody({
  view,
  send,
  clockOffsetMs,
  sessionId,
  facilitatorKey,
}: {
  view: RoleView;
  send: ReturnType<typeof useSession>["send"];
  clockOffsetMs: number;
  sessionId: string;
  facilitatorKey: string;
}) {
  const [notice, setNotice] = useState<{ ok: boolean; text: string } | null>(null);
  const [busy, setBusy] = useState(false);
  const [duration, setDuration] = useState("");
  const [noClock, setNoClock] = useState(false);
  const [draft, setDraft] = useState<ShockDraft>(blankDraft);
  const [pending, setPending] = useState<Shock[]>([]);
  const [draftError, setDraftError] = useState<string | null>(null);
  const [shownRound, setShownRound] = useState<number | null>(null);

  const currency = view.scenario.currency ?? null;
  const names = seatNames(view);
  const between = view.status === "lobby" || view.status === "review";
  const ended = view.status === "ended";

  async function run(cmd: Command, done: string) {
    setBusy(true);
    const ack = await send(cmd);
    setBusy(false);
    setNotice(
      ack.ok ? { ok: true, text: done } : { ok: false, text: `${ack.code}: ${ack.message}` },
    );
    return ack.ok;
  }

  function openRound() {
    let durationSeconds: number | null | undefined;
    if (noClock) durationSeconds = null;
    else if (duration.trim() !== "") {
      const d = parseNumberField(duration);
      if (typeof d !== "number") {
        setNotice({ ok: false, text: "Round length must be a number of seconds." });
        return;
      }
      durationSeconds = d;
    }
    void run(
      durationSeconds === undefined
        ? { type: "openRound" }
        : { type: "openRound", durationSeconds },
      `Round ${view.round + 1} opened.`,
    );
  }

  function addDraft() {
    const r = draftToShock(draft);
    if (!r.ok) {
      setDraftError(r.message);
      return;
    }
    setDraftError(null);
    setPending((p) => [...p, r.shock]);
  }

  async function applyShocks() {
    if (pending.length === 0) return;
    if (
      await run(
        { type: "applyShock", changes: pending },
        `${pending.length} change${pending.length > 1 ? "s" : ""} applied.`,
      )
    )
      setPending([]);
  }

  const sealedCount = view.seats.filter((s) => s.active && s.sealed).length;
  const playingCount = view.roundSeats?.length ?? view.seats.filter((s) => s.active).length;
  const roundToShow =
    shownRound === null
      ? view.rounds[view.rounds.length - 1]
      : view.rounds.find((r) => r.round === shownRound);
  const exportKey = `?key=${encodeURIComponent(facilitatorKey)}`;

  return (
    <>
      <ShockBanner view={view} />
      <section className="card">
        <div className="row" style={{ justifyContent: "space-between", alignItems: "flex-start" }}>
          <div>
            <h1 style={{ marginBottom: 0 }}>{view.title}</h1>
            <p className="small muted">
              Facilitator console ·{" "}
              <span data-testid="session-status">{STATUS_TEXT[view.status]}</span>
              {view.paused ? " · paused" : ""} · prize {formatMoney(view.scenario.prize, currency)}{" "}
              · {view.settings.outcome === "winner" ? "one winner drawn" : "prize shared"}
            </p>
          </div>
          <RoundClock view={view} clockOffsetMs={clockOffsetMs} />
        </div>
        <div className="row" style={{ alignItems: "flex-end" }}>
          <TextField
            label="Round length (s)"
            numeric
            value={duration}
            onChange={setDuration}
            placeholder={
              view.settings.clockSeconds === null ? "no clock" : String(view.settings.clockSeconds)
            }
            width="10rem"
            testId="open-duration"
          />
          <label
            className="row small"
            style={{ gap: "0.3rem", fontWeight: 400, paddingBottom: "1.4rem" }}
          >
            <input
              type="checkbox"
              checked={noClock}
              onChange={(e) => setNoClock(e.target.checked)}
              data-testid="open-no-clock"
            />{" "}
            no clock
          </label>
          <div className="row" style={{ paddingBottom: "1.3rem" }}>
            <button
              type="button"
              className="primary"
              onClick={openRound}
              disabled={busy || !between || view.round >= view.roundsTotal}
              data-testid="open-round"
            >
              Open round {Math.min(view.round + 1, view.roundsTotal)}
            </button>
            <button
              type="button"
              onClick={() => run({ type: "closeRound" }, "Round closed and revealed.")}
              disabled={busy || view.status !== "open"}
              data-testid="close-round"
            >
              Close and reveal
            </button>
            {view.paused ? (
              <button
                type="button"
                onClick={() => run({ type: "resume" }, "Resumed.")}
                disabled={busy || ended}
                data-testid="resume"
              >
                Resume
              </button>
            ) : (
              <button
                type="button"
                onClick={() => run({ type: "pause" }, "Paused.")}
                disabled={busy || ended}
                data-testid="pause"
              >
                Pause
              </button>
            )}
            <button
              type="button"
              className="danger"
              onClick={() => {
                if (window.confirm("End the session for everyone? This cannot be undone."))
                  void run({ type: "endSession" }, "Session ended.");
              }}
              disabled={busy || ended}
              data-testid="end-session"
            >
              End session
            </button>
          </div>
        </div>
        <p
          aria-live="polite"
          className={notice?.ok === false ? "field-error" : "small"}
          data-testid="console-notice"
          style={{ minHeight: "1.4em", margin: 0 }}
        >
          {notice?.text ?? ""}
        </p>
      </section>

      <div className="grid-2">
        <section className="card" aria-labelledby="seats-title">
          <h2 id="seats-title">
            Seats{" "}
            {view.status === "open" && (
              <span className="badge accent" data-testid="sealed-count">
                {sealedCount} of {playingCount} sealed
              </span>
            )}
          </h2>
          <ul className="seat-list">
            {view.seats.map((s) => (
              <li key={s.index} data-testid={`seat-row-${s.index}`}>
                <span className="name">
                  {s.name}
                  {s.displayName && s.displayName !== s.name ? (
                    <span className="muted small"> · {s.displayName}</span>
                  ) : null}
                </span>
                {!s.active ? (
                  <span className="badge off">retired</span>
                ) : s.kind === "computer" ? (
                  <span className="badge">
                    computer{s.policy ? `: ${POLICY_LABELS[s.policy.kind].label}` : ""}
                  </span>
                ) : s.claimed ? (
                  <span className="badge accent">claimed</span>
                ) : (
                  <span className="badge warn">empty</span>
                )}
                {view.status === "open" && s.active ? (
                  <span
                    className={s.sealed ? "badge accent" : "badge"}
                    data-testid={`seat-sealed-${s.index}`}
                    data-sealed={s.sealed ? "yes" : "no"}
                  >
                    {s.sealed ? "sealed" : "waiting"}
                  </span>
                ) : null}
                {between && s.active ? (
                  <SelectField
                    compact
                    label={`Who plays ${s.name}`}
                    value={(s.policy?.kind as PolicyKind | undefined) ?? "human"}
                    options={POLICY_OPTIONS}
                    onChange={(v) =>
                      void run(
                        {
                          type: "setSeatPolicy",
                          seatIndex: s.index,
                          policy: v === "human" ? null : ({ kind: v } as PolicySpec),
                        },
                        `${s.name}: ${v === "human" ? "played by a person" : POLICY_LABELS[v].label}.`,
                      )
                    }
                    testId={`seat-policy-${s.index}`}
                  />
                ) : null}
              </li>
            ))}
          </ul>
        </section>

        <section className="card" aria-labelledby="invite-title">
          <h2 id="invite-title">Invitations</h2>
          <InviteLinks view={view} sessionId={sessionId} send={send} onNotice={setNotice} />
          <p className="small" style={{ marginTop: "0.75rem" }}>
            Exports: <a href={exportJsonUrl(sessionId, facilitatorKey)}>JSON</a> ·{" "}
            <a href={exportCsvUrl(sessionId, facilitatorKey)}>CSV</a> ·{" "}
            <a href={`/replays/${encodeURIComponent(sessionId)}${exportKey}`}>replay and debrief</a>
          </p>
        </section>
      </div>

      <section className="card" aria-labelledby="shock-title">
        <h2 id="shock-title">Shocks between rounds</h2>
        {!between ? (
          <p className="small muted">
            Shocks can be applied before the first round or after a reveal.
          </p>
        ) : (
          <>
            <div className="row" style={{ alignItems: "flex-start" }}>
              <SelectField
                label="Change"
                value={draft.target}
                options={SHOCK_TARGETS}
                onChange={(v) => setDraft((d) => ({ ...d, target: v }))}
                testId="shock-target"
              />
              {(draft.target === "rival" || draft.target === "retire-rival") && (
                <SelectField
                  label="Rival"
                  value={draft.index}
                  options={view.seats
                    .filter((s) => s.active)
                    .map((s) => ({ value: String(s.index), label: s.name }))}
                  onChange={(v) => setDraft((d) => ({ ...d, index: v }))}
                  testId="shock-rival"
                />
              )}
              {draft.target === "rival" && (
                <SelectField
                  label="Field"
                  value={draft.field}
                  options={SHOCK_FIELDS.map((f) => ({ value: f, label: f }))}
                  onChange={(v) => setDraft((d) => ({ ...d, field: v }))}
                  testId="shock-field"
                />
              )}
              {(draft.target === "rival" || draft.target === "prize") && (
                <TextField
                  label="New value"
                  numeric
                  value={draft.value}
                  onChange={(v) => setDraft((d) => ({ ...d, value: v }))}
                  placeholder={draft.target === "rival" ? "blank = default" : ""}
                  testId="shock-value"
                  width="10rem"
                />
              )}
              {draft.target === "csf" && (
                <>
                  <SelectField
                    label="Form"
                    value={draft.csfKind}
                    options={[
                      { value: "ratio", label: "Ratio" },
                      { value: "logit", label: "Logit" },
                      { value: "allpay", label: "All-pay" },
                    ]}
                    onChange={(v) => setDraft((d) => ({ ...d, csfKind: v }))}
                    testId="shock-csf-kind"
                  />
                  {draft.csfKind !== "allpay" && (
                    <TextField
                      label={draft.csfKind === "ratio" ? "Decisiveness r" : "Scale k"}
                      numeric
                      value={draft.csfParam}
                      onChange={(v) => setDraft((d) => ({ ...d, csfParam: v }))}
                      testId="shock-csf-param"
                      width="10rem"
                    />
                  )}
                </>
              )}
              {draft.target === "add-rival" && (
                <>
                  <TextField
                    label="Name"
                    value={draft.name}
                    onChange={(v) => setDraft((d) => ({ ...d, name: v }))}
                    testId="shock-new-name"
                  />
                  <TextField
                    label="Cost"
                    numeric
                    value={draft.cost}
                    onChange={(v) => setDraft((d) => ({ ...d, cost: v }))}
                    testId="shock-new-cost"
                    width="8rem"
                  />
                  <SelectField
                    label="Played by"
                    value={draft.policy}
                    options={POLICY_OPTIONS}
                    onChange={(v) => setDraft((d) => ({ ...d, policy: v }))}
                    testId="shock-new-policy"
                  />
                </>
              )}
              <div className="field">
                <span aria-hidden="true">&nbsp;</span>
                <button type="button" onClick={addDraft} data-testid="shock-add">
                  Add change
                </button>
              </div>
            </div>
            <p className="field-error">{draftError ?? ""}</p>
            <ul data-testid="shock-pending">
              {pending.map((s, k) => (
                <li key={k}>
                  {describeShock(s, names)}{" "}
                  <button
                    type="button"
                    className="small"
                    onClick={() => setPending((p) => p.filter((_, j) => j !== k))}
                    aria-label={`Remove change ${k + 1}`}
                  >
                    Remove
                  </button>
                </li>
              ))}
            </ul>
            <button
              type="button"
              className="primary"
              onClick={applyShocks}
              disabled={busy || pending.length === 0}
              data-testid="shock-apply"
            >
              Apply {pending.length} change{pending.length === 1 ? "" : "s"}
            </button>
          </>
        )}
        {view.shocks.length > 0 && (
          <div style={{ marginTop: "0.75rem" }}>
            <h3>Applied</h3>
            <ul className="small" data-testid="shock-history">
              {view.shocks.map((rec, k) => (
                <li key={k}>
                  After round {rec.afterRound}:{" "}
                  {rec.changes.map((c) => describeShock(c, names)).join("; ")}
                </li>
              ))}
            </ul>
          </div>
        )}
      </section>

      <section className="card" aria-labelledby="results-title" style={{ minHeight: "14rem" }}>
        <div className="row" style={{ justifyContent: "space-between" }}>
          <h2 id="results-title">Results</h2>
          {view.rounds.length > 1 && (
            <SelectField
              label="Show round"
              value={String(roundToShow?.round ?? "")}
              options={view.rounds.map((r) => ({
                value: String(r.round),
                label: `Round ${r.round}`,
              }))}
              onChange={(v) => setShownRound(Number(v))}
              testId="results-round"
            />
          )}
        </div>
        {roundToShow ? (
          <RoundResults
            round={roundToShow}
            names={names}
            currency={currency}
            testPrefix="console-round"
          />
        ) : (
          <p className="muted">No round revealed yet.</p>
        )}
        {view.rounds.length > 0 && (
          <div style={{ marginTop: "1rem" }}>
            <RoomHistory
              rounds={view.rounds}
              names={names}
              currency={currency}
              testPrefix="console-history"
            />
          </div>
        )}
      </section>
    </>
  );
}
