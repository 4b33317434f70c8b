"use client";

import { useRef, useState } from "react";
import { downloadFileName } from "@contend/protocol";
import { formToContestRaw } from "../lib/editorForm";
import type { EditorForm, FormResult } from "../lib/editorForm";
import { parseScenarioText } from "../lib/editorImport";

function download(filename: string, text: string) {
  const blob = new Blob([text], { type: "application/json" });
  const url = URL.createObjectURL(blob);
  const a = document.createElement("a");
  a.href = url;
  a.download = filename;
  a.click();
  URL.revokeObjectURL(url);
}

/** The editor's import (file or pasted JSON, every problem listed) and its two downloads. */
export function ImportExport({
  form,
  setForm,
  result,
}: {
  form: EditorForm;
  setForm: (f: EditorForm) => void;
  result: FormResult;
}) {
  const [importText, setImportText] = useState("");
  const [importMsg, setImportMsg] = useState<{
    ok: boolean;
    text: string;
    problems?: string[];
  } | null>(null);
  const fileRef = useRef<HTMLInputElement>(null);

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

  return (
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
              JSON.stringify(result.ok ? result.scenario : { ...formToContestRaw(form) }, null, 2),
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
        <button type="button" onClick={() => importJson(importText)} data-testid="import-apply">
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
  );
}
