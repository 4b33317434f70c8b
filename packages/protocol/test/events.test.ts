import { describe, expect, it } from "vitest";
import {
  ackSchema,
  basicAckDataSchema,
  claimSeatAckDataSchema,
  issueLinksAckDataSchema,
  sealMoveAckDataSchema,
  createSessionResponseSchema,
  errorBodySchema,
  eventLogSchema,
  healthSchema,
  parseEvent,
  parseWith,
  roleViewSchema,
  sessionListItemSchema,
  viewMessageSchema,
} from "../src/index";
import { clone, kiosk } from "./fixtures";

const equilibrium = {
  kind: "pure",
  efforts: [20, 10, 5],
  shares: [0.5, 0.3, 0.2],
  payoffs: [30, 20, 10],
  totalEffort: 35,
  dissipation: 0.45,
  active: [true, true, true],
  nashGap: 0,
  method: "share-function",
};

const resolved = {
  seq: 7,
  at: 1_700_000_000_000,
  type: "round-resolved",
  round: 1,
  reason: "clock",
  efforts: [20, 10, 5],
  defaulted: [false, false, true],
  shares: [0.5, 0.3, 0.2],
  winner: null,
  drawSeed: null,
  payoffs: [30, 20, 10],
  expectedPayoffs: [30, 20, 10],
  totals: [30, 20, 10],
  bestResponses: [21, 11, 6],
  regrets: [0.1, 0.2, 0.3],
  equilibrium,
  nashGap: 0.3,
  dissipation: 0.45,
};

describe("parseEvent", () => {
  it("parseEvent(a session-created event) accepts it and fills session defaults", () => {
    const r = parseEvent({
      seq: 1,
      at: 0,
      type: "session-created",
      sessionId: "s1",
      scenario: clone(kiosk),
      seats: [
        { index: 0, name: "North Bakery", kind: "human", policy: null },
        { index: 1, name: "Corner Ovens", kind: "computer", policy: { kind: "equilibrium" } },
        { index: 2, name: "Rye & Crumb", kind: "human", policy: null },
      ],
      seed: 42,
    });
    expect(r.ok).toBe(true);
    if (r.ok && r.value.type === "session-created") expect(r.value.scenario.session.rounds).toBe(5);
  });

  it("parseEvent(a round-resolved event) accepts it", () => {
    expect(parseEvent(clone(resolved)).ok).toBe(true);
  });

  it("parseEvent(a stored result that is not finite) is refused", () => {
    const bad = { ...clone(resolved), nashGap: Infinity };
    expect(parseEvent(bad)).toMatchObject({ ok: false, path: "nashGap" });
  });

  it("parseEvent(missing seq, unknown type) is refused", () => {
    const { seq: _seq, ...noSeq } = clone(resolved);
    expect(parseEvent(noSeq)).toMatchObject({ ok: false, path: "seq" });
    expect(parseEvent({ seq: 1, at: 0, type: "round-skipped" })).toMatchObject({
      ok: false,
      path: "type",
    });
  });

  it("eventLogSchema(a list of events) parses each", () => {
    const log = [
      { seq: 2, at: 5, type: "seat-claimed", seatIndex: 0, displayName: "Ana" },
      { seq: 3, at: 6, type: "paused", remainingMs: null },
      { seq: 4, at: 7, type: "resumed", deadline: null },
      { seq: 5, at: 8, type: "session-ended", reason: "facilitator" },
    ];
    expect(eventLogSchema.safeParse(log).success).toBe(true);
  });
});

