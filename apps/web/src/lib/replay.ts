/** Replay: the session engine's own fold, stopped after any event, seen as a spectator. */
import { fold, viewFor } from "@contend/session";
import { sessionExportSchema } from "@contend/protocol";
import type { RoleView, SessionEvent, SessionExport } from "@contend/protocol";

/** The parts of an export that are its record; rounds and shocks are derived from the events. */
const recordSchema = sessionExportSchema.pick({ session: true, events: true });

/**
 * Reads an export file. Its rounds and shocks are derived again from its event log with the
 * engine's own fold, so exports written before spends (efforts only) read in money too.
 */
export function parseExport(
  raw: unknown,
): { ok: true; value: SessionExport } | { ok: false; message: string } {
  const r = recordSchema.safeParse(raw);
  if (!r.success) {
    const issue = r.error.issues[0];
    return {
      ok: false,
      message: `export does not match the protocol: ${issue?.path.join(".") ?? ""} ${issue?.message ?? ""}`,
    };
  }
  try {
    const state = fold(r.data.events);
    const rounds = state.status === "empty" ? [] : state.rounds;
    const shocks = state.status === "empty" ? [] : state.shocks;
    return { ok: true, value: { ...r.data, rounds, shocks } };
  } catch (e) {
    return { ok: false, message: `the event log cannot be replayed: ${(e as Error).message}` };
  }
}

/** The spectator view after the first `count` events (count >= 1), or an error for a broken log. */
export function viewAfter(
  events: readonly SessionEvent[],
  count: number,
): { ok: true; view: RoleView } | { ok: false; message: string } {
  const n = Math.max(1, Math.min(events.length, Math.floor(count)));
  try {
    const state = fold(events.slice(0, n));
    // R41: a replay of a session that has ended shows its private numbers at every step.
    const revealed = events.some((e) => e.type === "session-ended");
    return { ok: true, view: viewFor(state, { role: "spectator", revealed }) };
  } catch (e) {
    return {
      ok: false,
      message: `the event log cannot be replayed past event ${n}: ${(e as Error).message}`,
    };
  }
}

/** One line per event for the step list. */
export function describeEvent(e: SessionEvent, names: readonly string[]): string {
  const seat = (i: number) => names[i] ?? `Seat ${i + 1}`;
  switch (e.type) {
    case "session-created":
      return `Session created with ${e.seats.length} seats`;
    case "seat-claimed":
      return `${seat(e.seatIndex)} claimed by ${e.displayName}`;
    case "seat-policy-set":
      return `${seat(e.seatIndex)} now played by ${e.policy ? `the computer (${e.policy.kind})` : "a person"}`;
    case "round-opened":
      return `Round ${e.round} opened${e.deadline === null ? " (no clock)" : ""}`;
    case "move-sealed":
      return `${seat(e.seatIndex)} sealed a move in round ${e.round}${e.by === "computer" ? " (computer)" : ""}`;
    case "round-resolved":
      return `Round ${e.round} revealed (${e.reason === "all-sealed" ? "all sealed" : e.reason === "clock" ? "clock ran out" : "closed by the facilitator"})`;
    case "shock-applied":
      return `Shock: ${e.changes.length} change${e.changes.length === 1 ? "" : "s"} to the contest`;
    case "paused":
      return "Paused";
    case "resumed":
      return "Resumed";
    case "round-noted":
      return e.text ? `Note on round ${e.round}: ${e.text}` : `Note on round ${e.round} removed`;
    case "session-ended":
      return e.reason === "rounds-complete"
        ? "Session ended: all rounds played"
        : "Session ended by the facilitator";
  }
}
