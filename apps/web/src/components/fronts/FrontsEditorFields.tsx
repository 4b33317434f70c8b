"use client";

import type { EditorForm } from "../../lib/editorForm";
import { bindField, computerError } from "../../lib/editorForm";
import type { FieldErrors } from "../../lib/formErrors";
import type { FrontsForm } from "../../lib/frontsForm";
import { FRONTS_POLICY_CHOICES } from "../../lib/frontsEditor";
import type { PolicyChoice } from "../../lib/editorForm";
import { CurrencyField } from "../ContestFields";
import { SelectField, TextField } from "../Field";
import { FrontRivalsTable } from "./FrontRivalsTable";
import { FrontsTable } from "./FrontsTable";

type Setter<T> = (update: (f: T) => T) => void;

/**
 * The session editor's "several fronts" fields: title and currency (the editor's own), the
 * fronts explorer's two tables with each problem at its cell, and who plays each rival.
 */
export function FrontsEditorFields({
  form,
  setForm,
  fronts,
  setFronts,
  errors,
}: {
  form: EditorForm;
  setForm: Setter<EditorForm>;
  fronts: FrontsForm;
  setFronts: Setter<FrontsForm>;
  errors: FieldErrors;
}) {
  const bind = <K extends keyof EditorForm>(key: K) => bindField(form, setForm, key);
  const withCurrency = { ...fronts, currency: form.currency };
  const setPolicy = (i: number, p: PolicyChoice) =>
    setFronts((f) => ({
      ...f,
      rivals: f.rivals.map((r, j) => {
        if (j !== i) return r;
        const { policy: _old, ...rest } = r;
        return p === "human" ? rest : { ...rest, policy: p };
      }),
    }));
  return (
    <>
      <fieldset>
        <legend>Session</legend>
        <div className="grid-3">
          <TextField label="Title" {...bind("title")} error={errors.title} testId="field-title" />
          <CurrencyField form={form} setForm={setForm} errors={errors} />
        </div>
      </fieldset>
      <FrontsTable form={withCurrency} setForm={setFronts} errors={errors} />
      {errors.fronts && (
        <p className="field-error" role="alert" data-testid="fronts-count-error">
          {errors.fronts}
        </p>
      )}
      <FrontRivalsTable
        form={withCurrency}
        setForm={setFronts}
        errors={errors}
        extra={{
          header: "Played by",
          cell: (r, i) => (
            <td>
              <SelectField
                compact
                label={`Rival ${i + 1} played by`}
                value={r.policy ?? "human"}
                options={FRONTS_POLICY_CHOICES}
                onChange={(v) => setPolicy(i, v)}
                error={computerError(errors, r.name)}
                testId={`frival-${i}-policy`}
              />
            </td>
          ),
        }}
      />
      {errors.rivals && (
        <p className="field-error" role="alert" data-testid="fronts-rivals-error">
          {errors.rivals}
        </p>
      )}
    </>
  );
}
