"use client";

import Link from "next/link";
import { useCallback, useEffect, useState } from "react";
import type { SessionListItem } from "@contend/protocol";
import { listSessions } from "../../lib/api";
import { formatDateTime } from "../../lib/format";
import { STATUS_TEXT } from "../../lib/live";
import { TextField } from "../Field";
import { FigureTable, numCol, textCol } from "../FigureTable";

export function ReplayList() {
  const [items, setItems] = useState<SessionListItem[] | null>(null);
  const [error, setError] = useState<{ status: number; message: string } | null>(null);
  const [key, setKey] = useState("");

  const load = useCallback(async (k: string) => {
    setError(null);
    const r = await listSessions(k || undefined);
    if (r.ok) setItems([...r.data].sort((a, b) => b.updatedAt.localeCompare(a.updatedAt)));
    else {
      setItems(null);
      setError({ status: r.status, message: r.message });
    }
  }, []);

  useEffect(() => {
    void load("");
  }, [load]);

  return (
    <div>
      <h1>Past sessions</h1>
      <p className="muted">
        Step through any session event by event, compare play with equilibrium, and print a debrief.
      </p>
      {error && (
        <div className="card">
          <p className="notice error" data-testid="replays-error">
            Could not load the list: {error.message}
          </p>
          {error.status === 401 && (
            <form
              className="row"
              style={{ alignItems: "flex-end" }}
              onSubmit={(e) => {
                e.preventDefault();
                void load(key.trim());
              }}
            >
              <TextField
                label="Admin key"
                value={key}
                onChange={setKey}
                testId="replays-admin-key"
              />
              <button type="submit" style={{ marginBottom: "1.3rem" }}>
                Load
              </button>
            </form>
          )}
        </div>
      )}
      {items === null && !error && <p className="muted">Loading…</p>}
      {items !== null && items.length === 0 && <p data-testid="replays-empty">No sessions yet.</p>}
      {items !== null && items.length > 0 && (
        <FigureTable
          head={[
            textCol("Session"),
            textCol("Status"),
            numCol("Rounds played"),
            textCol("Last activity"),
          ]}
          wrap="card table-wrap"
          testId="replays-table"
        >
          {items.map((s) => (
            <tr key={s.id}>
              <td>
                <Link
                  href={`/replays/${encodeURIComponent(s.id)}${key ? `?key=${encodeURIComponent(key)}` : ""}`}
                  data-testid={`replay-link-${s.id}`}
                >
                  {s.title}
                </Link>
              </td>
              <td>{STATUS_TEXT[s.status]}</td>
              <td className="num">{s.rounds}</td>
              <td>{formatDateTime(s.updatedAt)}</td>
            </tr>
          ))}
        </FigureTable>
      )}
    </div>
  );
}
