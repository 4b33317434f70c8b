/**
 * R41 for every read of a whole session over REST (export, summary): a session with private
 * numbers is readable once it has ended, never before, whoever asks.
 */
import type { ServerResponse } from "node:http";
import type { SessionEvent } from "@contend/protocol";
import { fold, truthSealed } from "@contend/session";
import { sendError } from "./io";

/** Answers 409 and returns true while the session's private numbers are sealed. */
export function refusedWhileSealed(
  res: ServerResponse,
  events: readonly SessionEvent[],
  what: "export" | "summary",
): boolean {
  const state = fold(events);
  if (state.status === "empty" || !truthSealed(state)) return false;
  sendError(
    res,
    409,
    "wrong-state",
    `this session has private costs or values: its ${what} is available once it has ended`,
  );
  return true;
}
