"use client";

import { useCallback, useRef, useState } from "react";
import type { CreateSessionResponse } from "@contend/protocol";
import { createSession } from "../lib/api";
import type { FrontsSessionInput, SessionScenarioInput } from "../lib/sessionTypes";

export interface CreatedRecord {
  res: CreateSessionResponse;
  title: string;
  /** rival name -> computer policy kind, for describing computer seats */
  computer: Record<string, string>;
  /** what the caller says this session was made from (a template id, a form state) */
  from: unknown;
}

/**
 * One click = one session: a second call while the first is in flight is ignored (a ref, so
 * even two clicks inside one frame count once), and the caller disables its button while
 * `pending` and for as long as `created.from` is what it would send again.
 */
export function useCreateSession() {
  const inFlight = useRef(false);
  const [pending, setPending] = useState<unknown>(null);
  const [created, setCreated] = useState<CreatedRecord | null>(null);
  const [error, setError] = useState<string | null>(null);

  const create = useCallback(
    async (
      scenario: SessionScenarioInput | FrontsSessionInput,
      from: unknown,
    ): Promise<boolean> => {
      if (inFlight.current) return false;
      inFlight.current = true;
      setPending(from);
      setError(null);
      const r = await createSession(scenario);
      inFlight.current = false;
      setPending(null);
      if (r.ok) {
        const computer = Object.fromEntries(
          Object.entries(scenario.session?.computer ?? {}).map(([name, p]) => [
            name,
            String((p as { kind?: unknown }).kind ?? ""),
          ]),
        );
        setCreated({ res: r.data, title: scenario.title, computer, from });
        return true;
      }
      setError(
        r.code === "network"
          ? `The session was not created: ${r.message}.`
          : `The session was not created: ${r.path ? `${r.path}: ` : ""}${r.message}`,
      );
      return false;
    },
    [],
  );

  return { create, pending, created, error, busy: pending !== null };
}
