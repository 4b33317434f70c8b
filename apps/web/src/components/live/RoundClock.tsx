"use client";

import type { RoleView } from "@contend/protocol";
import { useNow } from "../../hooks/useSession";
import { formatClock } from "../../lib/format";
import { remainingMs, STATUS_TEXT } from "../../lib/live";

/** `clockOffsetMs`: the server's clock minus this browser's (see useSession). */
export function RoundClock({
  view,
  clockOffsetMs,
  big,
}: {
  view: RoleView;
  clockOffsetMs: number;
  big?: boolean;
}) {
  const now = useNow(250);
  const left = remainingMs(view, now + clockOffsetMs);
  return (
    <div className="kpi" data-testid="round-clock">
      <span className="label">
        {view.status === "lobby" ? "Not started" : `Round ${view.round} of ${view.roundsTotal}`} ·{" "}
        {STATUS_TEXT[view.status]}
        {view.paused ? " · paused" : ""}
      </span>
      <span
        className={big ? "clock" : "clock"}
        data-testid="clock-value"
        style={big ? undefined : { fontSize: "1.6rem" }}
      >
        {left === null ? (view.status === "open" ? "no clock" : "\u2013") : formatClock(left)}
      </span>
    </div>
  );
}
