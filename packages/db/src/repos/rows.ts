import type { Prisma } from "../generated/prisma/client";
import type { SeatKind, SeatRecord, StoredEvent } from "../types";

/** Prisma's JSON input type; callers hand in plain data (see types.ts). */
export function json(value: unknown): Prisma.InputJsonValue {
  return value as Prisma.InputJsonValue;
}

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

export function storedEvent(row: {
  seq: number;
  type: string;
  at: Date;
  payload: unknown;
}): StoredEvent {
  return { seq: row.seq, type: row.type, at: row.at.getTime(), payload: row.payload };
}

/**
 * A unique or primary-key clash. Prisma reports it as P2002 with @prisma/adapter-pg; the
 * PGlite adapter (built against older driver-adapter-utils) raises its own DriverAdapterError
 * that Prisma 6.19 passes through unmapped, carrying PostgreSQL's SQLSTATE 23505 in `cause`.
 */
export function isUniqueViolation(error: unknown): boolean {
  if (typeof error !== "object" || error === null) return false;
  const { code, cause } = error as { code?: unknown; cause?: { code?: unknown } };
  return code === "P2002" || cause?.code === "23505";
}
