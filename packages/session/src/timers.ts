/** Helpers for the server's round clock. */
import type { SessionState } from "./state";

/** Epoch ms at which the open round should close for the clock; null when nothing is ticking. */
export function deadline(state: SessionState): number | null {
  if (state.status !== "open" || state.paused) return null;
  return state.open.deadline;
}

/** True when a round is open, not paused, and every seat playing it has a sealed move. */
export function allSealed(state: SessionState): boolean {
  if (state.status !== "open" || state.paused) return false;
  const { moves, seatIndices } = state.open;
  return seatIndices.every((i) => (moves[i] ?? null) !== null);
}
