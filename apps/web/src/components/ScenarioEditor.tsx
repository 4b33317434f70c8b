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
import { MadeSession } from "./CreatedSession";
import { ProvenanceNote } from "./ProvenanceNote";
import { SolvedEquilibrium } from "./EquilibriumTable";
import { ContestFields, RivalsTable } from "./ContestFields";
import { ImportExport } from "./ImportExport";
import { PrivateSettings, PrivateToggle } from "./PrivateFields";
import { privateRangesByPath } from "../lib/privateForm";
import { SessionFields } from "./SessionFields";
import { SaveToLibrary } from "./SaveToLibrary";
import { RadioGroup } from "./Field";
import { FrontsEditorFields } from "./fronts/FrontsEditorFields";
import type { EditorMode } from "../lib/frontsEditor";
import {
  frontsEditorRaw,
  frontsFromSingle,
  frontsSessionToForms,
  frontsToSession,
} from "../lib/frontsEditor";
import type { FrontsForm } from "../lib/frontsForm";
import { validateFrontsScenario } from "@contend/solver";
import { FrontsEditorPreview } from "./fronts/FrontsEditorPreview";
import { FRONTS_TEMPLATES } from "../lib/frontsTemplates";

const MODE_OPTIONS = [
  { value: "single", label: "One contest, one prize" },
  { value: "fronts", label: "Several fronts, one budget per rival" },
] as const;

/** The editor's starting state from the address: ?template= may name a fronts template. */
function initialFronts(id: string | null): { form: EditorForm; fronts: FrontsForm } | null {
  const t = FRONTS_TEMPLATES.find((x) => x.id === id);
  return t ? frontsSessionToForms(t.scenario, defaultForm()) : null;
}

export function ScenarioEditor() {
  const params = useSearchParams();
  const [start] = useState(() => initialFronts(params.get("template")));
  const [mode, setMode] = useState<EditorMode>(start ? "fronts" : "single");
  /** the fronts being edited; kept while the single contest is on show, so nothing is lost */
  const [fronts, setFronts] = useState<FrontsForm | null>(start?.fronts ?? null);
  const [form, setForm] = useState<EditorForm>(() => {
    if (start) return start.form;
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

  const single = useMemo(() => formToScenario(form), [form]);
  const frontsResult = useMemo(
    () => (mode === "fronts" && fronts ? frontsToSession(form, fronts) : null),
    [mode, form, fronts],
  );
  const result = frontsResult ?? single;
  const errors = useMemo(() => plainErrors(result.errors), [result.errors]);
  const deferredForm = useDeferredValue(form);
  const deferredFronts = useDeferredValue(fronts);
  /** the fronts as they stand, for the preview (even while a session setting needs fixing) */
  const previewFronts = useMemo(() => {
    if (mode !== "fronts" || deferredFronts === null) return null;
    const r = validateFrontsScenario(frontsEditorRaw(deferredForm, deferredFronts));
    return r.ok ? r.value : null;
  }, [mode, deferredForm, deferredFronts]);
  const preview = useMemo(() => {
    if (mode === "fronts") return null;
    const r = formToScenario(deferredForm);
    const contest = r.ok ? r.scenario : r.contest;
    return contest ? solveForView(contest) : null;
  }, [mode, deferredForm]);

  /** what this session is made from: the form, or for fronts the whole body sent */
  const from = frontsResult ? JSON.stringify(frontsResult.ok ? frontsResult.scenario : null) : form;
  async function submit(e: React.FormEvent) {
    e.preventDefault();
    setShowErrors(true);
    if (!result.ok || alreadyCreated) return;
    await create(result.scenario, from);
  }
  /** this very form has made its session; an edit allows another */
  const alreadyCreated = created !== null && created.from === from;
  function switchMode(next: EditorMode) {
    if (next === "fronts" && fronts === null) setFronts(frontsFromSingle(form));
    setMode(next);
  }
  const isFronts = mode === "fronts" && fronts !== null;

  const shown = (path: string) => (showErrors || path !== "scenario" ? errors[path] : undefined);
  const errorCount = Object.keys(errors).length;
  const currency = form.currency.trim() || null;

  const createRow = (
    <>
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
          {errorCount === 0 ? "Ready." : `${errorCount} field${errorCount > 1 ? "s" : ""} to fix.`}
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
    </>
  );

  return (
    <form onSubmit={submit} noValidate aria-labelledby="editor-title">
      <h1 id="editor-title">New session</h1>
      <p className="muted">
        Describe the contest, choose who plays each rival, and start. The equilibrium preview
        updates as you type.
      </p>
      <RadioGroup
        legend="What the rivals fight over"
        name="editor-mode"
        options={MODE_OPTIONS}
        value={mode}
        onChange={switchMode}
        testId="editor-mode"
      />
      <p className="small muted">
        {isFronts
          ? "Each front is its own contest with its own prize; every rival splits one budget (money) over all of them each round."
          : "Every rival spends on one prize each round."}
      </p>
      {/* the fronts tables grow with the fronts: full width, above the settings and preview */}
      {isFronts && (
        <FrontsEditorFields
          form={form}
          setForm={setForm}
          fronts={fronts}
          setFronts={(u) => setFronts((f) => (f === null ? f : u(f)))}
          errors={errors}
        />
      )}
      <div className="editor-grid">
        {isFronts ? (
          <div>
            <SessionFields form={form} setForm={setForm} shown={shown} fronts />
            <p className="small muted" data-testid="fronts-files-note">
              Scenario files and the scenario library hold single contests; to keep these fronts,
              open them in the fronts explorer and copy its link.
            </p>
            {createRow}
          </div>
        ) : (
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
                  <PrivateToggle
                    form={form}
                    setForm={setForm}
                    errors={errors}
                    index={i}
                    field={f}
                  />
                ) : null
              }
            />
            <PrivateSettings form={form} setForm={setForm} errors={errors} />

            <SessionFields form={form} setForm={setForm} shown={shown} />

            <ImportExport form={form} setForm={setForm} result={single} />
            <SaveToLibrary scenario={single.ok ? single.scenario : null} title={form.title} />

            {createRow}
          </div>
        )}

        <aside aria-labelledby="preview-title">
          <div className="card" style={{ position: "sticky", top: "0.5rem" }}>
            <h2 id="preview-title">Equilibrium preview</h2>
            {isFronts ? (
              <FrontsEditorPreview scenario={previewFronts} />
            ) : (
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
            )}
          </div>
        </aside>
      </div>
      {!isFronts && (
        <AboutTheMaths method={preview?.ok ? preview.result.equilibrium.method : null} />
      )}
      <MadeSession created={created} />
    </form>
  );
}
