"use client";

import { useDeferredValue, useMemo, useRef, useState } from "react";
import { useSearchParams } from "next/navigation";
import type { CreateSessionResponse } from "@contend/protocol";
import { createSession } from "../lib/api";
import {
  blankRival,
  defaultForm,
  formToContestRaw,
  formToScenario,
  parseScenarioText,
  POLICY_CHOICES,
  rivalFieldError,
  scenarioToForm,
} from "../lib/editor-form";
import type { EditorForm, RivalRow } from "../lib/editor-form";
import { templateById } from "../lib/templates";
import { solveForView } from "../lib/solve-view";
import { encodeState } from "../lib/url-state";
import { CreatedSession } from "./CreatedSession";
import { EquilibriumTable } from "./EquilibriumTable";
import { RadioGroup, SelectField, TextField } from "./Field";

const CSF_OPTIONS = [
  { value: "ratio", label: "Ratio (Tullock)" },
  { value: "logit", label: "Logit (difference)" },
  { value: "allpay", label: "All-pay auction" },
] as const;

const OUTCOME_OPTIONS = [
  { value: "shares", label: "Prize shared by winning chance" },
  { value: "winner", label: "One winner drawn" },
] as const;

const MISSING_OPTIONS = [
  { value: "zero", label: "Counts as zero effort" },
  { value: "repeat", label: "Repeats the seat's previous effort" },
] as const;

function download(filename: string, text: string) {
  const blob = new Blob([text], { type: "application/json" });
  const url = URL.createObjectURL(blob);
  const a = document.createElement("a");
  a.href = url;
  a.download = filename;
  a.click();
  URL.revokeObjectURL(url);
}

function slug(title: string): string {
  return (
    title
      .toLowerCase()
      .replace(/[^a-z0-9]+/g, "-")
      .replace(/^-|-$/g, "")
      .slice(0, 60) || "scenario"
  );
}

