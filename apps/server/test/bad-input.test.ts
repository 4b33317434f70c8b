import { describe, expect, it } from "vitest";
import { mulberry32 } from "@contend/solver";
import type { Rng } from "@contend/solver";
import { ERROR_CODES } from "@contend/protocol";
import type { Ack } from "@contend/protocol";
import { createApplication } from "../src/app";
import {
  command,
  createSessionOverHttp,
  eventLog,
  expectOk,
  FLOOD_LIMITS,
  hello,
  request,
  serverForFile,
} from "./helpers";
import type { Client } from "./helpers";
import { printShops } from "./fixtures";

// generous limits, so that the flood reaches validation
const file = serverForFile({ limits: FLOOD_LIMITS });
const client = file.client;

/** emit without the typed event map, as a hostile client would */
function rawEmit(socket: Client, event: string, payload: unknown) {
  (socket as unknown as { emit(event: string, payload: unknown): void }).emit(event, payload);
}

/**
 * Resolves once the server has dealt with everything sent before on this connection: it answers
 * a probe sent after it (a connection's packets are handled in order), or it closes the
 * connection. Event-driven: no waiting for time.
 */
function handled(socket: Client): Promise<void> {
  const closed = new Promise<void>((resolve) => socket.once("disconnect", () => resolve()));
  const answered = request(socket, "command", { type: "pause" }).then(
    () => undefined,
    () => undefined,
  );
  return Promise.race([closed, answered]);
}

function pick<T>(rng: Rng, items: readonly T[]): T {
  return items[Math.floor(rng() * items.length)]!;
}

/** Any JSON-ish value: wrong types, NaN and infinities (sent as null), huge numbers, deep nesting. */
function garbage(rng: Rng, depth = 0): unknown {
  const roll = rng();
  if (depth > 4 || roll < 0.35) {
    return pick(rng, [
      null,
      true,
      false,
      0,
      -1,
      NaN,
      Infinity,
      -Infinity,
      1e308,
      -1e308,
      Number.MAX_SAFE_INTEGER + 2,
      5e-324,
      "",
      "hello",
      "command",
      "__proto__",
      "x".repeat(Math.floor(rng() * 5000)),
      String(rng()),
      rng() * 1e15,
    ]);
  }
  if (roll < 0.55)
    return Array.from({ length: Math.floor(rng() * 5) }, () => garbage(rng, depth + 1));
  const keys = [
    "type",
    "protocol",
    "credentials",
    "role",
    "sessionId",
    "key",
    "effort",
    "changes",
    "seatIndex",
    "constructor",
    "__proto__",
    "x",
  ];
  const obj: Record<string, unknown> = {};
  for (let i = 0; i < 1 + Math.floor(rng() * 4); i++)
    obj[pick(rng, keys)] = garbage(rng, depth + 1);
  return obj;
}

const BAD_EFFORTS = [-1, -0.25, NaN, Infinity, 1e308, 1e13, 0.3, 12.1, "5", null, true, [], {}];

/** Commands that are certainly refused for this role in this state (round 1 open). */
function refusedCommand(
  rng: Rng,
  role: "facilitator" | "seat" | "spectator" | "guest" | "none",
): unknown {
  const roll = rng();
  if (roll < 0.3) return garbage(rng);
  if (role === "facilitator") {
    return pick(rng, [
      { type: "closeRound", extra: 1 },
      { type: "pause", now: true },
      { type: "openRound" }, // a round is already open
      { type: "openRound", durationSeconds: 1 },
      { type: "openRound", durationSeconds: NaN },
      { type: "applyShock", changes: [] },
      { type: "applyShock", changes: [{ target: "prize", value: 150 }] }, // not between rounds
      { type: "applyShock", changes: [{ target: "rival", index: 0, field: "cost", value: "1" }] },
      { type: "setSeatPolicy", seatIndex: "0", policy: null },
      { type: "setSeatPolicy", seatIndex: 0, policy: { kind: "psychic" } },
      { type: "sealMove", clientMoveId: "f", effort: 1 },
      { type: "claimSeat", seatIndex: 1, displayName: "F" },
      { type: "resume" }, // not paused
      { type: "endSession", reason: "now" },
    ]);
  }
  if (role === "seat") {
    return pick(rng, [
      { type: "sealMove", clientMoveId: "s".repeat(65), effort: 1 },
      { type: "sealMove", clientMoveId: "", effort: 1 },
      { type: "sealMove", clientMoveId: 7, effort: 1 },
      { type: "sealMove", clientMoveId: "ok", effort: pick(rng, BAD_EFFORTS) },
      { type: "sealMove", clientMoveId: "ok", effort: 1, round: 2 },
      { type: "sealMove", clientMoveId: "ok", effort: 1, seatIndex: 1 },
      { type: "closeRound" },
      { type: "pause" },
      { type: "endSession" },
      { type: "claimSeat", seatIndex: 1, displayName: "S" },
      { type: "openRound" },
    ]);
  }
  if (role === "guest") {
    return pick(rng, [
      { type: "claimSeat", seatIndex: 99, displayName: "G" },
      { type: "claimSeat", seatIndex: -1, displayName: "G" },
      { type: "claimSeat", seatIndex: 0, displayName: "G" }, // taken
      { type: "claimSeat", seatIndex: 1, displayName: "" },
      { type: "claimSeat", seatIndex: 1, displayName: "g".repeat(41) },
      { type: "claimSeat", seatIndex: 1.5, displayName: "G" },
      { type: "sealMove", clientMoveId: "g", effort: 1 },
      { type: "closeRound" },
    ]);
  }
  // spectators and sockets that never said hello may send nothing at all
  return pick(rng, [
    { type: "closeRound" },
    { type: "pause" },
    { type: "sealMove", clientMoveId: "x", effort: 1 },
  ]);
}

