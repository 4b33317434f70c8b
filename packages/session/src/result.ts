import type { ErrorCode, EventBody } from "@contend/protocol";

/** decide() refused the command: nothing happened. */
export interface Rejection {
  ok: false;
  code: ErrorCode;
  message: string;
  path?: string;
}

/** Ack data the engine knows; the server adds `seq` (and the new key for claims and issueLinks). */
export type DecideData =
  | {
      kind: "sealMove";
      round: number;
      seatIndex: number;
      clientMoveId: string;
      effort: number;
      spend: number;
      /** sessions with fronts: money on each front */
      frontSpends?: number[];
    }
  | { kind: "claimSeat"; seatIndex: number }
  /** seatIndex null: a spectator key */
  | { kind: "issueLinks"; seatIndex: number | null }
  | { kind: "none" };

export type Decision = { ok: true; events: EventBody[]; data: DecideData } | Rejection;

export function reject(code: ErrorCode, message: string, path?: string): Rejection {
  return path === undefined ? { ok: false, code, message } : { ok: false, code, message, path };
}

/** R5: while paused, `what` waits. */
export function notPaused(state: { paused: boolean }, what: string): Decision | null {
  return state.paused
    ? reject("wrong-state", `R5: the session is paused; resume before ${what}`)
    : null;
}

export function accept(events: EventBody[], data: DecideData = { kind: "none" }): Decision {
  return { ok: true, events, data };
}
