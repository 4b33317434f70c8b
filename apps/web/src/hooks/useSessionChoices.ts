"use client";

import { useCallback, useEffect, useState } from "react";
import type { SessionListItem } from "@contend/protocol";
import { listMySessions, listSessions } from "../lib/api";
import { facilitatorKeys } from "../lib/keyring";

export interface SessionChoice {
  item: SessionListItem;
  /** the key that opens this session's summary and export (facilitator or operator) */
  key: string;
}

/**
 * The sessions this page may open, under the same access rules as the replay list: those whose
 * facilitator keys this browser holds, or every session with the operator key (from
 * `#operator=<key>` or typed in). Nothing is stored.
 */
export function useSessionChoices() {
  const [choices, setChoices] = useState<SessionChoice[] | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [asOperator, setAsOperator] = useState(false);

  const loadMine = useCallback(async () => {
    setError(null);
    const held = facilitatorKeys();
    if (held.length === 0) return setChoices([]);
    const r = await listMySessions(held);
    if (!r.ok) return setError(r.message);
    const keys = new Map(held.map((h) => [h.id, h.key]));
    setChoices(r.data.map((item) => ({ item, key: keys.get(item.id) ?? "" })));
  }, []);

  const loadAll = useCallback(async (operatorKey: string) => {
    setError(null);
    const r = await listSessions(operatorKey);
    if (!r.ok) return setError(r.message);
    setAsOperator(true);
    setChoices(r.data.map((item) => ({ item, key: operatorKey })));
  }, []);

  useEffect(() => {
    const fromFragment = new URLSearchParams(window.location.hash.slice(1)).get("operator") ?? "";
    if (fromFragment) void loadAll(fromFragment);
    else void loadMine();
  }, [loadAll, loadMine]);

  const sorted =
    choices && [...choices].sort((a, b) => b.item.updatedAt.localeCompare(a.item.updatedAt));
  return { choices: sorted, error, asOperator, loadAll };
}
