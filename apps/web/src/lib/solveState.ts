/**
 * The state of an answer computed in a background worker for an edited input: while a new
 * answer is being computed the last one stays on screen (marked as out of date) so the page
 * never goes blank between edits.
 */
export type SolveState<T> =
  | { status: "idle" }
  | { status: "solving"; previous: T | null }
  | { status: "done"; value: T; ms: number }
  | { status: "error"; message: string };

/** The answer to show: the finished one, or the last one while a newer input is being solved. */
export function shownAnswer<T>(s: SolveState<T>): T | null {
  if (s.status === "done") return s.value;
  if (s.status === "solving") return s.previous;
  return null;
}

/** The state as a new solve starts: it keeps the answer on screen as `previous`. */
export function startSolving<T>(s: SolveState<T>): SolveState<T> {
  return { status: "solving", previous: shownAnswer(s) };
}
