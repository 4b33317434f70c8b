"use client";

import { useState } from "react";
import { deleteSession } from "../../lib/api";
import { forgetFacilitatorKey } from "../../lib/keyring";

/** Deletes the session for good (events, seats, keys), after the facilitator confirms. */
export function DeleteSession({ sessionId, accessKey }: { sessionId: string; accessKey: string }) {
  const [outcome, setOutcome] = useState<string | null>(null);
  async function remove() {
    if (!window.confirm("Delete this session for good? Its log, seats and links are erased.")) {
      return;
    }
    const r = await deleteSession(sessionId, accessKey);
    if (!r.ok) return setOutcome(`Not deleted: ${r.message}`);
    forgetFacilitatorKey(sessionId);
    setOutcome(
      "Deleted. This page shows what was loaded before; nothing of it remains on the server.",
    );
  }
  return (
    <>
      <button
        type="button"
        className="danger"
        onClick={() => void remove()}
        data-testid="delete-session"
      >
        Delete session
      </button>
      {outcome && (
        <p className="notice" role="status" data-testid="delete-outcome">
          {outcome}
        </p>
      )}
    </>
  );
}
