"use client";

import type { Connection } from "../../hooks/useSession";

const TEXT: Record<Connection["status"], string> = {
  connecting: "Connecting to the session…",
  live: "Connected",
  reconnecting: "Connection lost: reconnecting…",
  resynced: "Reconnected and up to date",
  failed: "Cannot open this session",
};

/** Always occupies its line, so a state change never moves the page. */
export function ConnectionBanner({ connection, dark }: { connection: Connection; dark?: boolean }) {
  const { status, message } = connection;
  return (
    <div
      className={`banner ${status}`}
      role="status"
      aria-live="polite"
      data-testid="connection-banner"
      data-status={status}
      style={dark && status === "live" ? { color: "#9fb0c2" } : undefined}
    >
      {TEXT[status]}
      {message && status !== "live" ? <span style={{ fontWeight: 400 }}> · {message}</span> : null}
    </div>
  );
}
