"use client";

import { useState } from "react";
import type { Command, RoleView } from "@contend/protocol";
import { LIMITS } from "@contend/protocol";
import { parseNumberField } from "../../lib/editorForm";
import { nextAction } from "../../lib/roomState";
import type { Notice } from "../../hooks/useConsoleCommands";
import { TextField } from "../Field";

type Run = (cmd: Command, done: string) => Promise<boolean>;

/**
 * The top of the console: the one next action as the main button (its label is always the
 * true next step), the length of the round it opens, and pause / end.
 */
export function NextStep({
  view,
  busy,
  run,
  notice,
}: {
  view: RoleView;
  busy: boolean;
  run: Run;
  notice: Notice | null;
}) {
  const action = nextAction(view);
  const clock = useRoundLength(view.settings.clockSeconds);
  const ended = view.status === "ended";

  function primary() {
    if (action.kind === "open") {
      const length = clock.read();
      if (!length.ok) return;
      void run(
        { type: "openRound", durationSeconds: length.seconds },
        `Round ${action.round} opened${length.seconds === null ? " with no clock" : ""}.`,
      );
    } else if (action.kind === "close") {
      void run({ type: "closeRound" }, `Round ${view.round} closed and revealed.`);
    } else if (action.kind === "resume") {
      void run({ type: "resume" }, "Resumed.");
    } else if (action.kind === "end") {
      void run({ type: "endSession" }, "Session ended.");
    }
  }

  return (
    <section className="card next-step" aria-labelledby="next-title">
      <h2 id="next-title">Next step</h2>
      <div className="row" style={{ alignItems: "flex-end" }}>
        <button
          type="button"
          className="primary big"
          onClick={primary}
          disabled={busy || action.kind === "none"}
          data-testid="open-round"
          data-action={action.kind}
        >
          {action.label}
        </button>
        {action.kind === "open" && (
          <>
            <TextField
              label="Round length (seconds)"
              numeric
              value={clock.text}
              onChange={clock.setText}
              disabled={clock.none}
              error={clock.error ?? undefined}
              width="13rem"
              testId="open-duration"
              hint={`${LIMITS.clockMinSeconds} to ${LIMITS.clockMaxSeconds}`}
            />
            <label className="row small inline-check">
              <input
                type="checkbox"
                checked={clock.none}
                onChange={(e) => clock.setNone(e.target.checked)}
                data-testid="open-no-clock"
              />
              No clock (I close the round)
            </label>
          </>
        )}
      </div>
      <div className="row" style={{ marginTop: "0.75rem" }}>
        {!ended && !view.paused ? (
          <button
            type="button"
            onClick={() => run({ type: "pause" }, "Paused.")}
            disabled={busy}
            data-testid="pause"
          >
            {view.status === "open" ? "Pause the clock" : "Pause"}
          </button>
        ) : null}
        {view.status === "open" && view.paused ? (
          <button
            type="button"
            onClick={() => run({ type: "closeRound" }, `Round ${view.round} closed and revealed.`)}
            disabled={busy}
            data-testid="close-round"
          >
            Close round {view.round} and reveal
          </button>
        ) : null}
        {!ended && (
          <button
            type="button"
            className="danger"
            onClick={() => {
              if (window.confirm("End the session for everyone? This cannot be undone."))
                void run({ type: "endSession" }, "Session ended.");
            }}
            disabled={busy}
            data-testid="end-session"
          >
            End session
          </button>
        )}
      </div>
      <p
        role="status"
        className={notice?.ok === false ? "field-error" : "small"}
        data-testid="console-notice"
        style={{ minHeight: "1.4em", margin: "0.5rem 0 0" }}
      >
        {notice?.text ?? ""}
      </p>
    </section>
  );
}

/** The round-length field: shows the session's real setting and reads what was typed. */
function useRoundLength(setting: number | null) {
  const [text, setText] = useState(setting === null ? "" : String(setting));
  const [none, setNone] = useState(setting === null);
  const [error, setError] = useState<string | null>(null);
  function read(): { ok: true; seconds: number | null } | { ok: false } {
    setError(null);
    if (none) return { ok: true, seconds: null };
    const n = parseNumberField(text);
    const { clockMinSeconds: lo, clockMaxSeconds: hi } = LIMITS;
    if (typeof n !== "number" || !(n >= lo && n <= hi)) {
      setError(`Round length: enter a number of seconds from ${lo} to ${hi}, or tick "No clock".`);
      return { ok: false };
    }
    return { ok: true, seconds: n };
  }
  return { text, setText, none, setNone, read, error };
}
