"use client";

import { useState } from "react";
import { spendStepOf } from "@contend/protocol";
import { useSealMove } from "../../hooks/useSealMove";
import { SealConfirm } from "./SealConfirm";
import { ReasonField, SealError, SealedState, type MoveFormProps } from "./SealedState";
import { formatMoney, formatNumber } from "../../lib/format";
import { readSpend } from "../../lib/live";

/** The seat's move for the open round: an amount of money, checked, confirmed, sealed. */
export function SeatMoveForm({ view, send, canSeal }: MoveFormProps) {
  const you = view.you!;
  const rival = view.scenario.rivals[you.seatIndex]!;
  const currency = view.scenario.currency ?? null;
  const step = spendStepOf(view.settings);
  const money = (v: number) => formatMoney(v, currency);
  const [text, setText] = useState("");
  const [reason, setReason] = useState("");
  const { confirming, setConfirming, busy, error, seal } = useSealMove(
    view.round,
    view.status,
    send,
  );
  const entry = readSpend(text, rival, step, currency);
  const problem = entry.typed && !entry.ok ? entry.problem : null;
  const sealed = you.sealedSpend ?? null;

  return (
    <>
      <SealedState sealed={sealed !== null} paused={view.paused}>
        {sealed !== null ? (
          <>
            <strong data-testid="seat-sealed-amount">{money(sealed)}</strong>
            {you.sealedReason ? (
              <>
                {" "}
                with your reason “<span data-testid="seat-sealed-reason">{you.sealedReason}</span>”
              </>
            ) : null}
          </>
        ) : null}
      </SealedState>
      {confirming === null ? (
        <form
          noValidate
          onSubmit={(e) => {
            e.preventDefault();
            if (entry.typed && entry.ok) setConfirming(entry.spend);
          }}
          className="row"
          style={{ alignItems: "flex-start" }}
        >
          <div className="field" style={{ flex: "1 1 12rem" }}>
            <label htmlFor="spend-input">
              Your spend this round, in {currency ?? "money"} (steps of {money(step)}
              {rival.budget === null || rival.budget === undefined
                ? ""
                : `, at most ${money(rival.budget)}`}
              )
            </label>
            <input
              id="spend-input"
              type="number"
              inputMode="decimal"
              min={0}
              step={step}
              max={rival.budget ?? undefined}
              value={text}
              onChange={(e) => setText(e.target.value)}
              aria-invalid={problem ? true : undefined}
              aria-describedby="spend-error"
              disabled={!canSeal}
              data-testid="spend-input"
            />
            <span className="field-error" id="spend-error" data-testid="spend-problem">
              {problem ?? ""}
              {entry.typed && !entry.ok && entry.nearest !== null ? (
                <button
                  type="button"
                  className="small"
                  style={{ marginLeft: 6 }}
                  onClick={() => setText(String(entry.nearest))}
                  data-testid="spend-use-nearest"
                >
                  Use {money(entry.nearest)}
                </button>
              ) : null}
            </span>
          </div>
          <ReasonField value={reason} onChange={setReason} disabled={!canSeal} />
          <div className="field">
            <span aria-hidden="true">&nbsp;</span>
            <button
              type="submit"
              className="primary"
              disabled={!canSeal || !entry.typed || problem !== null}
              data-testid="seal-button"
            >
              {sealed !== null ? "Replace sealed spend" : "Seal spend"}
            </button>
          </div>
        </form>
      ) : (
        <SealConfirm
          busy={busy}
          canSeal={canSeal}
          onConfirm={async () => {
            if (await seal(confirming, reason)) {
              setText("");
              setReason("");
            }
          }}
          onCancel={() => setConfirming(null)}
          cancelLabel="Change amount"
        >
          <p id="confirm-text">
            Seal <strong data-testid="seal-confirm-amount">{money(confirming)}</strong> for round{" "}
            {view.round}? At your cost of {money(rival.cost)} per unit, it buys{" "}
            {formatNumber(confirming / rival.cost)} units of effort.
          </p>
        </SealConfirm>
      )}
      <SealError error={error} />
    </>
  );
}
