"use client";

import type { ReactNode } from "react";
import type { EditorForm, FieldErrors, RivalRow } from "../lib/editorForm";
import { POLICY_LABELS } from "@contend/solver";
import { Term } from "./Glossary";
import {
  bindField,
  blankRival,
  keptPolicyFields,
  POLICY_ARGUMENT,
  POLICY_CHOICES,
  rivalFieldError,
} from "../lib/editorForm";
import { RadioGroup, SelectField, TextField } from "./Field";

const CSF_OPTIONS = [
  { value: "ratio", label: "Ratio (chance grows with spend)" },
  { value: "logit", label: "Logit (difference)" },
  { value: "allpay", label: "All-pay auction" },
] as const;

type Setter = (update: (f: EditorForm) => EditorForm) => void;

/** The currency every money figure is written in (the editor in both modes, the explorer). */
export function CurrencyField({
  form,
  setForm,
  errors,
}: {
  form: EditorForm;
  setForm: Setter;
  errors: FieldErrors;
}) {
  return (
    <TextField
      label="Currency"
      {...bindField(form, setForm, "currency")}
      error={errors.currency}
      testId="field-currency"
      hint="($, EUR…)"
    />
  );
}

/** Title, prize, currency and contest form: shared by the editor and the explorer. */
export function ContestFields({
  form,
  setForm,
  errors,
  extra,
}: {
  form: EditorForm;
  setForm: Setter;
  errors: FieldErrors;
  /** optional control under a number field, by its path ("prize"): the explorer's range toggle */
  extra?: (path: "prize") => ReactNode;
}) {
  const bind = <K extends keyof EditorForm>(key: K) => bindField(form, setForm, key);
  return (
    <fieldset>
      <legend>Contest</legend>
      <div className="grid-3">
        <TextField label="Title" {...bind("title")} error={errors.title} testId="field-title" />
        <div>
          <TextField
            label="Prize"
            numeric
            {...bind("prize")}
            error={errors.prize}
            testId="field-prize"
            hint="(value at stake)"
          />
          {extra?.("prize")}
        </div>
        <CurrencyField form={form} setForm={setForm} errors={errors} />
      </div>
      <div className="row" style={{ alignItems: "flex-start" }}>
        <RadioGroup
          legend="Contest form"
          name="csf-kind"
          options={CSF_OPTIONS}
          {...bind("csfKind")}
          testId="field-csf-kind"
        />
        {form.csfKind === "ratio" && (
          <TextField
            label="Decisiveness r"
            numeric
            {...bind("decisiveness")}
            error={errors["csf.decisiveness"]}
            testId="field-decisiveness"
            width="12rem"
          />
        )}
        {form.csfKind === "logit" && (
          <TextField
            label="Logit scale k"
            numeric
            {...bind("scale")}
            error={errors["csf.scale"]}
            testId="field-scale"
            width="12rem"
          />
        )}
      </div>
      <p className="small muted">
        Ratio: the more a rival spends, the likelier it wins, with <Term id="decisiveness" />{" "}
        setting how much. Logit: the same, but each extra unit counts the same however much was
        already spent. All-pay: the highest spender wins outright. Formulas and sources are under
        &quot;About the maths&quot;.
      </p>
    </fieldset>
  );
}