export function ScenarioEditor() {
  const params = useSearchParams();
  const [form, setForm] = useState<EditorForm>(() => {
    const t = templateById(params.get("template") ?? "");
    return t ? scenarioToForm(t.scenario) : defaultForm();
  });
  const [importText, setImportText] = useState("");
  const [importMsg, setImportMsg] = useState<{ ok: boolean; text: string } | null>(null);
  const [submitting, setSubmitting] = useState(false);
  const [serverError, setServerError] = useState<string | null>(null);
  const [created, setCreated] = useState<{ res: CreateSessionResponse; title: string } | null>(
    null,
  );
  const [showErrors, setShowErrors] = useState(false);
  const fileRef = useRef<HTMLInputElement>(null);

  const result = useMemo(() => formToScenario(form), [form]);
  const errors = result.errors;
  const deferredForm = useDeferredValue(form);
  const preview = useMemo(() => {
    const r = formToScenario(deferredForm);
    const contest = r.ok ? r.scenario : r.contest;
    return contest ? solveForView(contest) : null;
  }, [deferredForm]);

  function patch(p: Partial<EditorForm>) {
    setForm((f) => ({ ...f, ...p }));
  }
  function patchRival(i: number, p: Partial<RivalRow>) {
    setForm((f) => ({ ...f, rivals: f.rivals.map((r, k) => (k === i ? { ...r, ...p } : r)) }));
  }
  function addRival() {
    setForm((f) => ({ ...f, rivals: [...f.rivals, blankRival(f.rivals.length)] }));
  }
  function removeRival(i: number) {
    setForm((f) => ({ ...f, rivals: f.rivals.filter((_, k) => k !== i) }));
  }

  function importJson(text: string) {
    const r = parseScenarioText(text);
    if (r.ok) {
      setForm(r.form);
      setImportMsg({ ok: true, text: "Scenario imported." });
    } else {
      setImportMsg({ ok: false, text: `Import failed: ${r.message}` });
    }
  }

  async function onFile(e: React.ChangeEvent<HTMLInputElement>) {
    const file = e.target.files?.[0];
    if (!file) return;
    importJson(await file.text());
    e.target.value = "";
  }

  async function submit(e: React.FormEvent) {
    e.preventDefault();
    setShowErrors(true);
    setServerError(null);
    if (!result.ok) return;
    setSubmitting(true);
    const r = await createSession(result.scenario);
    setSubmitting(false);
    if (r.ok) setCreated({ res: r.data, title: result.scenario.title });
    else setServerError(`${r.path ? `${r.path}: ` : ""}${r.message}`);
  }

  const shown = (path: string) => (showErrors || path !== "scenario" ? errors[path] : undefined);
  const errorCount = Object.keys(errors).length;
  const currency = form.currency.trim() || null;

  return (
    <form onSubmit={submit} noValidate aria-labelledby="editor-title">
      <h1 id="editor-title">New session</h1>
      <p className="muted">
        Describe the contest, choose who plays each rival, and start. The equilibrium preview
        updates as you type.
      </p>
      <div className="grid-2" style={{ gridTemplateColumns: "minmax(0, 3fr) minmax(300px, 2fr)" }}>
        <div>
          <fieldset>
            <legend>Contest</legend>
            <div className="grid-3">
              <TextField
                label="Title"
                value={form.title}
                onChange={(v) => patch({ title: v })}
                error={shown("title")}
                testId="field-title"
              />
              <TextField
                label="Prize"
                numeric
                value={form.prize}
                onChange={(v) => patch({ prize: v })}
                error={shown("prize")}
                testId="field-prize"
                hint="(value at stake)"
              />
              <TextField
                label="Currency"
                value={form.currency}
                onChange={(v) => patch({ currency: v })}
                error={shown("currency")}
                testId="field-currency"
                hint="($, EUR…)"
              />
            </div>
            <div className="row" style={{ alignItems: "flex-start" }}>
              <RadioGroup
                legend="Contest form"
                name="csf-kind"
                value={form.csfKind}
                options={CSF_OPTIONS}
                onChange={(v) => patch({ csfKind: v })}
                testId="field-csf-kind"
              />
              {form.csfKind === "ratio" && (
                <TextField
                  label="Decisiveness r"
                  numeric
                  value={form.decisiveness}
                  onChange={(v) => patch({ decisiveness: v })}
                  error={shown("csf.decisiveness")}
                  testId="field-decisiveness"
                  width="12rem"
                />
              )}
              {form.csfKind === "logit" && (
                <TextField
                  label="Logit scale k"
                  numeric
                  value={form.scale}
                  onChange={(v) => patch({ scale: v })}
                  error={shown("csf.scale")}
                  testId="field-scale"
                  width="12rem"
                />
              )}
            </div>
            <p className="small muted">
              Ratio: p = w·e^r / Σ w·e^r (Tullock 1980). Logit: p = w·exp(k·e) / Σ w·exp(k·e)
              (Hirshleifer 1989). All-pay: the highest effort wins, ties split.
            </p>
          </fieldset>

          <fieldset>
            <legend>Rivals</legend>
            <p className="small muted">
              Cost is what one unit of effort costs the rival. Leave value blank to use the prize,
              weight blank for 1, budget blank for no cap, own r blank for the form&apos;s r.
            </p>
            <div className="table-wrap">
              <table className="editor-table" data-testid="rivals-table">
                <thead>
                  <tr>
                    <th scope="col">Name</th>
                    <th scope="col">Cost</th>
                    <th scope="col">Value</th>
                    <th scope="col">Weight</th>
                    <th scope="col">Budget</th>
                    {form.csfKind === "ratio" && <th scope="col">Own r</th>}
                    <th scope="col">Played by</th>
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
                        </td>
                      ))}
                      {form.csfKind === "ratio" && (
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
                        {r.policy === "overspender" && (
                          <TextField
                            compact
                            numeric
                            label={`Rival ${i + 1} overspending factor`}
                            value={r.factor}
                            onChange={(v) => patchRival(i, { factor: v })}
                            placeholder="factor (default)"
                            testId={`rival-${i}-factor`}
                          />
                        )}
                      </td>
                      <td>
                        <button
                          type="button"
                          className="small"
                          onClick={() => removeRival(i)}
                          aria-label={`Remove rival ${i + 1}`}
                          disabled={form.rivals.length <= 1}
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
              <button type="button" onClick={addRival} data-testid="add-rival">
                Add rival
              </button>
              <span className="field-error" role={errors.rivals ? "alert" : undefined}>
                {errors.rivals ?? ""}
              </span>
            </div>
          </fieldset>

          <fieldset>
            <legend>Live session</legend>
            <div className="row" style={{ alignItems: "flex-start" }}>
              <RadioGroup
                legend="Outcome"
                name="outcome"
                value={form.outcome}
                options={OUTCOME_OPTIONS}
                onChange={(v) => patch({ outcome: v })}
                testId="field-outcome"
              />
            </div>
            <div className="grid-3">
              <TextField
                label="Effort step"
                numeric
                value={form.effortStep}
                onChange={(v) => patch({ effortStep: v })}
                error={shown("session.effortStep")}
                testId="field-effort-step"
                hint="(efforts are multiples)"
              />
              <TextField
                label="Rounds"
                numeric
                value={form.rounds}
                onChange={(v) => patch({ rounds: v })}
                error={shown("session.rounds")}
                testId="field-rounds"
              />
              <TextField
                label="Round clock (seconds)"
                numeric
                value={form.clockSeconds}
                onChange={(v) => patch({ clockSeconds: v })}
                error={shown("session.clockSeconds")}
                testId="field-clock"
                placeholder="no clock"
              />
              <SelectField
                label="Missing move"
                value={form.missingMove}
                options={MISSING_OPTIONS}
                onChange={(v) => patch({ missingMove: v })}
                testId="field-missing-move"
              />
            </div>
          </fieldset>

          <fieldset>
            <legend>Import and export</legend>
            <div className="row">
              <input
                ref={fileRef}
                type="file"
                accept="application/json,.json"
                onChange={onFile}
                aria-label="Import scenario file"
                data-testid="import-file"
              />
              <button
                type="button"
                onClick={() =>
                  download(
                    `${slug(form.title)}.session.json`,
                    JSON.stringify(
                      result.ok ? result.scenario : { ...formToContestRaw(form) },
                      null,
                      2,
                    ),
                  )
                }
                data-testid="export-session"
              >
                Download session JSON
              </button>
              <button
                type="button"
                onClick={() =>
                  download(
                    `${slug(form.title)}.json`,
                    JSON.stringify(formToContestRaw(form), null, 2),
                  )
                }
                data-testid="export-cli"
              >
                Download CLI scenario
              </button>
            </div>
            <div className="field" style={{ marginTop: "0.6rem" }}>
              <label htmlFor="import-text">Or paste scenario JSON</label>
              <textarea
                id="import-text"
                rows={4}
                value={importText}
                onChange={(e) => setImportText(e.target.value)}
                data-testid="import-text"
              />
            </div>
            <div className="row" style={{ marginTop: "0.4rem" }}>
              <button
                type="button"
                onClick={() => importJson(importText)}
                data-testid="import-apply"
              >
                Import pasted JSON
              </button>
              <span
                aria-live="polite"
                className={importMsg?.ok ? "small" : "small field-error"}
                data-testid="import-message"
              >
                {importMsg?.text ?? ""}
              </span>
            </div>
          </fieldset>

          <div className="row">
            <button
              type="submit"
              className="primary"
              disabled={submitting}
              data-testid="create-session"
            >
              {submitting ? "Creating…" : "Create session"}
            </button>
            <span className="small muted" data-testid="error-count" aria-live="polite">
              {errorCount === 0
                ? "Ready."
                : `${errorCount} field${errorCount > 1 ? "s" : ""} to fix.`}
            </span>
            {result.ok ? null : showErrors && errors.scenario ? (
              <span className="field-error">{errors.scenario}</span>
            ) : null}
          </div>
          <div aria-live="polite">
            {serverError && (
              <p className="notice error" data-testid="server-error">
                {serverError}
              </p>
            )}
          </div>
        </div>

        <aside aria-labelledby="preview-title">
          <div className="card" style={{ position: "sticky", top: "0.5rem" }}>
            <h2 id="preview-title">Equilibrium preview</h2>
            {preview === null ? (
              <p className="muted" data-testid="preview-empty">
                Fix the highlighted fields to see the equilibrium.
              </p>
            ) : preview.ok ? (
              <>
                <EquilibriumTable
                  contest={preview.contest}
                  equilibrium={preview.result.equilibrium}
                  currency={currency}
                  testPrefix="preview"
                />
                {preview.result.alternatives.length > 0 && (
                  <p className="small muted">
                    {preview.result.alternatives.length} further equilibri
                    {preview.result.alternatives.length > 1 ? "a" : "um"} found; see the explorer.
                  </p>
                )}
                <a
                  className="small"
                  href={`/explore?s=${encodeState({ sc: formToContestRaw(form) })}`}
                >
                  Open this scenario in the explorer
                </a>
              </>
            ) : (
              <p className="notice error">{preview.message}</p>
            )}
          </div>
        </aside>
      </div>
      {created && <CreatedSession created={created.res} title={created.title} />}
    </form>
  );
}
