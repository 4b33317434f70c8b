"use client";

import { useState } from "react";
import { useSealMove } from "../../hooks/useSealMove";
import { SealConfirm } from "../live/SealConfirm";
import { ReasonField, SealError, SealedState, type MoveFormProps } from "../live/SealedState";
import { formatMoney, formatNumber } from "../../lib/format";
import { readAllocation, seatFrontsTerms, total } from "../../lib/frontsLive";

/**
 * The seat's move in a session with fronts (R46): one amount of money per front, the remaining
 * budget shown as it is typed, checked with the engine's rule, confirmed, sealed.
 */
export function FrontsMoveForm({ view, send, canSeal }: MoveFormProps) {
  const you = view.you!;
  const terms = seatFrontsTerms(view, you.seatIndex)!;
  const currency = view.scenario.currency ?? null;
  const money = (v: number) => formatMoney(v, currency);
  // the running total and what is left, to the cent (a rounded figure could hide a cent over)
  const cents = (v: number) => formatMoney(v, currency, 2);
  const [texts, setTexts] = useState<string[]>(() => terms.names.map(() => ""));
  const [reason, setReason] = useState("");
  const { confirming, setConfirming, busy, error, seal } = useSealMove<number[]>(
    view.round,
    view.status,
    send,
  );
  const entry = readAllocation(texts, terms, currency);
  const sealed = you.sealedFrontSpends ?? null;
  const over = entry.remaining !== null && entry.remaining < 0 && !entry.ok;

  return (
    <>
      <SealedState sealed={sealed !== null} paused={view.paused}>
        {sealed !== null ? (
          <>
            <strong data-testid="seat-sealed-amount">{cents(total(sealed))}</strong> in total (
            {sealed.map((s, k) => `${terms.names[k]} ${cents(s)}`).join(", ")})
          </>
        ) : null}
      </SealedState>
      {confirming === null ? (
        <form
          noValidate
          onSubmit={(e) => {
            e.preventDefault();
            if (entry.typed && entry.ok) setConfirming(entry.spends);
          }}
        >
          <p className="small muted" style={{ margin: "0 0 0.5rem" }}>
            Split your budget across the fronts, in {currency ?? "money"}. A blank front gets
            nothing.
          </p>
          <div className="fronts-inputs">
            {terms.names.map((name, k) => (
              <div className="field" key={name}>
                <label htmlFor={`front-spend-${k}`}>
                  {name}
                  <span className="hint" style={{ display: "block" }}>
                    prize {money(terms.prizes[k]!)} · cost {money(terms.cost[k]!)} per unit
                  </span>
                </label>
                <input
                  id={`front-spend-${k}`}
                  type="number"
                  inputMode="decimal"
                  min={0}
                  value={texts[k] ?? ""}
                  onChange={(e) => setTexts((t) => t.map((x, j) => (j === k ? e.target.value : x)))}
                  aria-invalid={entry.frontProblems[k] ? true : undefined}
                  disabled={!canSeal}
                  data-testid={`front-spend-input-${k}`}
                />
                {entry.frontProblems[k] ? (
                  <span className="field-error">{entry.frontProblems[k]}</span>
                ) : null}
              </div>
            ))}
          </div>
          <p
            className={`small ${over ? "field-error" : ""}`}
            data-testid="fronts-remaining"
            aria-live="polite"
          >
            Total <strong>{cents(entry.total)}</strong>
            {terms.budget !== null ? (
              <>
                {" "}
                of your budget {cents(terms.budget)} ·{" "}
                {entry.remaining !== null && entry.remaining >= 0 ? (
                  <>
                    remaining <strong>{cents(entry.remaining)}</strong>
                  </>
                ) : (
                  <>
                    over by <strong>{cents(-(entry.remaining ?? 0))}</strong>
                  </>
                )}
              </>
            ) : (
              " (no budget cap)"
            )}
            {terms.sunk ? " · your budget is committed: money you do not place is lost" : ""}
          </p>
          <span className="field-error" data-testid="fronts-problem" role="status">
            {entry.typed && entry.problem ? entry.problem : ""}
          </span>
          <div className="row" style={{ alignItems: "flex-end" }}>
            <ReasonField value={reason} onChange={setReason} disabled={!canSeal} />
            <div className="field">
              <button
                type="submit"
                className="primary"
                disabled={!canSeal || !entry.typed || !entry.ok}
                data-testid="seal-button"
              >
                {sealed !== null ? "Replace sealed split" : "Seal split"}
              </button>
            </div>
          </div>
        </form>
      ) : (
        <SealConfirm
          busy={busy}
          canSeal={canSeal}
          onConfirm={async () => {
            if (await seal(confirming, reason)) {
              setTexts(terms.names.map(() => ""));
              setReason("");
            }
          }}
          onCancel={() => setConfirming(null)}
          cancelLabel="Change amounts"
        >
          <p id="confirm-text">
            Seal <strong data-testid="seal-confirm-amount">{cents(total(confirming))}</strong> for
            round {view.round}, split as:
          </p>
          <ul className="small" style={{ marginTop: 0 }}>
            {confirming.map((s, k) => (
              <li key={terms.names[k]}>
                {terms.names[k]}: {cents(s)} ({formatNumber(s / terms.cost[k]!)} units of effort at{" "}
                {money(terms.cost[k]!)} each)
              </li>
            ))}
          </ul>
        </SealConfirm>
      )}
      <SealError error={error} />
    </>
  );
}
