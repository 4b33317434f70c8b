"use client";

import { useRouter, useSearchParams } from "next/navigation";
import { useMemo, useState } from "react";
import type { ClaimSeatAckData, Credentials } from "@contend/protocol";
import { useSession } from "../../hooks/useSession";
import { TextField } from "../Field";
import { ConnectionBanner } from "./ConnectionBanner";
import { keyedPath } from "../../lib/api";

export function JoinFlow() {
  const params = useSearchParams();
  const router = useRouter();
  const [code, setCode] = useState(params.get("code") ?? "");
  const [submitted, setSubmitted] = useState<string | null>(params.get("code") || null);
  const credentials = useMemo<Credentials | null>(
    () => (submitted ? { role: "guest", joinCode: submitted } : null),
    [submitted],
  );
  const { connection, view, send } = useSession(credentials);
  const [seat, setSeat] = useState<number | null>(null);
  const [displayName, setDisplayName] = useState("");
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  const free = view?.seats.filter((s) => s.active && s.kind === "human" && !s.claimed) ?? [];

  async function claim(e: React.FormEvent) {
    e.preventDefault();
    if (seat === null) return;
    setBusy(true);
    setError(null);
    const ack = await send({
      type: "claimSeat",
      seatIndex: seat,
      displayName: displayName.trim() || (view?.seats[seat]?.name ?? "Player"),
    });
    setBusy(false);
    if (!ack.ok) {
      setError(ack.message);
      return;
    }
    const d = ack.data as ClaimSeatAckData;
    router.push(keyedPath("seat", d.sessionId, d.seatKey));
  }

  return (
    <div style={{ maxWidth: 560, margin: "0 auto" }}>
      <h1>Join a session</h1>
      <form
        className="card"
        onSubmit={(e) => {
          e.preventDefault();
          setSubmitted(code.trim() || null);
        }}
      >
        <div className="row" style={{ alignItems: "flex-end" }}>
          <div style={{ flex: 1 }}>
            <TextField label="Join code" value={code} onChange={setCode} testId="join-code-input" />
          </div>
          <button
            type="submit"
            className="primary"
            style={{ marginBottom: "1.3rem" }}
            data-testid="join-find"
          >
            Find session
          </button>
        </div>
      </form>
      {submitted && <ConnectionBanner connection={connection} />}
      {submitted && connection.status === "failed" && (
        <p className="notice error" role="alert" data-testid="join-error">
          {/join code/i.test(connection.message ?? "")
            ? `No session has the code ${submitted.toUpperCase()}. Check it with the facilitator: six letters and digits.`
            : `This code does not open a session: ${connection.message ?? "the server refused it"}.`}
        </p>
      )}
      {view && (
        <form className="card" onSubmit={claim} aria-labelledby="pick-title">
          <h2 id="pick-title">{view.title}</h2>
          {free.length === 0 ? (
            <p data-testid="join-no-seats" data-reason={view.status === "ended" ? "ended" : "full"}>
              {view.status === "ended"
                ? "This session has ended, so no seat can be taken any more. Ask the facilitator for the replay."
                : "Every seat is taken. Ask the facilitator for a seat link."}
            </p>
          ) : (
            <>
              <fieldset>
                <legend>Pick your rival</legend>
                {free.map((s) => (
                  <label
                    key={s.index}
                    className="row"
                    style={{ fontWeight: 400, padding: "0.25rem 0" }}
                  >
                    <input
                      type="radio"
                      name="seat"
                      value={s.index}
                      checked={seat === s.index}
                      onChange={() => setSeat(s.index)}
                      data-testid={`join-seat-${s.index}`}
                    />
                    {s.name}
                  </label>
                ))}
              </fieldset>
              <TextField
                label="Your name (shown to the facilitator)"
                value={displayName}
                onChange={setDisplayName}
                testId="join-display-name"
              />
              <button
                type="submit"
                className="primary"
                disabled={seat === null || busy}
                data-testid="join-claim"
              >
                {busy ? "Taking the seat…" : "Take this seat"}
              </button>
              <p className="field-error" role={error ? "alert" : undefined}>
                {error ?? ""}
              </p>
            </>
          )}
        </form>
      )}
    </div>
  );
}
