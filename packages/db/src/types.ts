import type { Role as ProtocolRole, SeatKind } from "@contend/protocol";
import type { PrismaClient } from "./generated/prisma/client";

export type Db = PrismaClient;
/** Roles a key can grant: the protocol's roles but "guest", who holds no key. */
export type Role = Exclude<ProtocolRole, "guest">;
export type { SeatKind };

/** What an append of events reports; expected refusals are values, not exceptions. */
export type AppendResult =
  | { ok: true; seqs: number[] }
  | { ok: false; code: "conflict"; lastSeq: number }
  | { ok: false; code: "not-found" }
  | { ok: false; code: "seat-claimed"; seatIndex: number };

/**
 * JSON columns (scenario, payload, body) take plain data: anything JSON.stringify keeps.
 * A session's scenario comes back as parsed JSON (`unknown`), for the caller to validate;
 * events come back parsed by the protocol's event schema (`events.list`, `eventFromRow`).
 */
export interface NewEvent {
  type: string;
  /** epoch milliseconds */
  at: number;
  payload: unknown;
  /** the payload's text as `jsonText` writes it, when the caller has it already */
  payloadJson?: string;
}

export interface SeatInput {
  index: number;
  name: string;
  kind: SeatKind;
  displayName?: string | null;
}

export interface SeatRecord {
  index: number;
  name: string;
  kind: SeatKind;
  displayName: string | null;
  claimedAt: Date | null;
}

export interface KeyInput {
  role: Role;
  seatIndex: number | null;
  plaintext: string;
}

export interface SessionSummary {
  id: string;
  joinCode: string;
  title: string;
  status: string;
  lastSeq: number;
  createdAt: Date;
  /** last play activity (events); library edits leave it alone */
  updatedAt: Date;
  /** library labels, in the protocol's normal form */
  tags: string[];
  archivedAt: Date | null;
}

/** A session as the library lists it: its summary, when it ended and how many rounds resolved. */
export interface LibraryEntry extends SessionSummary {
  endedAt: Date | null;
  rounds: number;
}

export interface SessionRecord extends SessionSummary {
  scenario: unknown;
  seats: SeatRecord[];
}
