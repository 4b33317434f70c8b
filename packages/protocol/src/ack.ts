/** Acknowledgements: every hello and command gets exactly one, after its events are committed. */
import type { ErrorCode } from "./result";
import type { Role } from "./hello";
import type { RoleView } from "./view";

export interface AckError {
  ok: false;
  code: ErrorCode;
  /** human-readable, names the offending field or rule; never internal error text */
  message: string;
  /** dotted path of the offending field, for bad-request */
  path?: string;
}

export type Ack<T> = { ok: true; data: T } | AckError;

export interface HelloAckData {
  protocol: number;
  role: Role;
  /** null for guests (they have not picked a session seat yet) */
  sessionId: string | null;
  seatIndex?: number;
  /** seq of the last committed event the view reflects */
  seq: number;
  view: RoleView;
}

/** Data of a sealMove ack; a repeated clientMoveId gets the original data again. */
export interface SealMoveAckData {
  seq: number;
  round: number;
  seatIndex: number;
  clientMoveId: string;
  effort: number;
}

/** Data of a claimSeat ack: say hello again as this seat with seatKey. */
export interface ClaimSeatAckData {
  seq: number;
  sessionId: string;
  seatIndex: number;
  seatKey: string;
}

export interface BasicAckData {
  seq: number;
}

export type CommandAckData = SealMoveAckData | ClaimSeatAckData | BasicAckData;

export function ackError(code: ErrorCode, message: string, path?: string): AckError {
  return path === undefined ? { ok: false, code, message } : { ok: false, code, message, path };
}
