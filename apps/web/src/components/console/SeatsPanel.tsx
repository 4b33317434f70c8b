"use client";

import { POLICY_LABELS } from "@contend/solver";
import type { PolicyKind, PolicySpec } from "@contend/solver";
import type { Command, RoleView } from "@contend/protocol";
import { sealProgress } from "../../lib/roomState";
import { SelectField } from "../Field";

type Run = (cmd: Command, done: string) => Promise<boolean>;

export const POLICY_OPTIONS: readonly { value: "human" | PolicyKind; label: string }[] = [
  { value: "human", label: "Person" },
  ...(Object.keys(POLICY_LABELS) as PolicyKind[])
    .filter((k) => k !== "fixed")
    .map((k) => ({ value: k, label: `Computer: ${POLICY_LABELS[k].label}` })),
];

/** Each seat: who plays it, whether its page is connected now, and (open round) whether it sealed. */
export function SeatsPanel({
  view,
  presence,
  busy,
  run,
}: {
  view: RoleView;
  presence: readonly number[] | null;
  busy: boolean;
  run: Run;
}) {
  const between = view.status === "lobby" || view.status === "review";
  const { sealed, playing } = sealProgress(view);
  return (
    <section className="card" aria-labelledby="seats-title">
      <h2 id="seats-title">
        Seats{" "}
        {view.status === "open" && (
          <span className="badge accent" data-testid="sealed-count">
            {sealed} of {playing} sealed
          </span>
        )}
      </h2>
      <ul className="seat-list">
        {view.seats.map((s) => {
          const policy = s.policy ? POLICY_LABELS[s.policy.kind] : null;
          const online = presence?.includes(s.index) ?? null;
          return (
            <li key={s.index} data-testid={`seat-row-${s.index}`}>
              <span className="name">
                {s.name}
                {s.displayName && s.displayName !== s.name ? (
                  <span className="muted small"> · {s.displayName}</span>
                ) : null}
                {policy ? (
                  <span className="seat-policy small muted">{policy.description}</span>
                ) : null}
              </span>
              {!s.active ? (
                <span className="badge off">retired</span>
              ) : s.kind === "computer" || policy ? (
                <span className="badge">computer{policy ? `: ${policy.label}` : ""}</span>
              ) : (
                <Presence online={online} claimed={s.claimed} index={s.index} />
              )}
              {view.status === "open" && s.active ? (
                <span
                  className={s.sealed ? "badge accent" : "badge"}
                  data-testid={`seat-sealed-${s.index}`}
                  data-sealed={s.sealed ? "yes" : "no"}
                >
                  {s.sealed ? "sealed" : "deciding"}
                </span>
              ) : null}
              {between && s.active ? (
                <SelectField
                  compact
                  label={`Who plays ${s.name}`}
                  value={(s.policy?.kind as PolicyKind | undefined) ?? "human"}
                  options={POLICY_OPTIONS}
                  disabled={busy}
                  onChange={(v) =>
                    void run(
                      {
                        type: "setSeatPolicy",
                        seatIndex: s.index,
                        policy: v === "human" ? null : ({ kind: v } as PolicySpec),
                      },
                      `${s.name}: ${v === "human" ? "played by a person" : `played by the computer (${POLICY_LABELS[v].label}: ${POLICY_LABELS[v].description})`}`,
                    )
                  }
                  testId={`seat-policy-${s.index}`}
                />
              ) : null}
            </li>
          );
        })}
      </ul>
    </section>
  );
}

/** A person's seat: connected now, or not, with a shape as well as a colour. */
function Presence({
  online,
  claimed,
  index,
}: {
  online: boolean | null;
  claimed: boolean;
  index: number;
}) {
  const state = online === null ? "unknown" : online ? "online" : claimed ? "offline" : "empty";
  const text = {
    unknown: claimed ? "joined" : "not joined",
    online: "online",
    offline: "offline",
    empty: "not joined",
  }[state];
  return (
    <span
      className={`badge presence ${state}`}
      data-testid={`seat-presence-${index}`}
      data-presence={state}
    >
      <svg viewBox="0 0 10 10" width="10" height="10" aria-hidden="true" focusable="false">
        {state === "online" ? (
          <circle cx="5" cy="5" r="4" fill="currentColor" />
        ) : (
          <circle cx="5" cy="5" r="3.5" fill="none" stroke="currentColor" strokeWidth="1.5" />
        )}
      </svg>{" "}
      {text}
    </span>
  );
}
