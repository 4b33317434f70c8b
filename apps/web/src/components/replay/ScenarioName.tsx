"use client";

import { useEffect, useId, useRef, useState } from "react";
import type { SavedScenario } from "@contend/protocol";
import { parseInput, renameScenarioBodySchema } from "@contend/protocol";
import { renameScenario } from "../../lib/libraryApi";

/**
 * A saved scenario's name with an inline rename (Save / Cancel, Escape cancels). The name is
 * checked with the protocol's rule for saved-scenario names before it is sent, and the rule's
 * message (or the server's) is shown at the field. The change goes through the server with the
 * key the entry was listed with (its library key, or the operator key).
 */
export function ScenarioName({
  saved,
  accessKey,
  onRenamed,
}: {
  saved: SavedScenario;
  accessKey: string;
  onRenamed: (saved: SavedScenario) => void;
}) {
  const [editing, setEditing] = useState(false);
  const [name, setName] = useState(saved.name);
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const renameButton = useRef<HTMLButtonElement>(null);
  const refocus = useRef(false);
  const id = useId();
  const tid = (what: string) => `scenario-${what}-${saved.id}`;

  useEffect(() => {
    if (!editing && refocus.current) {
      refocus.current = false;
      renameButton.current?.focus();
    }
  }, [editing]);

  function close() {
    setName(saved.name);
    setError(null);
    refocus.current = true;
    setEditing(false);
  }

  async function submit() {
    const parsed = parseInput(renameScenarioBodySchema, { name });
    if (!parsed.ok) return setError(parsed.message);
    if (parsed.value.name === saved.name) return close();
    setBusy(true);
    setError(null);
    const r = await renameScenario(saved.id, accessKey, parsed.value.name);
    setBusy(false);
    if (!r.ok) return setError(r.path === "name" ? r.message : `Not renamed: ${r.message}`);
    onRenamed(r.data);
    refocus.current = true;
    setEditing(false);
  }

  if (!editing) {
    return (
      <span className="row scenario-name">
        <h2 style={{ margin: 0 }} data-testid={tid("name")}>
          {saved.name}
        </h2>
        <button
          ref={renameButton}
          type="button"
          className="link-button small"
          aria-label={`Rename ${saved.name}`}
          onClick={() => {
            setName(saved.name);
            setEditing(true);
          }}
          data-testid={tid("rename")}
        >
          Rename
        </button>
      </span>
    );
  }

  return (
    <form
      className="inline-edit scenario-rename"
      aria-label={`Rename ${saved.name}`}
      onSubmit={(e) => {
        e.preventDefault();
        void submit();
      }}
      onKeyDown={(e) => {
        if (e.key === "Escape") {
          e.preventDefault();
          close();
        }
      }}
    >
      <label htmlFor={id}>New name</label>
      <input
        id={id}
        type="text"
        value={name}
        autoComplete="off"
        onChange={(e) => {
          setName(e.target.value);
          setError(null);
        }}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${id}-err` : undefined}
        data-testid={tid("name-input")}
        autoFocus
      />
      <button
        type="submit"
        className="small primary"
        disabled={busy}
        data-testid={tid("rename-save")}
      >
        Save
      </button>
      <button type="button" className="small" onClick={close} data-testid={tid("rename-cancel")}>
        Cancel
      </button>
      <span
        className="field-error"
        id={`${id}-err`}
        role={error ? "alert" : undefined}
        data-testid={tid("name-error")}
      >
        {error ?? ""}
      </span>
    </form>
  );
}
