"use client";

import { useCallback, useEffect, useState } from "react";
import { facilitatorKeys } from "../lib/keyring";
import { listKeyedSessions, operatorFromFragment } from "../lib/libraryApi";
import type { KeyedSession } from "../lib/libraryApi";

/** A session this page may open, with the key that opens its summary and export. */
export type SessionChoice = KeyedSession;

/**
 * The sessions this page may open, under the same access rules as the replay list: those whose
 * facilitator keys this browser holds, or every session with the operator key (from
 * `#operator=<key>` or typed in). Nothing is stored.
 */
export function useSessionChoices() {
  const [choices, setChoices] = useState<SessionChoice[] | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [asOperator, setAsOperator] = useState(false);

  /** `operatorKey` "": this browser's own sessions; else every session. */
  const load = useCallback(async (operatorKey: string) => {
    setError(null);
    const r = await listKeyedSessions(operatorKey, facilitatorKeys());
    if (!r.ok) return setError(r.message);
    if (operatorKey) setAsOperator(true);
    setChoices(r.data);
  }, []);

  useEffect(() => {
    void load(operatorFromFragment());
  }, [load]);

  const sorted =
    choices && [...choices].sort((a, b) => b.item.updatedAt.localeCompare(a.item.updatedAt));
  return { choices: sorted, error, asOperator, loadAll: load };
}
