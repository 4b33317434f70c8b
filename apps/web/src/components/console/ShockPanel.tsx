"use client";

import { useState } from "react";
import type { Command, RoleView, Shock } from "@contend/protocol";
import { seatNames } from "../../lib/live";
import {
  blankDraft,
  describeShock,
  draftToShock,
  SHOCK_FIELDS,
  SHOCK_TARGETS,
} from "../../lib/shockForm";
import type { ShockDraft } from "../../lib/shockForm";
import { SelectField, TextField } from "../Field";
import { POLICY_OPTIONS } from "./SeatsPanel";

type Run = (cmd: Command, done: string) => Promise<boolean>;

/** Between rounds: build a list of changes (costs, prize, contest form, rivals) and apply them at once. */
export function ShockPanel({ view, busy, run }: { view: RoleView; busy: boolean; run: Run }) {
  const [draft, setDraft] = useState<ShockDraft>(blankDraft);
  const [pending, setPending] = useState<Shock[]>([]);
  const [draftError, setDraftError] = useState<string | null>(null);
  const names = seatNames(view);
  const between = view.status === "lobby" || view.status === "review";

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

  return (
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
  );
}