describe("bad input", () => {
  it("thousands of random and malformed messages leave the server up and the event log unchanged", async () => {
    const a = await createSessionOverHttp(file.server.url, printShops({ rounds: 2 }));
    const b = await createSessionOverHttp(file.server.url, printShops({ rounds: 2 }));
    const fac = await client();
    const seat = await client();
    const screen = await client();
    const guest = await client();
    const stranger = await client();
    expectOk(await hello(fac, { role: "facilitator", sessionId: a.id, key: a.facilitatorKey }));
    expectOk(await hello(seat, { role: "seat", sessionId: a.id, key: a.seats[0]!.key }));
    expectOk(await hello(screen, { role: "spectator", sessionId: a.id, key: a.spectatorKey }));
    expectOk(await hello(guest, { role: "guest", joinCode: a.joinCode }));
    expectOk(await command(fac, { type: "openRound" }));
    expectOk(await command(seat, { type: "sealMove", clientMoveId: "real", effort: 10 }));
    const logA = await eventLog(file.server.db, a.id);
    const logB = await eventLog(file.server.db, b.id);

    const badHellos = [
      { protocol: 1, credentials: { role: "facilitator", sessionId: a.id, key: a.facilitatorKey } },
      { protocol: 2, credentials: { role: "facilitator", sessionId: a.id, key: a.spectatorKey } },
      { protocol: 2, credentials: { role: "facilitator", sessionId: b.id, key: a.facilitatorKey } },
      { protocol: 2, credentials: { role: "seat", sessionId: b.id, key: a.seats[1]!.key } },
      { protocol: 2, credentials: { role: "seat", sessionId: a.id, key: "k".repeat(129) } },
      { protocol: 2, credentials: { role: "guest", joinCode: "ZZZZZZ" } },
      { protocol: 2, credentials: { role: "admin", sessionId: a.id, key: a.facilitatorKey } },
      {
        protocol: 2,
        credentials: { role: "spectator", sessionId: "s".repeat(65), key: a.spectatorKey },
      },
      { protocol: "1", credentials: { role: "spectator", sessionId: a.id, key: a.spectatorKey } },
    ];

    const rng = mulberry32(20260105);
    const senders: [Client, "facilitator" | "seat" | "spectator" | "guest" | "none"][] = [
      [fac, "facilitator"],
      [seat, "seat"],
      [screen, "spectator"],
      [guest, "guest"],
      [stranger, "none"],
    ];
    const acks: Promise<Ack<unknown>>[] = [];
    let sent = 0;
    for (let batch = 0; batch < 15; batch++) {
      for (let i = 0; i < 200; i++) {
        const [socket, role] = pick(rng, senders);
        const roll = rng();
        sent++;
        if (roll < 0.1) {
          // unknown event names, with and without an ack
          const name = pick(rng, [
            "hi",
            "view",
            "Command",
            "helo",
            "sealMove",
            "__proto__",
            "toString",
          ]);
          if (rng() < 0.5) acks.push(request(socket, name, garbage(rng)));
          else rawEmit(socket, name, garbage(rng));
        } else if (roll < 0.25) {
          // bad hellos only from the stranger, whose identity cannot get any worse
          acks.push(request(stranger, "hello", rng() < 0.6 ? pick(rng, badHellos) : garbage(rng)));
        } else if (roll < 0.3) {
          rawEmit(socket, "command", refusedCommand(rng, role)); // no ack asked for
        } else {
          acks.push(request(socket, "command", refusedCommand(rng, role)));
        }
      }
      // let the server catch up between batches
      await Promise.all(acks.slice(-200));
    }
    const results = await Promise.all(acks);
    expect(sent).toBe(3000);
    expect(results.length).toBeGreaterThan(2000);
    const codes = new Map<string, number>();
    for (const r of results) {
      expect(r.ok).toBe(false);
      if (r.ok) continue;
      expect(ERROR_CODES).toContain(r.code);
      expect(r.code).not.toBe("internal");
      expect(r.message).not.toMatch(/\n\s+at |TypeError|ReferenceError|prisma/i);
      codes.set(r.code, (codes.get(r.code) ?? 0) + 1);
    }
    for (const code of [
      "bad-request",
      "forbidden",
      "unauthorized",
      "wrong-state",
      "version-mismatch",
    ]) {
      expect(codes.get(code) ?? 0, code).toBeGreaterThan(0);
    }

    // Raw frames a well-behaved client library would never send: reserved event names,
    // broken packets. The server answers or drops that connection and carries on.
    const rawFrames = [
      '2["disconnect","x"]',
      '2["connect_error",{}]',
      '2["hello"]',
      "2[]",
      '2{"type":"command"}',
      '2["command",{"type":"closeRound"}',
      '21["command",{"type":"pause"}]',
      "2[1,2,3]",
      "9 not a packet",
      '5-["command",{"_placeholder":true,"num":0}]',
    ];
    for (const frame of rawFrames) {
      const raw = await client();
      const engine = (raw.io as unknown as { engine: { send(data: string): void } }).engine;
      engine.send(frame);
      await handled(raw);
      raw.disconnect();
    }

    // Oversized frames close that connection; the server itself stays up.
    const big = await client();
    const closed = new Promise<string>((resolve) =>
      big.once("disconnect", (reason) => resolve(reason)),
    );
    rawEmit(big, "command", {
      type: "sealMove",
      clientMoveId: "x".repeat(70 * 1024),
      effort: 1,
    } as never);
    expect(await closed).toMatch(/transport close|transport error|io server disconnect/);

    expect(await eventLog(file.server.db, a.id)).toEqual(logA);
    expect(await eventLog(file.server.db, b.id)).toEqual(logB);
    const health = await fetch(`${file.server.url}/api/health`);
    expect(health.status).toBe(200);
    // and the session still works for well-formed commands
    const seat1 = await client();
    expectOk(await hello(seat1, { role: "seat", sessionId: a.id, key: a.seats[1]!.key }));
    const ok = await command(seat1, { type: "sealMove", clientMoveId: "after", effort: 11.25 });
    expect(ok.ok).toBe(true);
    expect((await eventLog(file.server.db, a.id)).length).toBeGreaterThan(logA.length);
  });

  it("a flood from one connection is answered rate-limited past the burst (token bucket 20/s, burst 40)", async () => {
    // a second application on the same database, with the default limits
    const app = createApplication({ db: file.server.db });
    const { port } = await app.listen(0, "127.0.0.1");
    try {
      const socket = await client(`http://127.0.0.1:${port}`);
      const acks = await Promise.all(
        Array.from({ length: 100 }, () => request(socket, "command", { type: "pause" })),
      );
      const limited = acks.filter((r) => !r.ok && r.code === "rate-limited").length;
      const answered = acks.filter((r) => !r.ok && r.code === "unauthorized").length;
      expect(limited + answered).toBe(100);
      // 40 from the burst plus what refilled at 20/s while the 100 were in flight
      expect(answered).toBeGreaterThanOrEqual(40);
      expect(answered).toBeLessThan(60);
      socket.disconnect();
    } finally {
      await app.close();
    }
  });

  it("hello with another protocol version is refused with version-mismatch", async () => {
    const socket = await client();
    const res = await request(socket, "hello", {
      protocol: 99,
      credentials: { role: "guest", joinCode: "ABCDEF" },
    });
    expect(res).toMatchObject({ ok: false, code: "version-mismatch" });
  });
});
