import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import type { SessionEvent } from "@contend/protocol";
import {
  newJoinCode,
  newKey,
  type CreateSessionInput,
  type Database,
  type NewEvent,
} from "../src/index";

let counter = 0;

const SCENARIO = {
  title: "Kiosk lease",
  prize: 100,
  csf: { kind: "ratio", decisiveness: 1 },
  rivals: [
    { name: "North Bakery", cost: 1 },
    { name: "Harbour Bakery", cost: 1.5 },
  ],
};

/** An invented two-seat session: two bakeries bidding for a station kiosk lease. */
export function sessionInput(overrides: Partial<CreateSessionInput> = {}) {
  counter += 1;
  const facilitatorKey = newKey();
  const seatKeys = [newKey(), newKey()];
  const input: CreateSessionInput = {
    id: `session-${counter}-${Math.random().toString(36).slice(2, 8)}`,
    joinCode: newJoinCode(),
    title: "Kiosk lease",
    scenario: SCENARIO,
    seats: [
      { index: 0, name: "North Bakery", kind: "human" },
      { index: 1, name: "Harbour Bakery", kind: "computer" },
    ],
    keys: [
      { role: "facilitator", seatIndex: null, plaintext: facilitatorKey },
      { role: "seat", seatIndex: 0, plaintext: seatKeys[0]! },
      { role: "seat", seatIndex: 1, plaintext: seatKeys[1]! },
    ],
    firstEvent: created(1_700_000_000_000),
    ...overrides,
  };
  return { input, facilitatorKey, seatKeys };
}

// Events as the server writes them: events.list parses each with the protocol's schema.

/** session-created of the kiosk-lease session (its seats, seed 42) */
export function created(at: number): NewEvent {
  const seats = [
    { index: 0, name: "North Bakery", kind: "human", policy: null },
    { index: 1, name: "Harbour Bakery", kind: "computer", policy: null },
  ];
  return {
    type: "session-created",
    at,
    payload: { sessionId: "kiosk", scenario: SCENARIO, seats, seed: 42 },
  };
}

/** A round note: the plainest event, whose text labels it in a test. */
export function note(at: number, text: string): NewEvent {
  return { type: "round-noted", at, payload: { round: 1, text } };
}

/** The label of a logged event: a note's text, else its type. */
export function label(event: SessionEvent): string {
  return event.type === "round-noted" ? event.text : event.type;
}

export function opened(at: number, round = 1): NewEvent {
  return {
    type: "round-opened",
    at,
    payload: { round, scenario: SCENARIO, seatIndices: [0, 1], deadline: null },
  };
}

export function sealed(at: number, seatIndex: number, effort: number): NewEvent {
  const move = { round: 1, seatIndex, effort, clientMoveId: `m-${at}`, by: "seat" };
  return { type: "move-sealed", at, payload: move };
}

export function claimed(at: number, seatIndex: number, displayName: string): NewEvent {
  return { type: "seat-claimed", at, payload: { seatIndex, displayName } };
}

/** round-resolved of round 1 whose shares are the given numbers (the other arrays are 0) */
export function resolved(at: number, shares: number[] = [0.5, 0.5]): NewEvent {
  const zeros = shares.map(() => 0);
  const equilibrium = {
    kind: "pure",
    efforts: zeros,
    shares,
    payoffs: zeros,
    totalEffort: 0,
    dissipation: 0,
    active: shares.map(() => true),
    nashGap: 0,
    method: "fixture",
  };
  const payload = {
    round: 1,
    reason: "facilitator",
    efforts: zeros,
    defaulted: shares.map(() => false),
    shares,
    winner: null,
    drawSeed: null,
    payoffs: zeros,
    expectedPayoffs: zeros,
    totals: zeros,
    bestResponses: zeros,
    regrets: zeros,
    equilibrium,
    nashGap: 0,
    dissipation: 0,
  };
  return { type: "round-resolved", at, payload };
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