/** The rivals table with add/remove; `withPolicy` adds the "played by" column for sessions. */
export function RivalsTable({
  form,
  setForm,
  errors,
  withPolicy,
  minRows = 1,
  extra,
}: {
  form: EditorForm;
  setForm: Setter;
  errors: FieldErrors;
  withPolicy: boolean;
  minRows?: number;
  /** optional control under rival i's number field: the explorer's range toggle */
  extra?: (i: number, field: "cost" | "value" | "weight" | "budget") => ReactNode;
}) {
  const patchRival = (i: number, p: Partial<RivalRow>) =>
    setForm((f) => ({ ...f, rivals: f.rivals.map((r, k) => (k === i ? { ...r, ...p } : r)) }));
  const add = () => setForm((f) => ({ ...f, rivals: [...f.rivals, blankRival(f.rivals.length)] }));
  const remove = (i: number) =>
    setForm((f) => ({ ...f, rivals: f.rivals.filter((_, k) => k !== i) }));
  const ratio = form.csfKind === "ratio";
  return (
    <fieldset>
      <legend>Rivals</legend>
      <p className="small muted">
        Cost is what one unit of effort costs the rival. Leave value blank to use the prize, weight
        blank for 1, budget (the most the rival may spend, in money: cost x effort) blank for no cap
        {ratio ? ", own r blank for the form's r" : ""}.
      </p>
      <div className="table-wrap" tabIndex={0} role="region" aria-label="Rivals">
        <table className="editor-table" data-testid="rivals-table">
          <thead>
            <tr>
              <th scope="col">Name</th>
              <th scope="col">Cost</th>
              <th scope="col">Value</th>
              <th scope="col">
                <Term id="head-start">Weight</Term>
              </th>
              <th scope="col">Budget</th>
              {ratio && <th scope="col">Own r</th>}
              {withPolicy && <th scope="col">Played by</th>}
              <th scope="col">
                <span className="sr-only">Remove</span>
              </th>
            </tr>
          </thead>
          <tbody>
            {form.rivals.map((r, i) => (
              <tr key={r.key}>
                <td>
                  <TextField
                    compact
                    label={`Rival ${i + 1} name`}
                    value={r.name}
                    onChange={(v) => patchRival(i, { name: v })}
                    error={rivalFieldError(errors, form, i, "name")}
                    testId={`rival-${i}-name`}
                  />
                </td>
                {(["cost", "value", "weight", "budget"] as const).map((f) => (
                  <td key={f}>
                    <TextField
                      compact
                      numeric
                      label={`Rival ${i + 1} ${f}`}
                      value={r[f]}
                      onChange={(v) => patchRival(i, { [f]: v })}
                      error={rivalFieldError(errors, form, i, f)}
                      testId={`rival-${i}-${f}`}
                      placeholder={f === "cost" ? "" : f === "budget" ? "no cap" : "default"}
                    />
                    {extra?.(i, f)}
                  </td>
                ))}
                {ratio && (
                  <td>
                    <TextField
                      compact
                      numeric
                      label={`Rival ${i + 1} own decisiveness`}
                      value={r.decisiveness}
                      onChange={(v) => patchRival(i, { decisiveness: v })}
                      error={rivalFieldError(errors, form, i, "decisiveness")}
                      testId={`rival-${i}-decisiveness`}
                      placeholder="form's r"
                    />
                  </td>
                )}
                {withPolicy && (
                  <td>
                    <SelectField
                      compact
                      label={`Rival ${i + 1} played by`}
                      value={r.policy}
                      options={POLICY_CHOICES}
                      onChange={(v) => patchRival(i, { policy: v })}
                      error={rivalFieldError(errors, form, i, "policy")}
                      testId={`rival-${i}-policy`}
                    />
                    {r.policy !== "human" && (
                      <p className="small muted" data-testid={`rival-${i}-policy-about`}>
                        {POLICY_LABELS[r.policy].description}
                      </p>
                    )}
                    {r.policy !== "human" && POLICY_ARGUMENT[r.policy] && (
                      <TextField
                        compact
                        numeric
                        label={`Rival ${i + 1} ${POLICY_ARGUMENT[r.policy]?.label ?? ""}`}
                        value={r.policyArg}
                        onChange={(v) => patchRival(i, { policyArg: v })}
                        error={rivalFieldError(errors, form, i, "policyArg")}
                        placeholder={POLICY_ARGUMENT[r.policy]?.placeholder}
                        testId={`rival-${i}-policy-arg`}
                      />
                    )}
                    {keptPolicyFields(r).length > 0 && (
                      <p className="muted" data-testid={`rival-${i}-policy-kept`}>
                        Also from the imported file:{" "}
                        {keptPolicyFields(r)
                          .map(([k, v]) => `${k} ${JSON.stringify(v)}`)
                          .join(", ")}
                      </p>
                    )}
                  </td>
                )}
                <td>
                  <button
                    type="button"
                    className="small"
                    onClick={() => remove(i)}
                    aria-label={`Remove rival ${i + 1}`}
                    disabled={form.rivals.length <= minRows}
                    data-testid={`remove-rival-${i}`}
                  >
                    Remove
                  </button>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <div className="row" style={{ marginTop: "0.5rem" }}>
        <button type="button" onClick={add} data-testid="add-rival">
          Add rival
        </button>
        <span className="field-error" role={errors.rivals ? "alert" : undefined}>
          {errors.rivals ?? ""}
        </span>
      </div>
    </fieldset>
  );
}
