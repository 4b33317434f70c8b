"use client";

import Link from "next/link";
import { useState } from "react";
import { sessionSummarySchema } from "@contend/protocol";
import { sessionSummary } from "../../lib/api";
import type { Compared } from "../../lib/compare";
import { formatDateTime } from "../../lib/format";
import { STATUS_TEXT } from "../../lib/live";
import { OperatorKeyForm } from "../replay/OperatorKeyForm";
import { useSessionChoices } from "../../hooks/useSessionChoices";
import { FigureTable, numCol, textCol } from "../FigureTable";
import { CompareView } from "./CompareView";

type Loaded = { ok: true; value: Compared } | { ok: false; message: string };

/**
 * Pick two or more past sessions (same or different scenarios) and see them side by side. The
 * figures are each session's summary (GET /api/sessions/:id/summary), fetched with the key
 * this browser holds for it (or the operator key).
 */
export function CompareSessions() {
  const { choices, error, asOperator, loadAll } = useSessionChoices();
  const [operatorKey, setOperatorKey] = useState("");
  const [picked, setPicked] = useState<string[]>([]);
  const [loaded, setLoaded] = useState<Record<string, Loaded>>({});

  async function load(id: string, key: string) {
    const r = await sessionSummary(id, key);
    let result: Loaded;
    if (!r.ok) result = { ok: false, message: r.message };
    else {
      const parsed = sessionSummarySchema.safeParse(r.data);
      result = parsed.success
        ? { ok: true, value: { id, summary: parsed.data } }
        : { ok: false, message: "the server's summary does not match the protocol" };
    }
    setLoaded((m) => ({ ...m, [id]: result }));
  }

  function toggle(id: string, key: string, on: boolean) {
    setPicked((p) => (on ? [...p.filter((x) => x !== id), id] : p.filter((x) => x !== id)));
    if (on && !loaded[id]?.ok) void load(id, key);
  }

  const sessions = picked.flatMap((id) => {
    const l = loaded[id];
    return l?.ok ? [l.value] : [];
  });
  const failures = picked.flatMap((id) => {
    const l = loaded[id];
    return l && !l.ok ? [{ id, message: l.message }] : [];
  });
  const titleOf = (id: string) => choices?.find((c) => c.item.id === id)?.item.title ?? id;

  return (
    <div>
      <h1>Compare sessions</h1>
      <p className="muted">
        Pick two or more sessions, of the same drill or of different ones, to see how play compares
        with equilibrium round by round.
        {asOperator
          ? " Listed with the operator key: every session on this server."
          : " Listed: the sessions this browser has facilitated."}{" "}
        <Link href="/replays">Back to past sessions</Link>
      </p>
      {error && (
        <p className="notice error" data-testid="compare-error">
          Could not load the list: {error}
        </p>
      )}
      {choices === null && !error && <p className="muted">Loading…</p>}
      {choices !== null && choices.length === 0 && (
        <p data-testid="compare-empty">
          No sessions facilitated from this browser yet. A session appears here once its facilitator
          console has been opened in this browser.
        </p>
      )}
      {choices !== null && choices.length > 0 && (
        <FigureTable
          head={[
            textCol("Compare"),
            textCol("Session"),
            textCol("Status"),
            numCol("Rounds played"),
            textCol("Created"),
          ]}
          caption="Sessions you may compare (a session with no round played has nothing to show)"
          wrap="card table-wrap no-print"
          testId="compare-picker"
        >
          {choices.map(({ item: s, key }) => (
            <tr key={s.id}>
              <td>
                <input
                  type="checkbox"
                  checked={picked.includes(s.id)}
                  disabled={s.rounds === 0}
                  onChange={(e) => toggle(s.id, key, e.target.checked)}
                  aria-label={`Compare ${s.title}`}
                  data-testid={`compare-pick-${s.id}`}
                />
              </td>
              <td>{s.title}</td>
              <td>{STATUS_TEXT[s.status]}</td>
              <td className="num">{s.rounds}</td>
              <td>{formatDateTime(s.createdAt)}</td>
            </tr>
          ))}
        </FigureTable>
      )}
      {failures.map((f) => (
        <p key={f.id} className="notice error" data-testid="compare-load-error">
          Could not load {titleOf(f.id)}: {f.message}
        </p>
      ))}
      {!asOperator && (
        <OperatorKeyForm
          value={operatorKey}
          onChange={setOperatorKey}
          onList={(key) => void loadAll(key)}
          testId="compare-operator-key"
        />
      )}
      {sessions.length >= 2 ? (
        <CompareView sessions={sessions} />
      ) : (
        <p className="muted" data-testid="compare-hint">
          {picked.length < 2
            ? "Tick two or more sessions to compare them."
            : "Loading the summaries…"}
        </p>
      )}
    </div>
  );
}
