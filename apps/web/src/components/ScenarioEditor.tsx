"use client";

import { useDeferredValue, useMemo, useRef, useState } from "react";
import { useSearchParams } from "next/navigation";
import { downloadFileName } from "@contend/protocol";
import {
  bindField,
  defaultForm,
  formToContestRaw,
  formToScenario,
  parseScenarioText,
  parseScenarioValue,
  scenarioToForm,
} from "../lib/editorForm";
import type { EditorForm } from "../lib/editorForm";
import { plainErrors } from "../lib/plainErrors";
import { templateById } from "../lib/templates";
import { solveForView } from "../lib/solveView";
import { decodeState, encodeState } from "../lib/urlState";
import { useCreateSession } from "../hooks/useCreateSession";
import { AboutTheMaths } from "./AboutTheMaths";
import { CreatedSession } from "./CreatedSession";
import { ProvenanceNote } from "./ProvenanceNote";
import { SolvedEquilibrium } from "./EquilibriumTable";
import { ContestFields, RivalsTable } from "./ContestFields";
import { RadioGroup, SelectField, TextField } from "./Field";

const OUTCOME_OPTIONS = [
  { value: "shares", label: "Prize shared by winning chance" },
  { value: "winner", label: "One winner drawn" },
] as const;

const MISSING_OPTIONS = [
  { value: "zero", label: "Counts as spending nothing" },
  { value: "repeat", label: "Repeats the seat's previous spend" },
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

export function ScenarioEditor() {
  const params = useSearchParams();
  const [form, setForm] = useState<EditorForm>(() => {
    // A scenario handed over in the address (?s=, as the Calibrate page links), then a template.
    const handed = decodeState(params.get("s"));
    if (handed !== null && typeof handed === "object" && "sc" in handed) {
      const r = parseScenarioValue((handed as { sc: unknown }).sc);
      if (r.ok) return r.form;
    }
    const t = templateById(params.get("template") ?? "");
    return t ? scenarioToForm(t.scenario) : defaultForm();
  });
  const [importText, setImportText] = useState("");
  const [importMsg, setImportMsg] = useState<{
    ok: boolean;
    text: string;
    problems?: string[];
  } | null>(null);
  const { create, busy: submitting, created, error: serverError } = useCreateSession();
  const [showErrors, setShowErrors] = useState(false);
  const fileRef = useRef<HTMLInputElement>(null);

  const result = useMemo(() => formToScenario(form), [form]);
  const errors = useMemo(() => plainErrors(result.errors), [result.errors]);
  const deferredForm = useDeferredValue(form);
  const preview = useMemo(() => {
    const r = formToScenario(deferredForm);
    const contest = r.ok ? r.scenario : r.contest;
    return contest ? solveForView(contest) : null;
  }, [deferredForm]);

  const bind = <K extends keyof EditorForm>(key: K) => bindField(form, setForm, key);

  function importJson(text: string) {
    const r = parseScenarioText(text);
    if (r.ok) {
      setForm(r.form);
      setImportMsg({ ok: true, text: "Scenario imported." });
    } else {
      setImportMsg({ ok: false, text: "Nothing was imported.", problems: r.problems });
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
    if (!result.ok || alreadyCreated) return;
    await create(result.scenario, form);
  }
  /** this very form has made its session; an edit allows another */
  const alreadyCreated = created !== null && created.from === form;

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
      <div className="editor-grid">
        <div>
          {form.provenance && (
            <ProvenanceNote
              provenance={form.provenance}
              currency={currency}
              testId="editor-provenance"
            />
          )}
          {form.hidden && (
            <p className="notice small" data-testid="editor-hidden">
              Private numbers (from the loaded file):{" "}
              {Object.entries(form.hidden.rivals)
                .map(([name, f]) => `${name} ${Object.keys(f).join(" and ")}`)
                .join("; ")}
              . Each seat sees its own numbers and only the ranges of the others until the session
              ends; the truth is{" "}
              {form.hidden.truth === "draw"
                ? "drawn from the ranges when the session starts"
                : "the numbers in the table"}
              .{" "}
              <button type="button" onClick={() => setForm((f) => ({ ...f, hidden: null }))}>
                Make every number public
              </button>
            </p>
          )}
          <ContestFields form={form} setForm={setForm} errors={errors} />
          <RivalsTable form={form} setForm={setForm} errors={errors} withPolicy />

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
                    downloadFileName(form.title || "scenario", "session.json"),
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
                    downloadFileName(form.title || "scenario", "json"),
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
            {importMsg?.problems && importMsg.problems.length > 0 && (
              <ul className="field-error small" data-testid="import-problems">
                {importMsg.problems.map((p) => (
                  <li key={p}>{p}</li>
                ))}
              </ul>
            )}
          </fieldset>

          <div className="row">
            <button
              type="submit"
              className="primary"
              disabled={submitting || alreadyCreated}
              aria-describedby={alreadyCreated ? "created-title" : undefined}
              data-testid="create-session"
            >
              {submitting
                ? "Creating…"
                : alreadyCreated
                  ? "Session created"
                  : created
                    ? "Create another session"
                    : "Create session"}
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
            <SolvedEquilibrium
              solved={preview}
              currency={currency}
              testPrefix="preview"
              more={(ok) => (
                <>
                  {ok.result.alternatives.length > 0 && (
                    <p className="small muted">
                      {ok.result.alternatives.length} further equilibri
                      {ok.result.alternatives.length > 1 ? "a" : "um"} found; see the explorer.
                    </p>
                  )}
                  <a
                    className="small"
                    href={`/explore?s=${encodeState({ sc: formToContestRaw(form) })}`}
                  >
                    Open this scenario in the explorer
                  </a>
                </>
              )}
            />
          </div>
        </aside>
      </div>
      <AboutTheMaths method={preview?.ok ? preview.result.equilibrium.method : null} />
      {created && (
        <CreatedSession
          key={created.res.id}
          created={created.res}
          title={created.title}
          computer={created.computer}
        />
      )}
    </form>
  );
}
