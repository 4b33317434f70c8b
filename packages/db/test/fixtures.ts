import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { newJoinCode, newKey, type CreateSessionInput, type Database } from "../src/index";

let counter = 0;

/** An invented two-seat session: two bakeries bidding for a station kiosk lease. */
export function sessionInput(overrides: Partial<CreateSessionInput> = {}) {
  counter += 1;
  const facilitatorKey = newKey();
  const seatKeys = [newKey(), newKey()];
  const input: CreateSessionInput = {
    id: `session-${counter}-${Math.random().toString(36).slice(2, 8)}`,
    joinCode: newJoinCode(),
    title: "Kiosk lease",
    scenario: {
      title: "Kiosk lease",
      prize: 100,
      csf: { kind: "ratio", decisiveness: 1 },
      rivals: [
        { name: "North Bakery", cost: 1 },
        { name: "Harbour Bakery", cost: 1.5 },
      ],
    },
    seats: [
      { index: 0, name: "North Bakery", kind: "human" },
      { index: 1, name: "Harbour Bakery", kind: "computer" },
    ],
    keys: [
      { role: "facilitator", seatIndex: null, plaintext: facilitatorKey },
      { role: "seat", seatIndex: 0, plaintext: seatKeys[0]! },
      { role: "seat", seatIndex: 1, plaintext: seatKeys[1]! },
    ],
    firstEvent: { type: "session-created", at: 1_700_000_000_000, payload: { seed: 42 } },
    ...overrides,
  };
  return { input, facilitatorKey, seatKeys };
}

export function event(type: string, at: number, payload: unknown = {}) {
  return { type, at, payload };
}

/** The seats of a session, in index order (none when the session does not exist). */
export async function seatsOf(db: Database, sessionId: string) {
  return (await db.sessions.get(sessionId))?.seats ?? [];
}

/**
 * Marks a seat claimed directly in its table, with no event: the state a test needs before it
 * checks that a later claim (through events.append's claimSeats) is refused.
 */
export async function takeSeat(db: Database, sessionId: string, index: number, name: string) {
  const { count } = await db.prisma.seat.updateMany({
    where: { sessionId, index, claimedAt: null },
    data: { displayName: name, claimedAt: new Date() },
  });
  if (count !== 1) throw new Error(`seat ${index} of ${sessionId} was not free`);
}

export function tempDir(prefix = "contend-db-"): { dir: string; dispose(): void } {
  const dir = mkdtempSync(path.join(tmpdir(), prefix));
  return { dir, dispose: () => rmSync(dir, { recursive: true, force: true }) };
}
