"use client";

import Link from "next/link";
import { useEffect, useRef } from "react";
import type { CreateSessionResponse } from "@contend/protocol";
import { POLICY_LABELS } from "@contend/solver";
import type { PolicyKind } from "@contend/solver";
import { absoluteLink, localPath } from "../lib/api";
import { rememberFacilitatorKey } from "../lib/keyring";
import { rememberInvites } from "../lib/live";
import type { CreatedRecord } from "../hooks/useCreateSession";
import { CopyField } from "./CopyField";

/** " (Textbook strategist: plays the Nash equilibrium effort every round.)" or "". */
function policyText(kind: string | undefined): string {
  const entry = kind ? POLICY_LABELS[kind as PolicyKind] : undefined;
  return entry ? ` (${entry.label}: ${entry.description.replace(/\.$/, "")}).` : ".";
}

/** What a facilitator needs right after creating a session: links, code, seat invitations. */
export function CreatedSession({
  created,
  title,
  computer = {},
}: {
  created: CreateSessionResponse;
  title: string;
  /** rival name -> computer policy kind (to say how each computer seat plays) */
  computer?: Record<string, string>;
}) {
  useEffect(() => {
    rememberFacilitatorKey(created.id, created.facilitatorKey);
    rememberInvites(created.id, {
      joinCode: created.joinCode,
      links: created.links,
      seats: created.seats.map((s) => ({ index: s.index, name: s.name, link: s.link })),
    });
  }, [created]);
  // The result appears where the facilitator is looking: scrolled into view, its heading focused
  // (so a screen reader reads it too), instead of below the fold where it looks like nothing
  // happened.
  const heading = useRef<HTMLHeadingElement>(null);
  useEffect(() => {
    const h = heading.current;
    if (!h) return;
    h.scrollIntoView({ block: "start" });
    h.focus({ preventScroll: true });
  }, []);
  const facilitator = absoluteLink(created.links.facilitator);
  const screen = absoluteLink(created.links.spectator);
  const join = absoluteLink(created.links.join);
  return (
    <section className="card" aria-labelledby="created-title" data-testid="created-session">
      <h2 id="created-title" ref={heading} tabIndex={-1}>
        Session created: {title}
      </h2>
      <p className="muted small">
        Keep the facilitator link to yourself: it controls the session. Send each seat link to one
        person only, inside your organisation.
      </p>
      <div className="row" style={{ alignItems: "flex-end", marginBottom: "0.75rem" }}>
        <div className="kpi">
          <span className="label">Join code</span>
          <span className="join-code" data-testid="join-code">
            {created.joinCode}
          </span>
        </div>
        <Link
          className="button primary"
          href={localPath(created.links.facilitator)}
          data-testid="open-facilitator"
        >
          Open facilitator console
        </Link>
        <Link
          className="button"
          href={localPath(created.links.spectator)}
          data-testid="open-screen"
        >
          Open big screen
        </Link>
      </div>
      <div className="stack">
        <CopyField label="Facilitator link" value={facilitator} testId="facilitator-link" />
        <CopyField label="Big-screen link" value={screen} testId="screen-link" />
        <CopyField label="Join page (with code)" value={join} testId="join-link" />
        {created.seats.map((seat) =>
          seat.link === null ? (
            <p key={seat.index} className="small muted" data-testid={`seat-computer-${seat.index}`}>
              Seat {seat.index + 1}, {seat.name}: played by the computer
              {policyText(computer[seat.name])}
            </p>
          ) : (
            <CopyField
              key={seat.index}
              label={`Seat ${seat.index + 1} link: ${seat.name}`}
              value={absoluteLink(seat.link)}
              testId={`seat-link-${seat.index}`}
            />
          ),
        )}
      </div>
    </section>
  );
}

/**
 * The session useCreateSession made, if it made one; keyed by the session's id, so a new
 * session shows fresh (scrolled to and focused again).
 */
export function MadeSession({ created }: { created: CreatedRecord | null }) {
  return created ? (
    <CreatedSession
      key={created.res.id}
      created={created.res}
      title={created.title}
      computer={created.computer}
    />
  ) : null;
}
