"use client";

import { useDeferredValue, useMemo, useState } from "react";
import { useSearchParams } from "next/navigation";
import { defaultForm, formToContestRaw, formToScenario } from "../lib/editorForm";
import { parseScenarioValue, scenarioToForm } from "../lib/editorImport";
import type { EditorForm } from "../lib/editorForm";
import { plainErrors } from "../lib/plainErrors";
import { templateById } from "../lib/templates";
import { solveForView } from "../lib/solveView";
import { decodeState, encodeState } from "../lib/urlState";
import { handedScenario } from "../lib/libraryHandoff";
import { useCreateSession } from "../hooks/useCreateSession";
import { AboutTheMaths } from "./AboutTheMaths";
import { CreatedSession } from "./CreatedSession";
import { ProvenanceNote } from "./ProvenanceNote";
import { SolvedEquilibrium } from "./EquilibriumTable";
import { ContestFields, RivalsTable } from "./ContestFields";
import { ImportExport } from "./ImportExport";
import { PrivateSettings, PrivateToggle } from "./PrivateFields";
import { privateRangesByPath } from "../lib/privateForm";
import { SessionFields } from "./SessionFields";
import { SaveToLibrary } from "./SaveToLibrary";

export function ScenarioEditor() {
  const params = useSearchParams();
  const [form, setForm] = useState<EditorForm>(() => {
    // A saved version opened from the scenario library (kept in this tab, never in the URL).
    if (params.get("from") === "library") {
      const r = parseScenarioValue(handedScenario());
      if (r.ok) return r.form;
    }
    // A scenario handed over in the address (?s=, as the Calibrate page links), then a template.
    const handed = decodeState(params.get("s"));
    if (handed !== null && typeof handed === "object" && "sc" in handed) {
      const r = parseScenarioValue((handed as { sc: unknown }).sc);
      if (r.ok) return r.form;
    }
    const t = templateById(params.get("template") ?? "");
    return t ? scenarioToForm(t.scenario) : defaultForm();
  });
  const { create, busy: submitting, created, error: serverError } = useCreateSession();
  const [showErrors, setShowErrors] = useState(false);

  const result = useMemo(() => formToScenario(form), [form]);
  const errors = useMemo(() => plainErrors(result.errors), [result.errors]);
  const deferredForm = useDeferredValue(form);
  const preview = useMemo(() => {
    const r = formToScenario(deferredForm);
    const contest = r.ok ? r.scenario : r.contest;
    return contest ? solveForView(contest) : null;
  }, [deferredForm]);

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
          <ContestFields form={form} setForm={setForm} errors={errors} />
          <RivalsTable
            form={form}
            setForm={setForm}
            errors={errors}
            withPolicy
            extra={(i, f) =>
              f === "cost" || f === "value" ? (
                <PrivateToggle form={form} setForm={setForm} errors={errors} index={i} field={f} />
              ) : null
            }
          />
          <PrivateSettings form={form} setForm={setForm} errors={errors} />

          <SessionFields form={form} setForm={setForm} shown={shown} />

          <ImportExport form={form} setForm={setForm} result={result} />
          <SaveToLibrary scenario={result.ok ? result.scenario : null} title={form.title} />

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
                  {Object.values(form.privateRanges).some((r) => r.on) && (
                    <p className="small muted" data-testid="preview-private-note">
                      The preview uses the numbers in the table.
                      {form.truth === "draw"
                        ? " The session draws its private numbers from their ranges, so its equilibrium will differ."
                        : ""}
                    </p>
                  )}
                  <a
                    className="small"
                    href={`/explore?s=${encodeState({
                      sc: formToContestRaw(form),
                      rg: privateRangesByPath(form.rivals, form.privateRanges),
                    })}`}
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
