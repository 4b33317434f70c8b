"use client";

import { useState } from "react";
import { LIMITS } from "@contend/protocol";
import type { FrontsScenario } from "@contend/solver";
import { useCreateSession } from "../../hooks/useCreateSession";
import { CreatedSession } from "../CreatedSession";
import { CreateSessionButton } from "../CreateSessionButton";
import { TextField } from "../Field";

/**
 * Play the explored fronts scenario live: every rival becomes a seat for a person, each front is
 * split by shares, a missing allocation repeats the last one (docs/protocol.md R45-R49). The
 * server checks the whole body again and its refusal names the field.
 */
export function StartFrontsSession({ scenario }: { scenario: FrontsScenario }) {
  const { create, pending, busy, created, error } = useCreateSession();
  const [rounds, setRounds] = useState("4");
  const n = Number(rounds);
  const roundsOk = Number.isInteger(n) && n >= 1 && n <= LIMITS.roundsMax;
  const body = {
    ...scenario,
    session: { outcome: "shares" as const, rounds: n, missingMove: "repeat" as const },
  };
  const from = JSON.stringify(body);
  return (
    <section className="card" aria-labelledby="fronts-live-title" data-testid="fronts-start">
      <h2 id="fronts-live-title">Play these numbers live</h2>
      <p className="small muted">
        Starts a workshop session with these fronts and budgets: every rival is a seat for a person,
        each seat splits its budget over the fronts every round. A rehearsal inside your team; never
        share plans with real competitors.
      </p>
      <div className="row" style={{ alignItems: "flex-end" }}>
        <TextField
          label="Rounds"
          value={rounds}
          onChange={setRounds}
          testId="fronts-start-rounds"
          width="6rem"
          error={roundsOk ? undefined : `a whole number from 1 to ${LIMITS.roundsMax}`}
        />
        <CreateSessionButton
          label="Start a live session"
          pending={pending !== null}
          created={created?.from === from}
          disabled={!roundsOk || busy}
          onClick={() => void create(body, from)}
          testId="fronts-start-session"
        />
      </div>
      <div aria-live="polite">
        {error && <p className="notice error">{error}</p>}
        {created && (
          <CreatedSession key={created.res.id} created={created.res} title={created.title} />
        )}
      </div>
    </section>
  );
}