describe("view and REST schemas", () => {
  const view = {
    role: "spectator",
    sessionId: "s1",
    title: "Station kiosk lease",
    status: "review",
    paused: false,
    remainingMs: null,
    endedReason: null,
    settings: {
      outcome: "shares",
      effortStep: 1,
      rounds: 5,
      clockSeconds: null,
      missingMove: "zero",
      computer: {},
    },
    round: 1,
    roundsTotal: 5,
    deadline: null,
    scenario: clone(kiosk),
    roundSeats: null,
    seats: [
      {
        index: 0,
        name: "North Bakery",
        kind: "human",
        claimed: true,
        displayName: "Ana",
        sealed: false,
        active: true,
      },
    ],
    rounds: [
      {
        ...clone(resolved),
        scenario: clone(kiosk),
        seatIndices: [0, 1, 2],
        spends: [20, 10, 10],
        bestResponseSpends: [21, 11, 12],
        equilibriumSpends: [20, 10, null],
      },
    ],
    totals: [30, 20, 10],
    shocks: [],
  };

  it("roleViewSchema(a spectator view) accepts it", () => {
    const r = parseWith(roleViewSchema, view);
    expect(r.ok).toBe(true);
    expect(viewMessageSchema.safeParse({ seq: 7, view }).success).toBe(true);
  });

  it("roleViewSchema(a facilitator view with its join code) accepts it; a numeric code is refused", () => {
    const facilitator = { ...view, role: "facilitator", joinCode: "KIOSK7" };
    expect(parseWith(roleViewSchema, facilitator)).toMatchObject({ ok: true });
    expect(parseWith(roleViewSchema, { ...facilitator, joinCode: 7 })).toMatchObject({
      ok: false,
      path: "joinCode",
    });
  });

  it("roleViewSchema(an unknown status) is refused", () => {
    expect(parseWith(roleViewSchema, { ...view, status: "running" })).toMatchObject({
      ok: false,
      path: "status",
    });
  });

  it("REST schemas accept their documented examples", () => {
    expect(
      createSessionResponseSchema.safeParse({
        id: "s1",
        joinCode: "KIOSK7",
        facilitatorKey: "f",
        spectatorKey: "p",
        seats: [
          { index: 0, name: "North Bakery", kind: "human", key: "k", link: "/seat/s1?key=k" },
        ],
        links: {
          facilitator: "/facilitate/s1?key=f",
          spectator: "/screen/s1?key=p",
          join: "/join?code=KIOSK7",
        },
      }).success,
    ).toBe(true);
    expect(
      errorBodySchema.safeParse({
        error: { code: "bad-request", path: "prize", message: "prize: must be > 0" },
      }).success,
    ).toBe(true);
    expect(
      errorBodySchema.safeParse({ error: { code: "oops", path: "", message: "" } }).success,
    ).toBe(false);
    expect(healthSchema.safeParse({ ok: true, version: "0.1.0", db: "pglite" }).success).toBe(true);
    expect(
      sessionListItemSchema.safeParse({
        id: "s1",
        title: "t",
        status: "lobby",
        createdAt: "2026-01-01T00:00:00.000Z",
        updatedAt: "2026-01-01T00:00:00.000Z",
        rounds: 0,
        tags: ["q3"],
        archivedAt: null,
        endedAt: "2026-01-01T01:00:00.000Z",
      }).success,
    ).toBe(true);
  });
});

describe("ack schemas", () => {
  it("ackSchema(sealMove data) accepts ok and error acks, refuses unknown codes", () => {
    const seal = ackSchema(sealMoveAckDataSchema);
    expect(
      seal.safeParse({
        ok: true,
        data: { seq: 5, round: 1, seatIndex: 0, clientMoveId: "c1", effort: 3, spend: 6 },
      }).success,
    ).toBe(true);
    expect(
      seal.safeParse({ ok: false, code: "wrong-state", message: "R10: no round is open" }).success,
    ).toBe(true);
    expect(seal.safeParse({ ok: false, code: "nope", message: "" }).success).toBe(false);
    expect(seal.safeParse({ ok: true, data: { seq: 5 } }).success).toBe(false);
    expect(
      ackSchema(claimSeatAckDataSchema).safeParse({
        ok: true,
        data: { seq: 2, sessionId: "s", seatIndex: 1, seatKey: "k" },
      }).success,
    ).toBe(true);
    const links = ackSchema(issueLinksAckDataSchema);
    expect(
      links.safeParse({
        ok: true,
        data: { seq: 4, role: "seat", seatIndex: 2, key: "k", link: "/seat/s?key=k" },
      }).success,
    ).toBe(true);
    expect(
      links.safeParse({
        ok: true,
        data: { seq: 4, role: "spectator", seatIndex: null, key: "k", link: "/screen/s?key=k" },
      }).success,
    ).toBe(true);
    expect(
      links.safeParse({
        ok: true,
        data: { seq: 4, role: "facilitator", seatIndex: null, key: "k", link: "/x" },
      }).success,
    ).toBe(false);
    expect(ackSchema(basicAckDataSchema).safeParse({ ok: true, data: { seq: -1 } }).success).toBe(
      false,
    );
  });
});
