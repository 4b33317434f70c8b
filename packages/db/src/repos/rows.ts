import { parseEvent, type SessionEvent } from "@contend/protocol";
import { Prisma } from "../generated/prisma/client";
import type { SeatKind, SeatRecord } from "../types";

/**
 * JSON text of plain data, for a `${text}::jsonb` raw parameter. Prisma's own Json input
 * rounds doubles to about 16 significant digits (0.1 + 0.2 is stored as 0.3, Number.MAX_VALUE
 * as null; prisma/prisma#11096 and related), while stored results must replay bit for bit.
 * PostgreSQL keeps the digits JSON.stringify writes (the shortest that round-trip), and
 * Prisma reads jsonb back exactly. NaN and Infinity have no JSON form: passing one is a bug.
 */
export function jsonText(value: unknown): string {
  const text = JSON.stringify(value, (key, v: unknown) => {
    if (typeof v === "number" && !Number.isFinite(v)) {
      throw new Error(`cannot store ${v} at "${key}" as JSON`);
    }
    return v;
  });
  if (text === undefined) throw new Error("cannot store undefined as JSON");
  return text;
}

export function jsonb(value: unknown): Prisma.Sql {
  return Prisma.sql`${jsonText(value)}::jsonb`;
}

/** The columns of a session's summary (SessionSummary): lists, the library and its entries. */
export const summarySelect = {
  id: true,
  joinCode: true,
  title: true,
  status: true,
  lastSeq: true,
  createdAt: true,
  updatedAt: true,
  tags: true,
  archivedAt: true,
} as const;

export function seatRecord(row: {
  index: number;
  name: string;
  kind: string;
  displayName: string | null;
  claimedAt: Date | null;
}): SeatRecord {
  return {
    index: row.index,
    name: row.name,
    kind: row.kind as SeatKind,
    displayName: row.displayName,
    claimedAt: row.claimedAt,
  };
}

/** An Event row as read: `at` in epoch ms, the payload as parsed JSON. */
export interface EventRow {
  seq: number;
  type: string;
  at: number;
  payload: unknown;
}

/**
 * An Event row -> the protocol's event, checked by its schema: every reader gets a typed event
 * or an exception. The log is written only by the server, so a row that does not parse is a bug
 * (or a log from a version this one cannot read), never an expected failure.
 */
export function eventFromRow(row: EventRow): SessionEvent {
  const parsed = parseEvent({
    ...(row.payload as object),
    type: row.type,
    seq: row.seq,
    at: row.at,
  });
  if (!parsed.ok) {
    throw new Error(`stored event ${row.seq} (${row.type}) does not parse: ${parsed.message}`);
  }
  return parsed.value;
}

/**
 * A unique or primary-key clash (SQLSTATE 23505), wherever the stack put it: Prisma's P2002
 * for typed writes through @prisma/adapter-pg; P2010 with the driver error in `meta` for raw
 * statements; and for typed writes through the PGlite adapter (built against older
 * driver-adapter-utils) its own DriverAdapterError, unmapped, with the SQLSTATE in `cause`.
 */
export function isUniqueViolation(error: unknown): boolean {
  if (typeof error !== "object" || error === null) return false;
  type Cause = { code?: unknown; originalCode?: unknown };
  const e = error as {
    code?: unknown;
    cause?: Cause;
    meta?: { driverAdapterError?: { cause?: Cause } };
  };
  const driver = e.meta?.driverAdapterError?.cause;
  return (
    e.code === "P2002" ||
    e.cause?.code === "23505" ||
    driver?.code === "23505" ||
    driver?.originalCode === "23505"
  );
}
