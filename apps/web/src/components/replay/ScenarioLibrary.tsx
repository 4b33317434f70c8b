"use client";

import { useRouter } from "next/navigation";
import { useCallback, useEffect, useState } from "react";
import type { SavedScenario } from "@contend/protocol";
import { useCreateSession } from "../../hooks/useCreateSession";
import { formatDateTime } from "../../lib/format";
import { forgetScenarioKey, scenarioKeys } from "../../lib/keyring";
import { handOver } from "../../lib/libraryHandoff";
import {
  deleteScenario,
  getVersion,
  listAllScenarios,
  listMyScenarios,
} from "../../lib/libraryApi";
import type { SessionScenarioInput } from "../../lib/sessionTypes";
import { MadeSession } from "../CreatedSession";
import { ConfirmDelete } from "./ConfirmDelete";
import { ScenarioName } from "./ScenarioName";

interface Held {
  saved: SavedScenario;
  key: string;
}

function operatorFromFragment(): string {
  if (typeof window === "undefined") return "";
  return new URLSearchParams(window.location.hash.slice(1)).get("operator") ?? "";
}

/**
 * Saved scenarios with their versions: start a new session from any version (last quarter's
 * drill with this quarter's numbers), or open a version in the editor to change it and save
 * the next one. Lists what this browser saved (it holds their library keys), or everything
 * with the operator key in the fragment.
 */
export function ScenarioLibrary() {
  const router = useRouter();
  const [items, setItems] = useState<Held[] | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [confirming, setConfirming] = useState<string | null>(null);
  const [startedFrom, setStartedFrom] = useState<string | null>(null);
  const { create, busy, created, error: createError } = useCreateSession();

  const load = useCallback(async () => {
    setError(null);
    const operator = operatorFromFragment();
    const held = scenarioKeys();
    if (!operator && held.length === 0) return setItems([]);
    const r = operator ? await listAllScenarios(operator) : await listMyScenarios(held);
    if (!r.ok) return setError(r.message);
    const keys = new Map(held.map((h) => [h.id, h.key]));
    setItems(r.data.map((saved) => ({ saved, key: operator || (keys.get(saved.id) ?? "") })));
  }, []);

  useEffect(() => {
    void load();
    const again = () => void load();
    window.addEventListener("hashchange", again);
    return () => window.removeEventListener("hashchange", again);
  }, [load]);

  async function fetchVersion(h: Held, version: number) {
    const r = await getVersion(h.saved.id, h.key, version);
    if (!r.ok) setError(`Version ${version} could not be read: ${r.message}`);
    return r.ok ? r.data : null;
  }

  async function start(h: Held, version: number) {
    const v = await fetchVersion(h, version);
    if (!v) return;
    if (await create(v.scenario as SessionScenarioInput, { id: h.saved.id, version })) {
      setStartedFrom(
        `Started from “${h.saved.name}”, version ${version}${v.note ? ` (${v.note})` : ""}.`,
      );
    }
  }

  async function edit(h: Held, version: number) {
    const v = await fetchVersion(h, version);
    if (!v) return;
    handOver({ id: h.saved.id, name: h.saved.name, version }, v.scenario);
    router.push("/new?from=library");
  }

  async function remove(h: Held) {
    const r = await deleteScenario(h.saved.id, h.key);
    if (!r.ok) return setError(`Not deleted: ${r.message}`);
    forgetScenarioKey(h.saved.id);
    setConfirming(null);
    setItems((old) => old && old.filter((x) => x.saved.id !== h.saved.id));
  }

  return (
    <div>
      <h1>Saved scenarios</h1>
      <p className="muted">
        Rerun a drill: start a new session from any saved version, or open a version in the editor,
        change the numbers and save them as the next version. Rename an entry as its role changes
        (“Kiosk lease, base case”); its versions stay. Save a scenario from the{" "}
        <a href="/new">New session</a> page. Saved scenarios may hold private numbers: they open
        only from the browser that saved them, or with the operator key.
      </p>
      {error && (
        <p className="notice error" data-testid="scenarios-error">
          {error}
        </p>
      )}
      {createError && <p className="notice error">{createError}</p>}
      {items === null && !error && <p className="muted">Loading…</p>}
      {items !== null && items.length === 0 && (
        <p data-testid="scenarios-empty">
          No saved scenarios in this browser yet. Use “Save to library” on the New session page.
        </p>
      )}
      {items?.map((h) => (
        <section className="card" key={h.saved.id} data-testid={`scenario-${h.saved.id}`}>
          <div className="row" style={{ justifyContent: "space-between" }}>
            <ScenarioName
              saved={h.saved}
              accessKey={h.key}
              onRenamed={(saved) =>
                setItems(
                  (old) => old && old.map((x) => (x.saved.id === saved.id ? { ...x, saved } : x)),
                )
              }
            />
            <ConfirmDelete
              confirming={confirming === h.saved.id}
              question="Delete every version for good?"
              onAsk={() => setConfirming(h.saved.id)}
              onDelete={() => void remove(h)}
              onKeep={() => setConfirming(null)}
              testIds={{
                ask: `scenario-delete-${h.saved.id}`,
                confirm: `scenario-delete-confirm-${h.saved.id}`,
              }}
            />
          </div>
          <ul className="version-list">
            {h.saved.versions.map((v) => (
              <li key={v.version} data-testid={`scenario-version-${h.saved.id}-${v.version}`}>
                <span>
                  <strong>Version {v.version}</strong>
                  {v.note && <> · {v.note}</>}
                  <span className="small muted"> · saved {formatDateTime(v.createdAt)}</span>
                </span>
                <span className="row">
                  <button
                    type="button"
                    className="small primary"
                    disabled={busy}
                    onClick={() => void start(h, v.version)}
                    data-testid={`scenario-start-${h.saved.id}-${v.version}`}
                  >
                    Start a session from version {v.version}
                  </button>
                  <button
                    type="button"
                    className="small"
                    onClick={() => void edit(h, v.version)}
                    data-testid={`scenario-edit-${h.saved.id}-${v.version}`}
                  >
                    Open in editor
                  </button>
                </span>
              </li>
            ))}
          </ul>
        </section>
      ))}
      {created && startedFrom && (
        <p className="notice ok" role="status" data-testid="scenario-started-from">
          {startedFrom}
        </p>
      )}
      <MadeSession created={created} />
    </div>
  );
}
