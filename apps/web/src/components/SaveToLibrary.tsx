"use client";

import Link from "next/link";
import { useEffect, useState } from "react";
import type { SavedScenario } from "@contend/protocol";
import { rememberScenarioKey, scenarioKeys } from "../lib/keyring";
import { handedOrigin } from "../lib/libraryHandoff";
import { listMyScenarios, saveScenario, saveVersion } from "../lib/libraryApi";
import type { SessionScenarioInput } from "../lib/sessionTypes";
import { FilterField } from "./Field";

const NEW = "";

/**
 * Saves the editor's scenario in the library: as a new saved scenario (the server answers a
 * library key, kept in this browser) or as the next version of one this browser saved, so a
 * planner reruns last quarter's drill with this quarter's numbers.
 */
export function SaveToLibrary({
  scenario,
  title,
}: {
  /** null while the form has errors */
  scenario: SessionScenarioInput | null;
  title: string;
}) {
  const [mine, setMine] = useState<SavedScenario[]>([]);
  const [target, setTarget] = useState(NEW);
  const [name, setName] = useState("");
  const [note, setNote] = useState("");
  const [busy, setBusy] = useState(false);
  const [outcome, setOutcome] = useState<{ ok: boolean; text: string } | null>(null);

  useEffect(() => {
    const held = scenarioKeys();
    const origin = handedOrigin();
    if (held.length === 0) return;
    void listMyScenarios(held).then((r) => {
      if (!r.ok) return;
      setMine(r.data);
      if (origin && r.data.some((s) => s.id === origin.id)) setTarget(origin.id);
    });
  }, []);

  async function save() {
    if (!scenario) return;
    setBusy(true);
    setOutcome(null);
    const key = scenarioKeys().find((k) => k.id === target)?.key;
    if (target !== NEW && key) {
      const r = await saveVersion(target, key, note, scenario);
      const saved = mine.find((s) => s.id === target);
      if (r.ok) {
        // the next save offers the version after this one
        const entry = { version: r.data.version, note, createdAt: new Date().toISOString() };
        setMine((old) =>
          old.map((s) => (s.id === target ? { ...s, versions: [entry, ...s.versions] } : s)),
        );
      }
      setOutcome(
        r.ok
          ? { ok: true, text: `Saved as version ${r.data.version} of “${saved?.name ?? ""}”.` }
          : { ok: false, text: `Not saved: ${r.path ? `${r.path}: ` : ""}${r.message}` },
      );
    } else {
      const chosen = name.trim() || title.trim();
      const r = await saveScenario(chosen, note, scenario);
      if (r.ok) {
        rememberScenarioKey(r.data.id, r.data.key);
        const now = new Date().toISOString();
        const entry = { version: 1, note, createdAt: now };
        setMine((old) => [
          { id: r.data.id, name: chosen, createdAt: now, versions: [entry] },
          ...old,
        ]);
        setTarget(r.data.id);
        setOutcome({ ok: true, text: `Saved as “${chosen}”, version 1.` });
      } else {
        setOutcome({ ok: false, text: `Not saved: ${r.path ? `${r.path}: ` : ""}${r.message}` });
      }
    }
    setBusy(false);
  }

  return (
    <fieldset className="card save-library" data-testid="save-library">
      <legend>Scenario library</legend>
      <p className="small muted">
        Keep this scenario to rerun it later; save this quarter&apos;s numbers as a new version.
        Saved scenarios open only from this browser (or with the operator key).
      </p>
      <div className="row">
        <FilterField label="Save as">
          <select
            value={target}
            onChange={(e) => setTarget(e.target.value)}
            data-testid="save-library-target"
          >
            <option value={NEW}>a new saved scenario</option>
            {mine.map((s) => (
              <option key={s.id} value={s.id}>
                version {(s.versions[0]?.version ?? 0) + 1} of “{s.name}”
              </option>
            ))}
          </select>
        </FilterField>
        {target === NEW && (
          <FilterField label="Name" grow>
            <input
              type="text"
              value={name}
              placeholder={title || "Scenario name"}
              maxLength={80}
              onChange={(e) => setName(e.target.value)}
              data-testid="save-library-name"
            />
          </FilterField>
        )}
        <FilterField label="Note (optional)" grow>
          <input
            type="text"
            value={note}
            placeholder="e.g. Q3 numbers"
            maxLength={140}
            onChange={(e) => setNote(e.target.value)}
            data-testid="save-library-note"
          />
        </FilterField>
        <button
          type="button"
          disabled={busy || !scenario}
          onClick={() => void save()}
          data-testid="save-library-button"
        >
          {busy ? "Saving…" : "Save to library"}
        </button>
      </div>
      {!scenario && <p className="small muted">Fix the fields marked above to save.</p>}
      <div aria-live="polite">
        {outcome && (
          <p className={`notice ${outcome.ok ? "ok" : "error"}`} data-testid="save-library-outcome">
            {outcome.text} {outcome.ok && <Link href="/scenarios">Open the scenario library</Link>}
          </p>
        )}
      </div>
    </fieldset>
  );
}
