"use client";

import type { EditorForm } from "../lib/editorForm";
import { bindField } from "../lib/editorForm";
import { RadioGroup, SelectField, TextField } from "./Field";

const OUTCOME_OPTIONS = [
  { value: "shares", label: "Prize shared by winning chance" },
  { value: "winner", label: "One winner drawn" },
] as const;

const MISSING_OPTIONS = [
  { value: "zero", label: "Counts as spending nothing" },
  { value: "repeat", label: "Repeats the seat's previous spend" },
] as const;

const FRONTS_MISSING_OPTIONS = [
  { value: "zero", label: "Counts as spending nothing anywhere" },
  { value: "repeat", label: "Repeats the seat's previous split" },
] as const;

/**
 * The live session's own settings: outcome, spend step, rounds, clock, missing moves. With
 * `fronts`, the settings a session with fronts refuses (docs/protocol.md R45, R46, R50) are
 * replaced by one line each saying why.
 */
export function SessionFields({
  form,
  setForm,
  shown,
  fronts = false,
}: {
  form: EditorForm;
  setForm: (update: (f: EditorForm) => EditorForm) => void;
  /** the message to show for a field path, if any */
  shown: (path: string) => string | undefined;
  fronts?: boolean;
}) {
  const bind = <K extends keyof EditorForm>(key: K) => bindField(form, setForm, key);
  return (
    <fieldset>
      <legend>Live session</legend>
      {fronts ? (
        <ul className="small muted" data-testid="fronts-not-available">
          <li>
            Outcome: every front is shared by winning chance; drawing one winner is not available
            with fronts.
          </li>
          <li>Spend step: none; a seat splits its budget in any amounts of money (to the cent).</li>
          <li>Private costs and values: not available with fronts; every seat sees all numbers.</li>
          <li>Shocks during the session: not available with fronts.</li>
          <li>
            Computer players: the textbook strategist and the last-round reactor only; the others
            play one spend, not a split.
          </li>
        </ul>
      ) : (
        <div className="row" style={{ alignItems: "flex-start" }}>
          <RadioGroup
            legend="Outcome"
            name="outcome"
            options={OUTCOME_OPTIONS}
            {...bind("outcome")}
            testId="field-outcome"
          />
        </div>
      )}
      <div className="grid-3">
        {!fronts && (
          <TextField
            label="Spend step"
            numeric
            {...bind("spendStep")}
            error={shown("session.spendStep")}
            testId="field-spend-step"
            hint="(money; spends are multiples)"
          />
        )}
        <TextField
          label="Rounds"
          numeric
          {...bind("rounds")}
          error={shown("session.rounds")}
          testId="field-rounds"
        />
        <TextField
          label="Round clock (seconds)"
          numeric
          {...bind("clockSeconds")}
          error={shown("session.clockSeconds")}
          testId="field-clock"
          placeholder="no clock"
        />
        <SelectField
          label="Missing move"
          options={fronts ? FRONTS_MISSING_OPTIONS : MISSING_OPTIONS}
          {...bind("missingMove")}
          testId="field-missing-move"
        />
      </div>
    </fieldset>
  );
}
