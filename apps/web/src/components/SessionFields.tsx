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

/** The live session's own settings: outcome, spend step, rounds, clock, missing moves. */
export function SessionFields({
  form,
  setForm,
  shown,
}: {
  form: EditorForm;
  setForm: (update: (f: EditorForm) => EditorForm) => void;
  /** the message to show for a field path, if any */
  shown: (path: string) => string | undefined;
}) {
  const bind = <K extends keyof EditorForm>(key: K) => bindField(form, setForm, key);
  return (
    <fieldset>
      <legend>Live session</legend>
      <div className="row" style={{ alignItems: "flex-start" }}>
        <RadioGroup
          legend="Outcome"
          name="outcome"
          options={OUTCOME_OPTIONS}
          {...bind("outcome")}
          testId="field-outcome"
        />
      </div>
      <div className="grid-3">
        <TextField
          label="Spend step"
          numeric
          {...bind("spendStep")}
          error={shown("session.spendStep")}
          testId="field-spend-step"
          hint="(money; spends are multiples)"
        />
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
          options={MISSING_OPTIONS}
          {...bind("missingMove")}
          testId="field-missing-move"
        />
      </div>
    </fieldset>
  );
}
