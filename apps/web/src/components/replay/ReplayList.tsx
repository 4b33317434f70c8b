"use client";

import Link from "next/link";
import { useCallback, useEffect, useState } from "react";
import type { SessionListItem } from "@contend/protocol";
import { keyedPath, listMySessions, listSessions } from "../../lib/api";
import { facilitatorKeys } from "../../lib/keyring";
import { formatDateTime } from "../../lib/format";
import { STATUS_TEXT } from "../../lib/live";
import { TextField } from "../Field";
import { FigureTable, numCol, textCol } from "../FigureTable";

interface Row {
  item: SessionListItem;
  /** the key its replay link carries (in the fragment) */
  key: string;
}

/** The operator key, when the page was opened with `#operator=<key>`. */
function operatorFromFragment(): string {
  if (typeof window === "undefined") return "";
  return new URLSearchParams(window.location.hash.slice(1)).get("operator") ?? "";
}

/**
 * Past sessions: those whose facilitator keys this browser holds (kept when a facilitator
 * console opened), or every session with the operator key. The server lists nothing else.
 */
export function ReplayList() {
  const [rows, setRows] = useState<Row[] | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [operatorKey, setOperatorKey] = useState("");
  const [asOperator, setAsOperator] = useState(false);

  const loadMine = useCallback(async () => {
    setError(null);
    const held = facilitatorKeys();
    if (held.length === 0) return setRows([]);
    const r = await listMySessions(held);
    if (!r.ok) return setError(r.message);
    const keys = new Map(held.map((h) => [h.id, h.key]));
    setRows(r.data.map((item) => ({ item, key: keys.get(item.id) ?? "" })));
  }, []);

  const loadAll = useCallback(async (key: string) => {
    setError(null);
    const r = await listSessions(key);
    if (!r.ok) return setError(r.message);
    setAsOperator(true);
    setRows(r.data.map((item) => ({ item, key })));
  }, []);

  useEffect(() => {
    const fromFragment = operatorFromFragment();
    if (fromFragment) {
      setOperatorKey(fromFragment);
      void loadAll(fromFragment);
    } else void loadMine();
  }, [loadAll, loadMine]);

  const sorted = rows && [...rows].sort((a, b) => b.item.updatedAt.localeCompare(a.item.updatedAt));

  return (
    <div>
      <h1>Past sessions</h1>
      <p className="muted">
        Step through a session event by event, compare play with equilibrium, and print a debrief.
        {asOperator
          ? " Listed with the operator key: every session on this server."
          : " Listed: the sessions this browser has facilitated. Nobody else can list them."}
      </p>
      <p className="no-print">
        <Link
          href={`/replays/compare${asOperator ? `#operator=${encodeURIComponent(operatorKey)}` : ""}`}
          data-testid="replays-compare-link"
        >
          Compare sessions side by side
        </Link>
      </p>
      {error && (
        <p className="notice error" data-testid="replays-error">
          Could not load the list: {error}
        </p>
      )}
      {sorted === null && !error && <p className="muted">Loading…</p>}
      {sorted !== null && sorted.length === 0 && (
        <p data-testid="replays-empty">
          No sessions facilitated from this browser yet. A session appears here once its facilitator
          console has been opened in this browser.
        </p>
      )}
      {sorted !== null && sorted.length > 0 && (
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
          {sorted.map(({ item: s, key }) => (
            <tr key={s.id}>
              <td>
                <Link href={keyedPath("replays", s.id, key)} data-testid={`replay-link-${s.id}`}>
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
      {!asOperator && (
        <form
          className="card row no-print"
          style={{ alignItems: "flex-end", marginTop: "1rem" }}
          onSubmit={(e) => {
            e.preventDefault();
            if (operatorKey.trim()) void loadAll(operatorKey.trim());
          }}
        >
          <TextField
            label="Operator key (lists every session on this server)"
            value={operatorKey}
            onChange={setOperatorKey}
            testId="replays-operator-key"
          />
          <button type="submit" style={{ marginBottom: "1.3rem" }}>
            List all
          </button>
        </form>
      )}
    </div>
  );
}
