"use client";

import { useEffect, useState } from "react";
import { LIMITS } from "@contend/protocol";
import type { useSession } from "../../hooks/useSession";

/** The facilitator's note on a played round (R27): public, kept for the debrief and exports. */
export function RoundNoteForm({
  round,
  note,
  send,
}: {
  round: number;
  note: string | undefined;
  send: ReturnType<typeof useSession>["send"];
}) {
  const [text, setText] = useState(note ?? "");
  const [state, setState] = useState<{ busy: boolean; message: string | null }>({
    busy: false,
    message: null,
  });
  useEffect(() => setText(note ?? ""), [round, note]);
  const id = `round-note-${round}`;
  return (
    <form
      className="row"
      style={{ alignItems: "flex-end", marginTop: "0.75rem" }}
      onSubmit={async (e) => {
        e.preventDefault();
        setState({ busy: true, message: null });
        const ack = await send({ type: "noteRound", round, text });
        setState({ busy: false, message: ack.ok ? "Note saved." : ack.message });
      }}
    >
      <div className="field" style={{ flex: "1 1 18rem" }}>
        <label htmlFor={id}>Your note on round {round} (everyone in the session can read it)</label>
        <input
          id={id}
          type="text"
          maxLength={LIMITS.noteMax}
          value={text}
          onChange={(e) => setText(e.target.value)}
          data-testid="round-note-input"
        />
      </div>
      <button type="submit" disabled={state.busy} data-testid="round-note-save">
        {state.busy ? "Saving…" : "Save note"}
      </button>
      <span className="small muted" role="status" data-testid="round-note-status">
        {state.message ?? ""}
      </span>
    </form>
  );
}
