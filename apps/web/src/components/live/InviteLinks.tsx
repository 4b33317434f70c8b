"use client";

import { useEffect, useState } from "react";
import type { RoleView } from "@contend/protocol";
import type { useSession } from "../../hooks/useSession";
import { absoluteLink } from "../../lib/api";
import {
  invitesFor,
  issuedLinkOf,
  recallInvites,
  rememberInvites,
  withIssuedLink,
} from "../../lib/live";
import type { StoredInvites } from "../../lib/live";
import { CopyField } from "../CopyField";

export type Notice = { ok: boolean; text: string };

/**
 * Join code and invite links. The creating browser has every link stored; any other browser
 * asks the server for a fresh one ("New link"): earlier links keep working.
 */
export function InviteLinks({
  view,
  sessionId,
  send,
  onNotice,
}: {
  view: RoleView;
  sessionId: string;
  send: ReturnType<typeof useSession>["send"];
  onNotice: (notice: Notice) => void;
}) {
  const [stored, setStored] = useState<StoredInvites | null>(null);
  const [pending, setPending] = useState<string | null>(null);
  useEffect(() => setStored(recallInvites(sessionId)), [sessionId]);
  const invites = invitesFor(view, stored);
  const ended = view.status === "ended";

  async function issue(seatIndex: number | null, what: string) {
    setPending(what);
    const ack = await send({ type: "issueLinks", seatIndex });
    setPending(null);
    if (!ack.ok) {
      onNotice({ ok: false, text: `${ack.code}: ${ack.message}` });
      return;
    }
    const issued = issuedLinkOf(ack.data);
    if (!issued) return;
    const next = withIssuedLink(invites, issued);
    rememberInvites(sessionId, next);
    setStored(next);
    onNotice({ ok: true, text: `New ${what} ready; earlier links still work.` });
  }

  const seats = view.seats.filter(
    (s) =>
      (s.active && s.kind === "human") ||
      invites.seats.some((k) => k.index === s.index && k.link !== null),
  );
  return (
    <div className="stack">
      <p>
        Join code:{" "}
        <span className="join-code" data-testid="console-join-code">
          {invites.joinCode}
        </span>
      </p>
      {invites.links.join && (
        <CopyField label="Join page" value={absoluteLink(invites.links.join)} />
      )}
      <InviteRow
        label="Big-screen link"
        link={invites.links.spectator}
        onNew={() => issue(null, "big-screen link")}
        disabled={pending !== null || ended}
        testId="console-screen-link"
        newTestId="new-screen-link"
      />
      {seats.map((s) => (
        <InviteRow
          key={s.index}
          label={`Seat link: ${s.name}`}
          link={invites.seats.find((k) => k.index === s.index)?.link ?? ""}
          onNew={
            s.active && s.kind === "human" ? () => issue(s.index, `seat link for ${s.name}`) : null
          }
          disabled={pending !== null || ended}
          testId={`console-seat-link-${s.index}`}
          newTestId={`new-seat-link-${s.index}`}
        />
      ))}
      {!stored && (
        <p className="small muted">
          Links given at creation are kept only in the browser that created the session. New link
          makes another one; the earlier links keep working.
        </p>
      )}
    </div>
  );
}

function InviteRow({
  label,
  link,
  onNew,
  disabled,
  testId,
  newTestId,
}: {
  label: string;
  /** empty: this browser has no link for it */
  link: string;
  onNew: (() => void) | null;
  disabled: boolean;
  testId: string;
  newTestId: string;
}) {
  const button = onNew && (
    <button
      type="button"
      className="small"
      onClick={onNew}
      disabled={disabled}
      aria-label={`New ${label.charAt(0).toLowerCase()}${label.slice(1)}`}
      data-testid={newTestId}
    >
      New link
    </button>
  );
  if (!link) {
    return (
      <div className="row">
        <span className="small">{label}: not in this browser</span>
        {button}
      </div>
    );
  }
  return (
    <div className="row" style={{ alignItems: "flex-end" }}>
      <div style={{ flex: 1, minWidth: 0 }}>
        <CopyField label={label} value={absoluteLink(link)} testId={testId} />
      </div>
      {button}
    </div>
  );
}
