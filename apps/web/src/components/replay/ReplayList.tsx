"use client";

import Link from "next/link";
import { useCallback, useEffect, useRef, useState } from "react";
import type { SessionListItem } from "@contend/protocol";
import { facilitatorKeys } from "../../lib/keyring";
import { EMPTY_FILTER, listKeyedSessions, operatorFromFragment } from "../../lib/libraryApi";
import type { KeyedSession, LibraryFilter } from "../../lib/libraryApi";
import { FigureTable, numCol, textCol } from "../FigureTable";
import { OperatorKeyForm } from "./OperatorKeyForm";
import { LibraryFilters } from "./LibraryFilters";
import { SessionRow } from "./SessionRow";

/** A session and the key its replay link carries (in the fragment) and its edits send. */
type Row = KeyedSession;

/** Typing in the search box asks the server once the typing pauses. */
const SEARCH_PAUSE_MS = 250;

/**
 * The library of past sessions: those whose facilitator keys this browser holds (kept when a
 * facilitator console opened), or every session with the operator key. The server lists
 * nothing else, and searches (title, tag, dates, archived) on its side.
 */
export function ReplayList() {
  const [rows, setRows] = useState<Row[] | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [operatorKey, setOperatorKey] = useState("");
  /** the operator key the list was loaded with; "" lists this browser's own sessions */
  const [listedAs, setListedAs] = useState<string | null>(null);
  const [filter, setFilter] = useState<LibraryFilter>(EMPTY_FILTER);
  const [seenTags, setSeenTags] = useState<string[]>([]);
  const asked = useRef(0);

  const load = useCallback(async (operator: string, f: LibraryFilter) => {
    const ask = ++asked.current;
    setError(null);
    const r = await listKeyedSessions(operator, facilitatorKeys(), f);
    if (ask !== asked.current) return; // a newer search has been sent
    if (!r.ok) return setError(r.message);
    setRows(r.data);
    setSeenTags((old) => [...new Set([...old, ...r.data.flatMap((r) => r.item.tags)])].sort());
  }, []);

  // The operator link may be opened on this page already: read the fragment on every change.
  useEffect(() => {
    const read = () => {
      const fromFragment = operatorFromFragment();
      setOperatorKey(fromFragment);
      setListedAs(fromFragment);
    };
    read();
    window.addEventListener("hashchange", read);
    return () => window.removeEventListener("hashchange", read);
  }, []);

  useEffect(() => {
    if (listedAs === null) return;
    const timer = setTimeout(() => void load(listedAs, filter), SEARCH_PAUSE_MS);
    return () => clearTimeout(timer);
  }, [listedAs, filter, load]);

  const asOperator = Boolean(listedAs);
  const filtered = JSON.stringify(filter) !== JSON.stringify(EMPTY_FILTER);
  const update = (item: SessionListItem) => {
    setRows((old) => old && old.map((r) => (r.item.id === item.id ? { ...r, item } : r)));
    setSeenTags((old) => [...new Set([...old, ...item.tags])].sort());
  };
  const hiddenNow = (item: SessionListItem) =>
    (filter.archived === "hide" && item.archivedAt !== null) ||
    (filter.archived === "only" && item.archivedAt === null);

  return (
    <div>
      <h1>Past sessions</h1>
      <p className="muted">
        Find a session by title, tag or date, step through it event by event, compare play with
        equilibrium, and print a debrief.
        {asOperator
          ? " Listed with the operator key: every session on this server."
          : " Listed: the sessions this browser has facilitated. Nobody else can list them."}
      </p>
      <p className="no-print row">
        <Link
          href={`/replays/compare${asOperator ? `#operator=${encodeURIComponent(listedAs ?? "")}` : ""}`}
          data-testid="replays-compare-link"
        >
          Compare sessions side by side
        </Link>
        <Link href="/scenarios" data-testid="replays-scenarios-link">
          Saved scenarios
        </Link>
      </p>
      <LibraryFilters filter={filter} setFilter={setFilter} tags={seenTags} />
      {error && (
        <p className="notice error" data-testid="replays-error">
          Could not load the list: {error}
        </p>
      )}
      {rows === null && !error && <p className="muted">Loading…</p>}
      {rows !== null && rows.length === 0 && (
        <p data-testid="replays-empty">
          {filtered
            ? "No session matches this search."
            : "No sessions facilitated from this browser yet. A session appears here once its facilitator console has been opened in this browser."}
        </p>
      )}
      {rows !== null && rows.length > 0 && (
        <FigureTable
          head={[
            textCol("Session and tags"),
            textCol("Status"),
            numCol("Rounds played"),
            textCol("Created"),
            textCol("Library"),
          ]}
          wrap="card table-wrap library-table"
          testId="replays-table"
        >
          {rows.map(({ item, key }) => (
            <SessionRow
              key={item.id}
              item={item}
              accessKey={key}
              onChanged={(next) => {
                if (hiddenNow(next)) {
                  setRows((old) => old && old.filter((r) => r.item.id !== next.id));
                } else update(next);
              }}
              onDeleted={(id) => setRows((old) => old && old.filter((r) => r.item.id !== id))}
              onTag={(tag) => setFilter({ ...filter, tag })}
            />
          ))}
        </FigureTable>
      )}
      {!asOperator && (
        <OperatorKeyForm
          value={operatorKey}
          onChange={setOperatorKey}
          onList={setListedAs}
          testId="replays-operator-key"
        />
      )}
    </div>
  );
}
